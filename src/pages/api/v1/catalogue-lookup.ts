// GET /api/v1/catalogue-lookup?q=...&kind=machine|chassis|all: the type-ahead for what a fix applies to.
import type { APIRoute } from 'astro';
import { json, parseSearchParams } from '@/server/http/responses';
import { lookupCatalogue, lookupQuerySchema } from '@/server/catalogue/lookup';

export const GET: APIRoute = async ({ url }) => {
  const query = parseSearchParams(lookupQuerySchema, url);
  if (!query.ok) return query.response;
  return json({ hits: await lookupCatalogue(query.data) }, { cache: 'public' });
};
