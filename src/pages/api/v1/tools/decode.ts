// GET/POST /api/v1/tools/decode: a parts row's value (and rating, kind) read into its canonical spec.
import type { APIRoute } from 'astro';
import { decodePart, decodeQuerySchema } from '@/lib/tools/value-decoder';
import { json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { respond, inputRefusal, schemaRefusal } from '@/server/http/result';

const EXAMPLE = '{ "value": "470uF", "rating": "16V 105C low-ESR", "kind": "capacitor" }';

function decode(input: unknown, cache: 'public' | 'private'): Response {
  const parsed = decodeQuerySchema.safeParse(input);
  if (!parsed.success) return respond(schemaRefusal(parsed.error, EXAMPLE));
  const { value, rating, kind, written } = parsed.data;
  const decoded = decodePart(value, rating, kind, written);
  if (!decoded.ok) return respond(inputRefusal(decoded.field, decoded.error));
  return json({ value, rating, kind: kind ?? null, canonical: decoded.spec.label, key: decoded.spec.key, spec: decoded.spec }, { cache });
}

export const GET: APIRoute = ({ url }) => decode(Object.fromEntries(url.searchParams), 'public');

export const POST: APIRoute = async ({ request }) => {
  const read = await readBody(request, { json: 'tools' });
  if (!read.ok) return respond(read);
  const body = read.value;
  return decode(body.data, 'private');
};
