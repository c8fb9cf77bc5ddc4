// GET /api/v1/job-sheets: your job sheets (status, q, sort), a page at a time. POST: open a new job sheet.
import type { APIRoute } from 'astro';
import { respond, parseSearchParams } from '@/server/http/result';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { countJobSheets, createJobSheet, getJobSheet, listJobSheets } from '@/server/bench-work/job-sheets';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { jobSheetPagedQuerySchema } from '@/lib/schemas/job-sheet-list';
import { toPage } from '@/server/core/pagination';
import { versionTag } from '@/server/http/if-match';

export const GET: APIRoute = async ({ locals, url }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to see your job sheets.');
  if (!can(user, 'own_job_sheets')) return apiError('forbidden', 'Confirm your e-mail address before you keep job sheets.');
  const query = parseSearchParams(jobSheetPagedQuerySchema, url);
  if (!query.ok) return respond(query);
  const [sheets, total] = await Promise.all([listJobSheets(user.id, query.value, query.value), countJobSheets(user.id, query.value)]);
  const { items, ...page } = toPage(sheets, total, query.value);
  return json({ jobSheets: items, ...page }, { cache: 'private' });
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
  const sheet = await getJobSheet(user.id, created.value);
  return json(
    { jobSheet: sheet },
    { status: 201, cache: 'private', headers: { Location: `/api/v1/job-sheets/${created.value}`, ETag: versionTag(sheet?.version ?? 1) } },
  );
};
