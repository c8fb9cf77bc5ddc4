// POST /api/v1/bench-reports: record or change a bench report (JSON). GET: your own. Pages' forms use the benchReport Action.
import type { APIRoute } from 'astro';
import { z } from 'zod';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { listOwnBenchReports, saveBenchReport } from '@/server/bench-work/bench-reports';
import { readBody } from '@/server/http/body';
import { consume } from '@/server/http/rate-limit';
import { respond, parseSearchParams } from '@/server/http/result';
import { benchReportInputSchema } from '@/lib/schemas/bench-report';
import { slugSchema } from '@/lib/schemas/slug';

export const listQuery = z.object({ fix: slugSchema.optional() });

export const GET: APIRoute = async ({ locals, url }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to see your bench reports.');
  const query = parseSearchParams(listQuery, url);
  if (!query.ok) return respond(query);
  return json({ reports: await listOwnBenchReports(user.id, query.value.fix) }, { cache: 'private' });
};

export const POST: APIRoute = async ({ locals, request }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to record a bench report.');
  if (!can(user, 'bench_report')) return apiError('forbidden', 'Confirm your e-mail address before you record bench reports.');
  const read = await readBody(request, { json: 'benchWork', form: 'benchWork' });
  if (!read.ok) return respond(read);
  const body = read.value;
  // A plain form answered with a redirect would carry what was typed through the address: forms use the Action.
  if (body.kind === 'form')
    return apiError('unsupported_media_type', 'Send JSON (application/json), e.g. {"fix":"…","machine":"…","outcome":"fixed"}.');
  const limit = await consume('bench_report', { account: String(user.id) });
  if (!limit.ok) return respond(limit);
  const parsed = benchReportInputSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the bench report are not valid.', fieldErrors(parsed.error));
  const saved = await saveBenchReport(user.id, parsed.data);
  if (!saved.ok) return respond(saved);
  return json({ report: saved.report }, { status: saved.report.created ? 201 : 200, cache: 'private' });
};
