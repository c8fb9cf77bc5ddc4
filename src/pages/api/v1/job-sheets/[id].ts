// GET, PATCH, DELETE /api/v1/job-sheets/:id: one of your job sheets. Another member's answers 404, never 403.
// GET answers with the sheet's version as its ETag. PATCH takes JSON, or the job sheet page's own form fields (only
// the fields sent change, as an offline edit sends them); with If-Match (required with an API token) it answers 412
// with the current sheet when someone changed it meanwhile.
import type { APIRoute } from 'astro';
import { respond } from '@/server/http/result';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { deleteJobSheet, getJobSheet, jobSheetMissing, jobSheetRequest, updateJobSheet } from '@/server/bench-work/job-sheets';
import { jobSheetPatchSchema } from '@/lib/schemas/job-sheet';
import { jobSheetFromForm } from '@/server/bench-work/job-form';
import { presentFormFields } from '@/lib/offline/job-sheet-version';
import { ifMatchVersion, versionTag } from '@/server/http/if-match';

export const GET: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const sheet = await getJobSheet(job.value.ownerId, job.value.id);
  return sheet ? json({ jobSheet: sheet }, { cache: 'private', headers: { ETag: versionTag(sheet.version) } }) : respond(jobSheetMissing);
};

export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const expected = ifMatchVersion(request, { required: locals.apiToken !== undefined });
  if (!expected.ok) return respond(expected);
  const read = await readBody(request, { json: 'benchWork', form: 'benchWork' });
  if (!read.ok) return respond(read);
  const body = read.value;
  const input = body.kind === 'json' ? body.data : presentFormFields(jobSheetFromForm(body.form), [...body.form.keys()]);
  const parsed = jobSheetPatchSchema.safeParse(input);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the job sheet are not valid.', fieldErrors(parsed.error));
  const updated = await updateJobSheet(job.value.ownerId, job.value.id, parsed.data, expected.value);
  if (!updated.ok) return respond(updated.code === 'not_found' ? jobSheetMissing : updated);
  const sheet = await getJobSheet(job.value.ownerId, job.value.id);
  if (!sheet) return respond(jobSheetMissing);
  return json({ jobSheet: sheet }, { cache: 'private', headers: { ETag: versionTag(sheet.version) } });
};

/** Hard delete: the customer data in the sheet is gone; notes made from it keep working without it. */
export const DELETE: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  if (!(await deleteJobSheet(job.value.ownerId, job.value.id))) return respond(jobSheetMissing);
  return new Response(null, { status: 204, headers: { 'Cache-Control': 'private, no-store' } });
};
