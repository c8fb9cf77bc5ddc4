// The words beside a search result's bench score: always with how many reports it rests on.

/** "Bench score 49/100 from 10 bench reports", "… from 1 bench report", or "No bench reports yet" (as the fix pages say it). */
export function benchScoreText(score: number | null, reports: number): string {
  if (reports === 0 || score === null) return 'No bench reports yet';
  return `Bench score ${Math.round(score * 100)}/100 from ${reports} bench ${reports === 1 ? 'report' : 'reports'}`;
}
