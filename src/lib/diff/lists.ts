// Set-like diffs of short lists (symptoms, error codes, machines, photos) that keep the order written. Pure.

export interface ListDiff<T> {
  added: T[];
  removed: T[];
  kept: T[];
}

/** Compares two lists by a key; order changes alone are not reported as changes. */
export function diffList<T>(before: readonly T[], after: readonly T[], keyOf: (item: T) => string = String): ListDiff<T> {
  const beforeKeys = new Set(before.map(keyOf));
  const afterKeys = new Set(after.map(keyOf));
  return {
    added: after.filter((item) => !beforeKeys.has(keyOf(item))),
    removed: before.filter((item) => !afterKeys.has(keyOf(item))),
    kept: after.filter((item) => beforeKeys.has(keyOf(item))),
  };
}

export function listChanged<T>(diff: ListDiff<T>): boolean {
  return diff.added.length > 0 || diff.removed.length > 0;
}
