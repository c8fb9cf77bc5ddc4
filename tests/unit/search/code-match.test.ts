// Codes typed loosely: separators and letter suffixes forgiven, digits never.
import { describe, expect, it } from 'vitest';
import { codeGroups, codeMatchQuality, codeWindows, digitKeysOf, digitsOf, resolveCodeGroup } from '@/lib/search/code-match';
import { foldText, piecesOf } from '@/lib/search/tokens';

describe('digitsOf', () => {
  it('joins the runs of digits with dots', () => {
    expect(['dr4120k', 'lderr3', 'c1204', 'a1b22', 'nodisc'].map(digitsOf)).toEqual(['4120', '3', '1204', '1.22', '']);
  });
});

describe('codeMatchQuality', () => {
  it('matches the same code exactly', () => {
    expect(codeMatchQuality('kx44n', 'kx44n')).toBe('exact');
  });
  it('never matches a neighbour whose digits differ', () => {
    expect(codeMatchQuality('kx45n', 'kx44n')).toBeNull();
    expect(codeMatchQuality('dr412', 'dr4120')).toBeNull();
    expect(codeMatchQuality('e21', 'e210')).toBeNull();
  });
  it('lets a region or feature suffix be left off', () => {
    expect(codeMatchQuality('dr4120', 'dr4120k')).toBe('variant');
    expect(codeMatchQuality('dr4120', 'dr4120kxyz')).toBeNull();
  });
  it('finds a code from its digits alone when at least two were typed', () => {
    expect(codeMatchQuality('4120', 'dr4120k')).toBe('variant');
    expect(codeMatchQuality('3', 'lderr3')).toBeNull();
  });
  it('forgives one slip in letters only when the letters run to three or more', () => {
    expect(codeMatchQuality('ldeer3', 'lderr3')).toBe('variant');
    // Two-letter prefixes name different things: E-21 and F-21 are different error codes.
    expect(codeMatchQuality('e21', 'f21')).toBeNull();
    expect(codeMatchQuality('dt4120', 'dr4120')).toBeNull();
  });
});

describe('codeGroups and codeWindows', () => {
  it('groups short pieces around digits, so "KX 44 N" and "DR-4120 K" spell codes', () => {
    const groups = codeGroups(piecesOf('tray kx 44 n wont close'));
    expect(groups).toEqual([{ start: 1, pieces: ['kx', '44', 'n'], tight: [false, false, false] }]);
    expect(codeWindows(groups[0]!)).toEqual(expect.arrayContaining(['kx44n', 'kx44', '44n', '44']));
  });
  it('does not pull long words into a code', () => {
    expect(codeGroups(piecesOf('rewind 4120'))).toEqual([{ start: 1, pieces: ['4120'], tight: [false] }]);
  });
});

describe('resolveCodeGroup', () => {
  const stored = ['kx44n', 'kx45n', 'dr4120', 'dr4120k', 'e21'];
  it('takes the longest window that names a stored code', () => {
    const [group] = codeGroups(piecesOf(foldText('KX 44 N')));
    expect(resolveCodeGroup(group!, stored)).toEqual([{ from: 0, to: 3, typed: 'kx44n', exact: ['kx44n'], variants: [] }]);
  });
  it('offers suffix variants beside the exact code', () => {
    const [group] = codeGroups(piecesOf('dr 4120'));
    expect(resolveCodeGroup(group!, stored)).toEqual([{ from: 0, to: 2, typed: 'dr4120', exact: ['dr4120'], variants: ['dr4120k'] }]);
  });
  it('leaves an unknown code unresolved rather than guessing its neighbour', () => {
    const [group] = codeGroups(piecesOf('kx-46n'));
    expect(resolveCodeGroup(group!, stored)).toEqual([]);
  });
  it('never reads the digits of a dashed code on their own: "E-22" is not "22"', () => {
    const [group] = codeGroups(piecesOf('e-22'));
    expect(resolveCodeGroup(group!, ['kc22d', 'e21'])).toEqual([]);
    expect(codeWindows(group!)).toEqual(['e22']);
  });
  it('leaves trailing words of the group alone', () => {
    const [group] = codeGroups(piecesOf('e-21 on'));
    expect(resolveCodeGroup(group!, stored)).toEqual([{ from: 0, to: 2, typed: 'e21', exact: ['e21'], variants: [] }]);
  });
});

describe('error codes typed with or without their leading zero', () => {
  const stored = ['f07', 'f17', 'f70', 'f7x', 'e05', 'e50', 'e15', 'kx44n'];
  const found = (typed: string) => {
    const [group] = codeGroups(piecesOf(foldText(typed)));
    return group ? resolveCodeGroup(group, stored).flatMap((s) => [...s.exact, ...s.variants]) : [];
  };
  it.each(['F7', 'f-7', 'F 07', 'F-07', 'f07', 'F 7'])('reads %s as F-07 and nothing else', (typed) => {
    expect(found(typed).filter((c) => c.startsWith('f'))).toContain('f07');
    expect(found(typed)).not.toContain('f17');
    expect(found(typed)).not.toContain('f70');
  });
  it.each(['E5', 'e-5', 'E 05', 'E05'])('reads %s as E-05, never E-50 or E-15', (typed) => {
    expect(found(typed)).toContain('e05');
    expect(found(typed)).not.toContain('e50');
    expect(found(typed)).not.toContain('e15');
  });
  it('keeps a zero that is a digit of the code: "F70" is not F-07', () => {
    expect(found('F70')).toEqual(['f70']);
    expect(codeMatchQuality('f70', 'f07')).toBeNull();
    expect(codeMatchQuality('e50', 'e05')).toBeNull();
  });
  it('looks up the padded digit keys a stored code may carry', () => {
    expect(digitKeysOf('f7')).toEqual(expect.arrayContaining(['7', '07', '007']));
    expect(digitKeysOf('f7')).not.toContain('17');
    expect(digitKeysOf('e05')).toEqual(expect.arrayContaining(['05', '5', '005']));
    expect(digitKeysOf('nodisc')).toEqual([]);
  });
});
