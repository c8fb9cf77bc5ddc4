// POST /api/v1/job-sheets/:id/fixes: apply a fix (pins its live or named proofed revision). DELETE ?fix=slug: take it off.
import type { APIRoute } from 'astro';
import { z } from 'zod';
import { apiError, fieldErrors, json, parseSearchParams } from '@/server/http/responses';
import { readBenchBody } from '@/server/bench-work/bench-reports';
import { applyFixToJob, getJobSheet, jobSheetNotFound, jobSheetRequest, removeFixFromJob } from '@/server/bench-work/job-sheets';
import { applyFixSchema } from '@/lib/schemas/bench-work';
import { slugSchema } from '@/lib/schemas/slug';

export const POST: APIRoute = async ({ locals, params, request }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return job.response;
  const body = await readBenchBody(request);
  if (body.kind === 'error') return body.response;
  if (body.kind !== 'json') return apiError('unsupported_media_type', 'Send { "fix": "<slug>" } as JSON.');
  const parsed = applyFixSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Name the fix to apply.', fieldErrors(parsed.error));
  const applied = await applyFixToJob(job.ownerId, job.id, parsed.data.fix, parsed.data.revision);
  if (!applied.ok) return applied.code === 'not_found' ? jobSheetNotFound() : apiError(applied.code, applied.message, applied.fields);
  return json({ jobSheet: await getJobSheet(job.ownerId, job.id) }, { cache: 'private' });
};

const removeQuery = z.object({ fix: slugSchema });

export const DELETE: APIRoute = async ({ locals, params, url }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return job.response;
  const query = parseSearchParams(removeQuery, url);
  if (!query.ok) return query.response;
  if (!(await removeFixFromJob(job.ownerId, job.id, query.data.fix))) return apiError('not_found', 'That fix is not on this job sheet.');
  return new Response(null, { status: 204, headers: { 'Cache-Control': 'private, no-store' } });
};
