// GET, PATCH, DELETE /api/v1/job-sheets/:id: one of your job sheets. Another member's answers 404, never 403.
// PATCH takes JSON, or the job sheet page's own form fields (only the fields sent change), and with
// `If-Match: "v<version>"` (the sheet's `version`) is refused with 409 and the sheet as it is now when it changed meanwhile.
import type { APIRoute } from 'astro';
import { respond } from '@/server/http/result';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { deleteJobSheet, getJobSheet, jobSheetMissing, jobSheetRequest, updateJobSheet } from '@/server/bench-work/job-sheets';
import { jobSheetPatchSchema } from '@/lib/schemas/job-sheet';
import { jobSheetFromForm } from '@/server/bench-work/job-form';
import { presentFormFields, versionFromIfMatch } from '@/lib/offline/job-sheet-version';

export const GET: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const sheet = await getJobSheet(job.value.ownerId, job.value.id);
  return sheet ? json({ jobSheet: sheet }, { cache: 'private' }) : respond(jobSheetMissing);
};

export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const expected = versionFromIfMatch(request.headers.get('if-match'));
  if (expected === 'unreadable') return apiError('bad_request', 'If-Match names the version you edited, e.g. If-Match: "v3".');
  const read = await readBody(request, { json: 'benchWork', form: 'benchWork' });
  if (!read.ok) return respond(read);
  const body = read.value;
  const input = body.kind === 'json' ? body.data : presentFormFields(jobSheetFromForm(body.form), [...body.form.keys()]);
  const parsed = jobSheetPatchSchema.safeParse(input);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the job sheet are not valid.', fieldErrors(parsed.error));
  const updated = await updateJobSheet(job.value.ownerId, job.value.id, parsed.data, expected);
  if (!updated.ok && updated.code === 'conflict')
    return apiError('conflict', updated.message, undefined, { extra: { jobSheet: await getJobSheet(job.value.ownerId, job.value.id) } });
  if (!updated.ok) return respond(updated.code === 'not_found' ? jobSheetMissing : updated);
  return json({ jobSheet: await getJobSheet(job.value.ownerId, job.value.id) }, { cache: 'private' });
};

/** Hard delete: the customer data in the sheet is gone; notes made from it keep working without it. */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  if (!(await deleteJobSheet(job.value.ownerId, job.value.id))) return respond(jobSheetMissing);
  return new Response(null, { status: 204, headers: { 'Cache-Control': 'private, no-store' } });
};
