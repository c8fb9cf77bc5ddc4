// POST /order-list/add: the fix page's plain HTML "add to order list" forms (one part or all parts of a revision).
/*
  Signed-in members: the rows are merged into their saved list, then 303 to /order-list?added=n.
  Everyone else: 303 to /order-list?add=<revision>.<row or "all">&from=<fix>: only a reference, never part
  text, so no address can put words of its own on the page. The order-list page reads those parts from the
  fix, merges them into the list kept in the browser and cleans the address. Problems answer 303 to
  /order-list?problem=<code>.
*/
import type { APIRoute } from 'astro';
import { z } from 'zod';
import { slugSchema } from '@/lib/schemas/slug';
import { addToOrderList, fixPartsForOrder } from '@/server/bench-work/order-lists';
import { orderListOwner } from '@/server/bench-work/order-list-owner';
import { readBody } from '@/server/http/body';
import { seeOther } from '@/server/http/responses';

const emptyToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

const addFormSchema = z.object({
  fix: slugSchema,
  r: z.preprocess(emptyToUndefined, z.coerce.number().int().min(1).max(100_000).optional()),
  row: z.union([z.literal('all'), z.coerce.number().int().min(0).max(999)]),
});

function back(problem: string): Response {
  return seeOther(`/order-list?problem=${problem}`);
}

export const POST: APIRoute = async ({ request, locals }) => {
  const body = await readBody(request, { form: 'pageForm' });
  if (!body.ok) return back('bad-form');
  const form = addFormSchema.safeParse(body.value.data);
  if (!form.success) return back('bad-form');
  const parts = await fixPartsForOrder(form.data.fix, form.data.r, form.data.row);
  if (!parts) return back('not-found');
  const from = `from=${encodeURIComponent(parts.slug)}`;
  const owner = orderListOwner(locals);
  if (owner) {
    const saved = await addToOrderList(owner.id, parts.rows);
    return saved.ok ? seeOther(`/order-list?added=${parts.rows.length}&${from}`) : back('not-decoded');
  }
  return seeOther(`/order-list?add=${parts.revisionNumber}.${form.data.row}&${from}`);
};
