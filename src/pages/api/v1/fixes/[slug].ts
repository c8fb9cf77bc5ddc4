// GET /api/v1/fixes/:slug: the live proofed revision of a fix, or `?revision=n` for an older proofed one.
import type { APIRoute } from 'astro';
import { fixRevisionQuerySchema as querySchema } from '@/server/openapi/inputs';
import { parseSearchParams, respond } from '@/server/http/result';
import { getFix } from '@/server/fixes/fixes';
import { apiError, json } from '@/server/http/responses';
import { slugSchema } from '@/lib/schemas/slug';

export const GET: APIRoute = async ({ params, url }) => {
  const slug = slugSchema.safeParse(params.slug);
  if (!slug.success) return apiError('not_found', 'No fix has that address.');
  const query = parseSearchParams(querySchema, url);
  if (!query.ok) return respond(query);
  const fix = await getFix(slug.data, query.value.revision);
  if (!fix) {
    return apiError(
      'not_found',
      query.value.revision ? `Fix "${slug.data}" has no proofed revision r${query.value.revision}.` : `No fix "${slug.data}".`,
    );
  }
  const { id: _id, createdBy: _createdBy, ...publicFix } = fix;
  return json(publicFix, { cache: query.value.revision ? 'immutable' : 'public' });
};
