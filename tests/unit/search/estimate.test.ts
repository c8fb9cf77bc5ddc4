// Match estimates that choose how candidates are read: ORs add, phrases take their rarest word, clauses overlap.
import { describe, expect, it } from 'vitest';
import { estimateMatches, estimateShare, walkThreshold } from '@/lib/search/estimate';

const counts: Record<string, number> = { tray: 300, drawer: 40, disc: 500, won: 200, "o'clock": 7 };
const count = (lexeme: string) => counts[lexeme] ?? 0;

describe('estimateMatches', () => {
  it('adds the parts of an OR and takes the rarest word of a phrase', () => {
    expect(estimateMatches("('tray') | ('drawer') | ('disc' <-> 'tray')", count)).toBe(300 + 40 + 300);
    expect(estimateMatches("'disc' <2> 'won'", count)).toBe(200);
  });
  it('reads escaped quotes in a lexeme and counts unknown lexemes as none', () => {
    expect(estimateMatches("'o''clock' | 'zzz'", count)).toBe(7);
    expect(estimateMatches('', count)).toBe(0);
  });
});

describe('estimateShare', () => {
  it('bounds the share by the rarest clause, and is 1 with no clauses', () => {
    expect(estimateShare([300, 40], 1000)).toBeCloseTo(0.04);
    expect(estimateShare([], 1000)).toBe(1);
    expect(estimateShare([5000], 1000)).toBe(1);
  });
});

describe('walkThreshold', () => {
  it('is where walking (limit ÷ share reads) and collecting (share × total reads) cost the same', () => {
    const threshold = walkThreshold(50, 100_000, 4, 1);
    const walk = (50 / threshold) * 4;
    const collect = threshold * 100_000 * 1;
    expect(walk).toBeCloseTo(collect, 6);
    expect(walkThreshold(50, 0, 4, 1)).toBe(Number.POSITIVE_INFINITY);
  });
});
