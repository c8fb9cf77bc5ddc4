// GET /api/v1/job-sheets: your job sheets (status, q, sort). POST: open a new job sheet.
import type { APIRoute } from 'astro';
import { respond, parseSearchParams } from '@/server/http/result';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { createJobSheet, getJobSheet, listJobSheets } from '@/server/bench-work/job-sheets';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { jobSheetListQuerySchema } from '@/lib/schemas/job-sheet-list';

export const GET: APIRoute = async ({ locals, url }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to see your job sheets.');
  if (!can(user, 'own_job_sheets')) return apiError('forbidden', 'Confirm your e-mail address before you keep job sheets.');
  const query = parseSearchParams(jobSheetListQuerySchema, url);
  if (!query.ok) return respond(query);
  return json({ jobSheets: await listJobSheets(user.id, query.value) }, { cache: 'private' });
};

export const POST: APIRoute = async ({ locals, request }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to open a job sheet.');
  if (!can(user, 'own_job_sheets')) return apiError('forbidden', 'Confirm your e-mail address before you keep job sheets.');
  const read = await readBody(request, { json: 'benchWork', form: 'benchWork' });
  if (!read.ok) return respond(read);
  const body = read.value;
  if (body.kind !== 'json')
    return apiError('unsupported_media_type', 'Send the job sheet as JSON; the form on /jobs/new posts to its own page.');
  const parsed = jobSheetCreateSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the job sheet are not valid.', fieldErrors(parsed.error));
  const created = await createJobSheet(user.id, parsed.data);
  if (!created.ok) return respond(created);
  return json(
    { jobSheet: await getJobSheet(user.id, created.value) },
    { status: 201, cache: 'private', headers: { Location: `/api/v1/job-sheets/${created.value}` } },
  );
};
