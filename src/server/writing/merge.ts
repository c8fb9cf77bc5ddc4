// Three-way merge of a writer's revision with the one that went live meanwhile, field by field of the structured form.
import type { FixDraft } from '@/lib/schemas/fix-draft';

export type MergeField = Exclude<keyof FixDraft, 'editSummary'>;

export interface RevisionMerge {
  /** Fields only the writer changed since the base, and fields only the live revision changed. */
  yours: MergeField[];
  theirs: MergeField[];
  /** Fields both changed, differently: these a person must settle. */
  clashes: MergeField[];
  /** The writer's values with the live revision's changes taken in; null when anything clashes. */
  values: FixDraft | null;
}

const idLists = new Set<MergeField>(['machineIds', 'chassisIds']);

/** Values compared by content: object keys in any order; machine and chassis ids as a set. */
function canonical(field: MergeField, value: unknown): string {
  const sorted = (v: unknown): unknown => {
    if (Array.isArray(v)) return v.map(sorted);
    if (v && typeof v === 'object')
      return Object.fromEntries(
        Object.entries(v as Record<string, unknown>)
          .sort(([a], [b]) => a.localeCompare(b))
          .map(([k, x]) => [k, sorted(x)]),
      );
    return v ?? null;
  };
  const plain = idLists.has(field) && Array.isArray(value) ? [...(value as number[])].sort((a, b) => a - b) : value;
  return JSON.stringify(sorted(plain));
}

/**
 * Each field is taken from whichever side changed it since the base; a field both sides changed the same way is
 * no clash. The edit summary is always the writer's own.
 */
export function mergeRevisions(base: FixDraft, live: FixDraft, mine: FixDraft): RevisionMerge {
  const fields = (Object.keys(mine) as (keyof FixDraft)[]).filter((f): f is MergeField => f !== 'editSummary');
  const merge: RevisionMerge = { yours: [], theirs: [], clashes: [], values: null };
  const values = { ...mine } as Record<MergeField, unknown>;
  for (const field of fields) {
    const [b, l, m] = [canonical(field, base[field]), canonical(field, live[field]), canonical(field, mine[field])];
    if (l === m || l === b) {
      if (m !== b && l !== m) merge.yours.push(field);
      continue;
    }
    if (m === b) {
      merge.theirs.push(field);
      values[field] = live[field];
      continue;
    }
    merge.clashes.push(field);
  }
  if (merge.clashes.length === 0) merge.values = values as FixDraft;
  return merge;
}
