// Cell-by-cell diffs of table rows (parts, readings) after matching rows between two revisions. Pure.

export type RowStatus = 'same' | 'changed' | 'added' | 'removed';

export interface CellDiff {
  column: string;
  before: string;
  after: string;
  changed: boolean;
}

export interface RowDiff {
  status: RowStatus;
  cells: CellDiff[];
}

type Row = Record<string, string | number>;

/**
 * Pairs rows: first by an identifying key (a reference designator, a test point) when both sides have it, then
 * rows with identical content, then the remaining rows in order. Unpaired rows are additions or removals.
 */
export function matchRows<R extends Row>(before: readonly R[], after: readonly R[], keyOf: (row: R) => string): [R | null, R | null][] {
  const pairs: [R | null, R | null][] = [];
  const usedBefore = new Set<number>();
  const usedAfter = new Set<number>();
  const pairBy = (same: (a: R, b: R) => boolean) => {
    after.forEach((b, j) => {
      if (usedAfter.has(j)) return;
      const i = before.findIndex((a, k) => !usedBefore.has(k) && same(a, b));
      if (i < 0) return;
      usedBefore.add(i);
      usedAfter.add(j);
      pairs.push([before[i]!, b]);
    });
  };
  pairBy((a, b) => keyOf(a) !== '' && keyOf(a) === keyOf(b));
  pairBy((a, b) => JSON.stringify(a) === JSON.stringify(b));
  const restBefore = before.filter((_, i) => !usedBefore.has(i));
  const restAfter = after.filter((_, j) => !usedAfter.has(j));
  const paired = Math.min(restBefore.length, restAfter.length);
  for (let i = 0; i < paired; i++) pairs.push([restBefore[i]!, restAfter[i]!]);
  for (const a of restBefore.slice(paired)) pairs.push([a, null]);
  for (const b of restAfter.slice(paired)) pairs.push([null, b]);
  // Show rows in the order of the newer revision, removals where they stood.
  return pairs.sort((p, q) => position(p, after, before) - position(q, after, before));
}

function position<R>(pair: [R | null, R | null], after: readonly R[], before: readonly R[]): number {
  if (pair[1]) return after.indexOf(pair[1]);
  return pair[0] ? before.indexOf(pair[0]) - 0.5 : 0;
}

export function diffRows<R extends Row>(
  before: readonly R[],
  after: readonly R[],
  columns: readonly (keyof R & string)[],
  keyOf: (row: R) => string,
): RowDiff[] {
  return matchRows(before, after, keyOf).map(([a, b]) => {
    const cells = columns.map((column) => {
      const was = a ? String(a[column] ?? '') : '';
      const now = b ? String(b[column] ?? '') : '';
      return { column, before: was, after: now, changed: was !== now };
    });
    const status: RowStatus = !a ? 'added' : !b ? 'removed' : cells.some((c) => c.changed) ? 'changed' : 'same';
    return { status, cells };
  });
}
