// GET/PUT /api/v1/order-list: the signed-in member's saved order list (GET ?format=csv answers the CSV).
import type { APIRoute } from 'astro';
import { formatQuerySchema as querySchema } from '@/server/openapi/inputs';
import { storedListCsv, storedListSchema } from '@/lib/tools/order-list';
import { apiError, json } from '@/server/http/responses';
import { getOrderList, saveOrderList } from '@/server/bench-work/order-lists';
import { csvResponse } from '@/server/http/csv-response';
import { orderListOwner } from '@/server/bench-work/order-list-owner';
import { readBody } from '@/server/http/body';
import { respond, schemaRefusal, parseSearchParams } from '@/server/http/result';

const EXAMPLE =
  '{ "lines": [{ "key": "capacitance:470 µF 16 V", "label": "470 µF 16 V", "kind": "capacitor", "quantity": 2, "spares": 1 }] }';

/** 401 when signed out, 403 when the account may not keep one yet (e-mail not confirmed). */
function refusal(locals: App.Locals): Response {
  return locals.user
    ? apiError('forbidden', 'Confirm your e-mail address to keep an order list on your account; until then it stays in this browser.')
    : apiError('unauthorised', 'Sign in to keep an order list on your account; without an account it stays in this browser.');
}

export const GET: APIRoute = async ({ locals, url }) => {
  const owner = orderListOwner(locals);
  if (!owner) return refusal(locals);
  const query = parseSearchParams(querySchema, url);
  if (!query.ok) return respond(query);
  const list = await getOrderList(owner.id);
  if (query.value.format === 'csv') return csvResponse(storedListCsv(list.lines), 'order-list.csv');
  return json({ name: list.name, lines: list.lines, updatedAt: list.updatedAt }, { cache: 'private' });
};

export const PUT: APIRoute = async ({ locals, request }) => {
  const owner = orderListOwner(locals);
  if (!owner) return refusal(locals);
  const read = await readBody(request, { json: 'tools' });
  if (!read.ok) return respond(read);
  const body = read.value;
  const parsed = storedListSchema.safeParse(body.data);
  if (!parsed.success) return respond(schemaRefusal(parsed.error, EXAMPLE));
  const keys = new Set(parsed.data.lines.map((l) => l.key));
  if (keys.size !== parsed.data.lines.length)
    return apiError('bad_request', 'Two lines have the same key; merge them first.', { lines: ['Each key once.'] });
  const saved = await saveOrderList(owner.id, parsed.data.lines);
  return json({ name: saved.name, lines: saved.lines, updatedAt: saved.updatedAt }, { cache: 'private' });
};
