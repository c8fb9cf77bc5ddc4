// Edit distance with adjacent swaps counted once (optimal string alignment), for typo correction.

/**
 * Optimal string alignment distance: insertions, deletions, substitutions and swaps of two neighbouring
 * letters each cost one ("tary" → "tray" is 1; plain Levenshtein would say 2). Stops early above `limit`.
 */
export function editDistance(a: string, b: string, limit = Number.POSITIVE_INFINITY): number {
  if (a === b) return 0;
  if (Math.abs(a.length - b.length) > limit) return limit + 1;
  const rows: number[][] = [];
  for (let i = 0; i <= a.length; i++) rows.push(new Array<number>(b.length + 1).fill(0));
  const at = (i: number, j: number): number => rows[i]?.[j] ?? Number.POSITIVE_INFINITY;
  for (let i = 0; i <= a.length; i++) rows[i]![0] = i;
  for (let j = 0; j <= b.length; j++) rows[0]![j] = j;
  for (let i = 1; i <= a.length; i++) {
    let rowBest = Number.POSITIVE_INFINITY;
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(at(i - 1, j) + 1, at(i, j - 1) + 1, at(i - 1, j - 1) + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) best = Math.min(best, at(i - 2, j - 2) + 1);
      rows[i]![j] = best;
      rowBest = Math.min(rowBest, best);
    }
    if (rowBest > limit) return limit + 1;
  }
  return at(a.length, b.length);
}

/** How many slips a word of this length may carry and still be corrected: none below four letters. */
export function allowedEdits(length: number): number {
  if (length < 4) return 0;
  if (length < 7) return 1;
  return 2;
}
