// Optimal string alignment distance: worked examples and a cross-check against an npm Levenshtein library.
import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import { distance as levenshtein } from 'fastest-levenshtein';
import { allowedEdits, editDistance } from '@/lib/search/edit-distance';

describe('editDistance', () => {
  it('counts a swap of neighbouring letters once', () => {
    // "tary" for "tray": one adjacent transposition (Damerau 1964); plain Levenshtein needs two edits.
    expect(editDistance('tary', 'tray')).toBe(1);
    expect(levenshtein('tary', 'tray')).toBe(2);
  });

  it('gives the restricted (OSA) answer where it differs from unrestricted Damerau–Levenshtein', () => {
    // The textbook example: OSA("ca", "abc") = 3, while the unrestricted distance is 2 (a substring is
    // never edited twice under OSA). Source: the Damerau–Levenshtein distance article's worked example.
    expect(editDistance('ca', 'abc')).toBe(3);
  });

  it('agrees with the classic Levenshtein examples when no swap helps', () => {
    // "kitten" → "sitting" = 3 (Levenshtein 1966; the usual worked example).
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('same', 'same')).toBe(0);
  });

  it('stops early above the limit and reports limit + 1', () => {
    expect(editDistance('capacitor', 'tray', 2)).toBe(3);
  });

  test.prop([
    fc.string({ maxLength: 9, unit: fc.constantFrom('a', 'b', 'c', 'd') }),
    fc.string({ maxLength: 9, unit: fc.constantFrom('a', 'b', 'c', 'd') }),
  ])('never exceeds Levenshtein, and is at least half of it (a swap replaces two edits)', (a, b) => {
    const osa = editDistance(a, b);
    const lev = levenshtein(a, b);
    expect(osa).toBeLessThanOrEqual(lev);
    expect(2 * osa).toBeGreaterThanOrEqual(lev);
    expect(editDistance(b, a)).toBe(osa);
  });
});

describe('allowedEdits', () => {
  it('corrects nothing under four letters, one slip up to six, two from seven', () => {
    expect([3, 4, 6, 7, 12].map(allowedEdits)).toEqual([0, 1, 1, 2, 2]);
  });
});
