// GET /api/v1/catalogue-lookup?q=...&kind=machine|chassis|all: the type-ahead for what a fix applies to.
import type { APIRoute } from 'astro';
import { parseSearchParams, respond } from '@/server/http/result';
import { json } from '@/server/http/responses';
import { lookupCatalogue } from '@/server/catalogue/lookup';
import { lookupQuerySchema } from '@/lib/schemas/catalogue-lookup';

export const GET: APIRoute = async ({ url }) => {
  const query = parseSearchParams(lookupQuerySchema, url);
  if (!query.ok) return respond(query);
  return json({ hits: await lookupCatalogue(query.value) }, { cache: 'public' });
};
