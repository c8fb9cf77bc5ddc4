// GET /api/v1/search: the search as JSON (what the search box island asks while the reader types).
/*
  Query: q, machine (slug), scope (machine | family | all), maker, chassis, deviceType, format, photos=1,
  caution, page, perPage (at most 50). Answers SearchResult (src/lib/search/result-types.ts); 400 with
  field messages for bad parameters and 404 for an unknown machine, in the one error shape.
  Searches made here are never counted as misses: typing passes through many half-words.
*/
import type { APIRoute } from 'astro';
import { parseSearchParams, respond } from '@/server/http/result';
import { searchParamsSchema, toSearchQuery } from '@/lib/search/query-schema';
import { apiError, json } from '@/server/http/responses';
import { db } from '@/server/core/db';
import { findNamedMachine } from '@/server/search/context';
import { searchProvider } from '@/server/search/provider';

export const GET: APIRoute = async ({ url }) => {
  const params = parseSearchParams(searchParamsSchema, url);
  if (!params.ok) return respond(params);
  const query = toSearchQuery(params.value);
  if (query.machine && !(await findNamedMachine(db(), query.machine)))
    return apiError('not_found', `No machine "${query.machine}" in the catalogue.`);
  const result = await searchProvider().search(query);
  return json(result, { cache: 'public' });
};
