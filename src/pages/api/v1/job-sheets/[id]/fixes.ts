// POST /api/v1/job-sheets/:id/fixes: apply a fix (pins its live or named proofed revision). DELETE ?fix=slug: take it off.
import type { APIRoute } from 'astro';
import { respond, parseSearchParams } from '@/server/http/result';
import { z } from 'zod';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { applyFixToJob, getJobSheet, jobSheetMissing, jobSheetRequest, removeFixFromJob } from '@/server/bench-work/job-sheets';
import { applyFixSchema } from '@/lib/schemas/job-fix';
import { slugSchema } from '@/lib/schemas/slug';

export const POST: APIRoute = async ({ locals, params, request }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const read = await readBody(request, { json: 'benchWork', form: 'benchWork' });
  if (!read.ok) return respond(read);
  const body = read.value;
  if (body.kind !== 'json') return apiError('unsupported_media_type', 'Send { "fix": "<slug>" } as JSON.');
  const parsed = applyFixSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Name the fix to apply.', fieldErrors(parsed.error));
  const applied = await applyFixToJob(job.value.ownerId, job.value.id, parsed.data.fix, parsed.data.revision);
  if (!applied.ok) return respond(applied.code === 'not_found' ? jobSheetMissing : applied);
  return json({ jobSheet: await getJobSheet(job.value.ownerId, job.value.id) }, { cache: 'private' });
};

export const removeQuery = z.object({ fix: slugSchema });

export const DELETE: APIRoute = async ({ locals, params, url }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const query = parseSearchParams(removeQuery, url);
  if (!query.ok) return respond(query);
  if (!(await removeFixFromJob(job.value.ownerId, job.value.id, query.value.fix)))
    return apiError('not_found', 'That fix is not on this job sheet.');
  return new Response(null, { status: 204, headers: { 'Cache-Control': 'private, no-store' } });
};
