// Members' saved order lists (order_lists): one list per member, read, replaced or added to inside a transaction.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { getFix } from '../fixes/fixes';
import type { OrderLineInput } from '@/lib/bench/order-list';
import { addRows, readStoredLines, type StoredLine } from '@/lib/tools/order-list';
import type { Result } from '@/lib/values/result';

export interface SavedOrderList {
  id: number | null;
  name: string;
  lines: StoredLine[];
  updatedAt: Date | null;
}

interface OrderListRow {
  id: number;
  name: string;
  lines: unknown;
  updated_at: Date;
}

function toSaved(row: OrderListRow | undefined): SavedOrderList {
  if (!row) return { id: null, name: 'Order list', lines: [], updatedAt: null };
  return { id: row.id, name: row.name, lines: readStoredLines(row.lines), updatedAt: row.updated_at };
}

/** A member's list; a member who never saved one has an empty list (no row until the first save). */
export async function getOrderList(ownerId: number): Promise<SavedOrderList> {
  const row: OrderListRow | undefined = await db()('order_lists')
    .where('owner_id', ownerId)
    .orderBy('id')
    .first('id', 'name', 'lines', 'updated_at');
  return toSaved(row);
}

/** Writes the member's lines (inserting their list row on the first save), inside the caller's transaction. */
export async function writeLines(
  trx: Knex.Transaction,
  ownerId: number,
  existingId: number | null,
  lines: StoredLine[],
): Promise<SavedOrderList> {
  const payload = { lines: JSON.stringify(lines), updated_at: trx.fn.now() };
  const [row] = existingId
    ? await trx('order_lists').where({ id: existingId, owner_id: ownerId }).update(payload).returning(['id', 'name', 'lines', 'updated_at'])
    : await trx('order_lists')
        .insert({ owner_id: ownerId, ...payload })
        .returning(['id', 'name', 'lines', 'updated_at']);
  return toSaved(row as OrderListRow | undefined);
}

/** Locks the member's list row (if any) so two saves at once do not lose lines. */
export async function lockedList(trx: Knex.Transaction, ownerId: number): Promise<SavedOrderList> {
  const row: OrderListRow | undefined = await trx('order_lists')
    .where('owner_id', ownerId)
    .orderBy('id')
    .forUpdate()
    .first('id', 'name', 'lines', 'updated_at');
  return toSaved(row);
}

/** Replaces the member's lines (the order-list page saves the whole list after each edit). */
export async function saveOrderList(ownerId: number, lines: StoredLine[]): Promise<SavedOrderList> {
  return db().transaction(async (trx) => {
    const current = await lockedList(trx, ownerId);
    return writeLines(trx, ownerId, current.id, lines);
  });
}

/** Merges parts rows into the member's list by canonical spec. */
export async function addToOrderList(ownerId: number, rows: OrderLineInput[]): Promise<Result<SavedOrderList>> {
  return db().transaction(async (trx) => {
    const current = await lockedList(trx, ownerId);
    const merged = addRows(current.lines, rows);
    if (!merged.ok) return merged;
    return { ok: true as const, value: await writeLines(trx, ownerId, current.id, merged.value) };
  });
}

export interface FixParts {
  slug: string;
  title: string;
  revisionNumber: number;
  rows: OrderLineInput[];
}

/**
 * The parts rows of a fix's proofed revision (the live one without a number), each with the fix as its
 * source; `row` picks one row by index. Null when the fix, revision or row does not exist.
 */
export async function fixPartsForOrder(slug: string, revisionNumber: number | undefined, row: number | 'all'): Promise<FixParts | null> {
  const fix = await getFix(slug, revisionNumber);
  if (!fix) return null;
  const source = `${fix.revision.title} (r${fix.revision.number})`.slice(0, 200);
  const all: OrderLineInput[] = fix.revision.parts.map((p) => ({ ...p, source }));
  const rows = row === 'all' ? all : all.slice(row, row + 1);
  if (rows.length === 0) return null;
  return { slug: fix.slug, title: fix.revision.title, revisionNumber: fix.revision.number, rows };
}
