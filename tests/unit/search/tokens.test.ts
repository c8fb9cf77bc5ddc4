// Query parsing: folding, pieces, phrases and excluded words, whatever is typed.
import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import { foldText, parseQuery, piecesOf } from '@/lib/search/tokens';

describe('foldText', () => {
  it('lower-cases, drops accents and apostrophes', () => {
    expect(foldText("Won’t DÉMAG the Tray's")).toBe('wont demag the trays');
  });
});

describe('piecesOf', () => {
  it('splits on separators and remembers how pieces were joined', () => {
    const pieces = piecesOf('dr-4120k, kx 44 n');
    expect(pieces.map((p) => p.text)).toEqual(['dr', '4120k', 'kx', '44', 'n']);
    expect(pieces.map((p) => p.tight)).toEqual([false, true, false, false, false]);
    // A comma is not a code separator: "4120k" and "kx" are not joined.
    expect(pieces.map((p) => p.joinsPrevious)).toEqual([false, true, false, true, true]);
    expect(pieces.map((p) => p.hasDigit)).toEqual([false, true, false, true, false]);
  });
});

describe('parseQuery', () => {
  it('takes quoted phrases and minus-words out of the pieces', () => {
    const parsed = parseQuery('"fast forward" slow -rewind belt');
    expect(parsed.phrases).toEqual(['fast forward']);
    expect(parsed.excluded).toEqual(['rewind']);
    expect(parsed.pieces.map((p) => p.text)).toEqual(['slow', 'belt']);
  });

  it('reads an unclosed quote to the end of the query', () => {
    expect(parseQuery('tray "won t close').phrases).toEqual(['won t close']);
  });

  it('keeps a dash inside a model number as part of the code', () => {
    expect(parseQuery('KX-44N').excluded).toEqual([]);
    expect(parseQuery('KX-44N').pieces.map((p) => p.text)).toEqual(['kx', '44n']);
  });

  test.prop([fc.string({ maxLength: 400 })])('never throws and never returns more than 24 pieces', (raw) => {
    const parsed = parseQuery(raw);
    expect(parsed.pieces.length).toBeLessThanOrEqual(24);
    for (const piece of parsed.pieces) expect(piece.text).toMatch(/^[\p{L}\p{N}]+$/u);
  });
});
