// Moving parts between a job sheet and an order list: order-list lines become "parts used" rows on a job,
// and a job's rows go back onto an order list through the same canonical grouping (buildOrderList).
import type { PartKind } from '@/lib/schemas/revision';
import { fail, ok, type Result } from '@/lib/values/result';

/** The part of an order-list line a job needs (the stored line shape of the order list page). */
export interface ListedPart {
  label: string;
  kind: PartKind;
  quantity: number;
  refs: readonly string[];
  sources: readonly string[];
  notes: readonly string[];
}

/** A parts-used row of a job sheet: the fix parts-row shape with where it came from. */
export interface UsedPart {
  ref: string;
  kind: PartKind;
  value: string;
  rating: string;
  quantity: number;
  notes: string;
  source: string;
}

export const MAX_JOB_PARTS = 200;
const MAX_USED_QUANTITY = 999;
const MAX_REF = 40;

/**
 * One row per order-list line. The canonical label is the value (the decoder reads it back to the same
 * spec), quantities are the counted parts without spares (spares are stock, not parts fitted), and
 * designators that do not fit the row's short ref field are kept in its notes rather than dropped.
 */
export function usedPartsFromList(lines: readonly ListedPart[]): Result<UsedPart[]> {
  const rows: UsedPart[] = [];
  for (const line of lines) {
    if (line.quantity > MAX_USED_QUANTITY)
      return fail(
        `"${line.label}" is listed ${line.quantity} times; a job sheet row holds at most ${MAX_USED_QUANTITY}. Lower it on the order list first.`,
        '2 × 470 µF 16 V',
      );
    const refs = line.refs.join(' ');
    const refFits = refs.length <= MAX_REF;
    const notes = [...(refFits || refs === '' ? [] : [`Refs: ${refs}`]), ...line.notes].join('; ');
    rows.push({
      ref: refFits ? refs : '',
      kind: line.kind,
      value: line.label.slice(0, 120),
      rating: '',
      quantity: line.quantity,
      notes: notes.slice(0, 500),
      source: line.sources.join('; ').slice(0, 200),
    });
  }
  return ok(rows);
}

/** The job's rows followed by the new ones, refused whole when the job would hold too many. */
export function appendUsedParts(existing: readonly UsedPart[], added: readonly UsedPart[]): Result<UsedPart[]> {
  if (existing.length + added.length > MAX_JOB_PARTS)
    return fail(
      `That would make ${existing.length + added.length} part rows; a job sheet holds at most ${MAX_JOB_PARTS}. Merge or remove rows first.`,
      `at most ${MAX_JOB_PARTS} rows`,
    );
  return ok([...existing, ...added]);
}
