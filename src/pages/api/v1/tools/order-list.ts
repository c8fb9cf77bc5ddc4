// POST /api/v1/tools/order-list: parts rows grouped by canonical spec with spares; ?format=csv answers the CSV.
import type { APIRoute } from 'astro';
import { formatQuerySchema as querySchema } from '@/server/openapi/inputs';
import { buildOrderList, orderListInputSchema } from '@/lib/bench/order-list';
import { orderListCsv } from '@/lib/bench/order-list-csv';
import { json } from '@/server/http/responses';
import { csvResponse } from '@/server/http/csv-response';
import { readBody } from '@/server/http/body';
import { respond, inputRefusal, schemaRefusal, parseSearchParams } from '@/server/http/result';

const EXAMPLE =
  '{ "lines": [{ "source": "Tray will not close", "ref": "C512", "kind": "capacitor", "value": "470uF", "rating": "16V 105C", "quantity": 1 }], "spares": { "percent": 10 } }';

export const POST: APIRoute = async ({ request, url }) => {
  const query = parseSearchParams(querySchema, url);
  if (!query.ok) return respond(query);
  const read = await readBody(request, { json: 'tools' });
  if (!read.ok) return respond(read);
  const body = read.value;
  const parsed = orderListInputSchema.safeParse(body.data);
  if (!parsed.success) return respond(schemaRefusal(parsed.error, EXAMPLE));
  const lines = buildOrderList(parsed.data);
  if (!lines.ok) return respond(inputRefusal('lines', lines.error));
  if (query.value.format === 'csv') return csvResponse(orderListCsv(lines.value), 'order-list.csv');
  return json({ lines: lines.value }, { cache: 'private' });
};
