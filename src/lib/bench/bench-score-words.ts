// The bench score told in a technician's words: counts by outcome and how much the reports so far can say.
/** The counts a bench score rests on (the fix author's own reports are shown, not counted). */
export interface BenchCounts {
  counted: number;
  fixed: number;
  partly: number;
  notFixed: number;
  cameBack: number;
  ownReports: number;
}
type Counts = BenchCounts;

/** Below this many counted reports the Wilson bound stays low whatever they say (5 of 5 fixed scores 0.57). */
export const FEW_REPORTS = 10;
export const MANY_REPORTS = 30;

const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

/** "5 of 5 technicians fixed it; few reports so far", or why there is no score yet. */
export function benchScoreInWords(score: Counts): string {
  if (score.counted === 0) {
    return score.ownReports > 0
      ? 'No technician besides the author has reported on this fix yet.'
      : 'No technician has reported on this fix yet.';
  }
  const parts = [`${score.fixed} of ${plural(score.counted, 'technician', 'technicians')} fixed it`];
  if (score.partly > 0) parts.push(`${score.partly} partly`);
  if (score.notFixed > 0) parts.push(`${score.notFixed} did not`);
  if (score.cameBack > 0) parts.push(`for ${score.cameBack} the fault came back`);
  const amount =
    score.counted < FEW_REPORTS ? 'few reports so far' : score.counted < MANY_REPORTS ? 'a fair number of reports' : 'many reports';
  return `${parts.join(', ')}; ${amount}.`;
}

/** Shares of the bar, in per cent of counted reports: fixed, partly, and not fixed with came back together. */
export function benchScoreBar(score: Counts): { fixed: number; partly: number; failed: number } {
  if (score.counted === 0) return { fixed: 0, partly: 0, failed: 0 };
  const share = (n: number): number => Math.round((n / score.counted) * 1000) / 10;
  return { fixed: share(score.fixed), partly: share(score.partly), failed: share(score.notFixed + score.cameBack) };
}
