// The words beside a search result's bench score: always with how many reports it rests on.

/**
 * "Bench score 0.49 from 10 bench reports", "… from 1 bench report", or "No bench reports yet": the score as the
 * fix page explains it (a cautious 0 to 1 estimate), never alone and never as a mark out of 100.
 */
export function benchScoreText(score: number | null, reports: number): string {
  if (reports === 0 || score === null) return 'No bench reports yet';
  return `Bench score ${score.toFixed(2)} from ${reports} bench ${reports === 1 ? 'report' : 'reports'}`;
}
