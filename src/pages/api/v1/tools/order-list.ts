// POST /api/v1/tools/order-list: parts rows grouped by canonical spec with spares; ?format=csv answers the CSV.
import type { APIRoute } from 'astro';
import { z } from 'zod';
import { buildOrderList, orderListInputSchema } from '@/lib/bench/order-list';
import { orderListCsv } from '@/lib/bench/order-list-csv';
import { json, parseSearchParams } from '@/server/http/responses';
import { schemaError, toolInputError } from '@/server/tools/api-errors';
import { csvResponse } from '@/server/http/csv-response';
import { readJsonBody } from '@/server/http/body';

const querySchema = z.object({ format: z.enum(['json', 'csv'], { error: 'Give format=json or format=csv.' }).default('json') });

const EXAMPLE =
  '{ "lines": [{ "source": "Tray will not close", "ref": "C512", "kind": "capacitor", "value": "470uF", "rating": "16V 105C", "quantity": 1 }], "spares": { "percent": 10 } }';

export const POST: APIRoute = async ({ request, url }) => {
  const query = parseSearchParams(querySchema, url);
  if (!query.ok) return query.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const parsed = orderListInputSchema.safeParse(body.value);
  if (!parsed.success) return schemaError(parsed.error, EXAMPLE);
  const lines = buildOrderList(parsed.data);
  if (!lines.ok) return toolInputError('lines', lines.error);
  if (query.data.format === 'csv') return csvResponse(orderListCsv(lines.value), 'order-list.csv');
  return json({ lines: lines.value }, { cache: 'private' });
};
