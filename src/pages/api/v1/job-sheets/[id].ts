// GET, PATCH, DELETE /api/v1/job-sheets/:id: one of your job sheets. Another member's answers 404, never 403.
import type { APIRoute } from 'astro';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBenchBody } from '@/server/bench-work/bench-reports';
import { deleteJobSheet, getJobSheet, jobSheetNotFound, jobSheetRequest, updateJobSheet } from '@/server/bench-work/job-sheets';
import { jobSheetPatchSchema } from '@/lib/schemas/bench-work';

export const GET: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return job.response;
  const sheet = await getJobSheet(job.ownerId, job.id);
  return sheet ? json({ jobSheet: sheet }, { cache: 'private' }) : jobSheetNotFound();
};

export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return job.response;
  const body = await readBenchBody(request);
  if (body.kind === 'error') return body.response;
  if (body.kind !== 'json') return apiError('unsupported_media_type', 'Send the changes as JSON.');
  const parsed = jobSheetPatchSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the job sheet are not valid.', fieldErrors(parsed.error));
  const updated = await updateJobSheet(job.ownerId, job.id, parsed.data);
  if (!updated.ok) return updated.code === 'not_found' ? jobSheetNotFound() : apiError(updated.code, updated.message, updated.fields);
  return json({ jobSheet: await getJobSheet(job.ownerId, job.id) }, { cache: 'private' });
};

/** Hard delete: the customer data in the sheet is gone; notes made from it keep working without it. */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return job.response;
  if (!(await deleteJobSheet(job.ownerId, job.id))) return jobSheetNotFound();
  return new Response(null, { status: 204, headers: { 'Cache-Control': 'private, no-store' } });
};
