// The bench score in a technician's words and the shares of its bar.
import { describe, expect, it } from 'vitest';
import { benchScoreBar, benchScoreInWords } from '@/lib/bench/bench-score-words';

const counts = (over: Partial<Parameters<typeof benchScoreInWords>[0]>) => ({
  counted: 0,
  fixed: 0,
  partly: 0,
  notFixed: 0,
  cameBack: 0,
  ownReports: 0,
  ...over,
});

describe('benchScoreInWords', () => {
  it('says how many fixed it and that there are few reports', () => {
    expect(benchScoreInWords(counts({ counted: 5, fixed: 5 }))).toBe('5 of 5 technicians fixed it; few reports so far.');
  });

  it('names partly, not fixed and came back, and more reports', () => {
    expect(benchScoreInWords(counts({ counted: 12, fixed: 8, partly: 2, notFixed: 1, cameBack: 1 }))).toBe(
      '8 of 12 technicians fixed it, 2 partly, 1 did not, for 1 the fault came back; a fair number of reports.',
    );
    expect(benchScoreInWords(counts({ counted: 1, fixed: 1 }))).toBe('1 of 1 technician fixed it; few reports so far.');
  });

  it('says when nobody but the author has reported', () => {
    expect(benchScoreInWords(counts({ ownReports: 1 }))).toMatch(/besides the author/);
    expect(benchScoreInWords(counts({}))).toMatch(/No technician has reported/);
  });
});

describe('benchScoreBar', () => {
  it('gives the shares of fixed, partly and not fixed with came back, in per cent', () => {
    expect(benchScoreBar(counts({ counted: 4, fixed: 2, partly: 1, cameBack: 1 }))).toEqual({ fixed: 50, partly: 25, failed: 25 });
    expect(benchScoreBar(counts({}))).toEqual({ fixed: 0, partly: 0, failed: 0 });
  });
});
