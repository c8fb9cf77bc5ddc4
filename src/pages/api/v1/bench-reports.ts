// POST /api/v1/bench-reports: record or change a bench report (JSON). GET: your own. Pages' forms use the benchReport Action.
import type { APIRoute } from 'astro';
import { z } from 'zod';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json, parseSearchParams } from '@/server/http/responses';
import { consumeLimit, listOwnBenchReports, readBenchBody, saveBenchReport } from '@/server/bench-work/bench-reports';
import { benchReportInputSchema } from '@/lib/schemas/bench-work';
import { slugSchema } from '@/lib/schemas/slug';

const listQuery = z.object({ fix: slugSchema.optional() });

export const GET: APIRoute = async ({ locals, url }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to see your bench reports.');
  const query = parseSearchParams(listQuery, url);
  if (!query.ok) return query.response;
  return json({ reports: await listOwnBenchReports(user.id, query.data.fix) }, { cache: 'private' });
};

export const POST: APIRoute = async ({ locals, request }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to record a bench report.');
  if (!can(user, 'bench_report')) return apiError('forbidden', 'Confirm your e-mail address before you record bench reports.');
  const body = await readBenchBody(request);
  if (body.kind === 'error') return body.response;
  // A plain form answered with a redirect would carry what was typed through the address: forms use the Action.
  if (body.kind === 'form')
    return apiError('unsupported_media_type', 'Send JSON (application/json), e.g. {"fix":"…","machine":"…","outcome":"fixed"}.');
  const limit = await consumeLimit('bench_report', String(user.id));
  if (!limit.ok) {
    const minutes = Math.ceil(limit.retryAfterSeconds / 60);
    const response = apiError(
      'too_many_requests',
      `You have saved many bench reports in a short time. Try again in about ${minutes} minutes.`,
    );
    response.headers.set('Retry-After', String(limit.retryAfterSeconds));
    return response;
  }
  const parsed = benchReportInputSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the bench report are not valid.', fieldErrors(parsed.error));
  const saved = await saveBenchReport(user.id, parsed.data);
  if (!saved.ok) return apiError(saved.code, saved.message, saved.fields);
  return json({ report: saved.report }, { status: saved.report.created ? 201 : 200, cache: 'private' });
};
