// Parts between a job sheet and its owner's saved order list: take the list's lines as parts used, or
// put the job's parts on the list to order them. Both lock the rows they change, so a save on the order
// list page at the same moment cannot lose lines.
import { db } from '../core/db';
import { addToOrderList, lockedList, writeLines } from './order-lists';
import type { WriteResult } from './job-sheets';
import { appendUsedParts, usedPartsFromList, type UsedPart } from '@/lib/bench/job-parts';
import { jobPartSchema } from '@/lib/schemas/job-sheet';
import { z } from 'zod';

const notFound = { ok: false as const, code: 'not_found' as const, message: 'No job sheet with that number.' };
const storedParts = z.array(jobPartSchema);
const unreadableParts = {
  ok: false as const,
  code: 'bad_request' as const,
  message: 'The parts on this job sheet could not be read; save the job sheet once to tidy them, then try again.',
};

/** The stored parts rows, or null when the column holds something else (never a 500). */
function usedPartsOf(raw: unknown): UsedPart[] | null {
  const parsed = storedParts.safeParse(raw ?? []);
  return parsed.success ? parsed.data : null;
}

/** Appends the member's order-list lines to the job's parts used; `clear` empties the list afterwards. */
export async function takePartsFromOrderList(ownerId: number, jobId: number, options: { clear: boolean }): Promise<WriteResult<number>> {
  return db().transaction(async (trx) => {
    const job = await trx('job_sheets').where({ id: jobId, owner_id: ownerId }).forUpdate().first('id', 'parts_used');
    if (!job) return notFound;
    const list = await lockedList(trx, ownerId);
    const lines = list.lines;
    if (lines.length === 0)
      return {
        ok: false,
        code: 'bad_request',
        message: 'Your order list is empty: add parts to it from a fix or the order list page first.',
      };
    const added = usedPartsFromList(lines);
    if (!added.ok) return { ok: false, code: 'bad_request', message: added.error.message };
    const existing = usedPartsOf(job.parts_used);
    if (!existing) return unreadableParts;
    const parts = appendUsedParts(existing, added.value);
    if (!parts.ok) return { ok: false, code: 'bad_request', message: parts.error.message };
    await trx('job_sheets')
      .where({ id: jobId, owner_id: ownerId })
      .update({ parts_used: JSON.stringify(parts.value), updated_at: trx.fn.now() });
    if (options.clear) await writeLines(trx, ownerId, list.id, []);
    return { ok: true, value: added.value.length };
  });
}

/** Merges the job's parts used into the member's order list by canonical spec; the answer is the row count. */
export async function putJobPartsOnOrderList(ownerId: number, jobId: number): Promise<WriteResult<number>> {
  const job = await db()('job_sheets').where({ id: jobId, owner_id: ownerId }).first('customer_ref', 'parts_used');
  if (!job) return notFound;
  const parts = usedPartsOf(job.parts_used);
  if (!parts) return unreadableParts;
  if (parts.length === 0) return { ok: false, code: 'bad_request', message: 'This job sheet lists no parts yet.' };
  // The order list outlives the job sheet, so it names the sheet by number, never by the customer's
  // reference (deleting a sheet must take the customer data with it).
  const stamped = `Job sheet ${job.customer_ref}`.slice(0, 200);
  const source = `Job sheet no. ${jobId}`;
  const added = await addToOrderList(
    ownerId,
    parts.map((p) => ({ ...p, source: p.source === '' || p.source === stamped ? source : p.source })),
  );
  if (!added.ok) return { ok: false, code: 'bad_request', message: added.error.message };
  return { ok: true, value: parts.length };
}
