// POST /api/v1/bench-reports: record or change a bench report (JSON, or the fix page's plain form). GET: your own.
import type { APIRoute } from 'astro';
import { z } from 'zod';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json, parseSearchParams, type ErrorCode } from '@/server/http';
import { benchReportFromForm, consumeLimit, listOwnBenchReports, readBenchBody, saveBenchReport } from '@/server/bench-reports';
import { benchReportInputSchema, safeBackPath, seeOther, withBenchEcho, withNotice } from '@/lib/schemas/bench-work';
import { slugSchema } from '@/lib/schemas/slug';

const listQuery = z.object({ fix: slugSchema.optional() });

export const GET: APIRoute = async ({ locals, url }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to see your bench reports.');
  const query = parseSearchParams(listQuery, url);
  if (!query.ok) return query.response;
  return json({ reports: await listOwnBenchReports(user.id, query.data.fix) }, { cache: 'private' });
};

/** Which message the fix page shows after a form post that could not be saved. */
function formProblem(fields: Record<string, string[]>): string {
  if (fields.heldDays) return 'need_days';
  if (fields.machine) return 'bad_machine';
  if (fields.revision) return 'bad_revision';
  return 'invalid';
}

export const POST: APIRoute = async ({ locals, request }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to record a bench report.');
  if (!can(user, 'bench_report')) return apiError('forbidden', 'Confirm your e-mail address before you record bench reports.');
  const body = await readBenchBody(request);
  if (body.kind === 'error') return body.response;
  const fromForm = body.kind === 'form';
  const back = fromForm ? safeBackPath(body.form.get('back'), '/') : '/';
  // A form goes back to its page with a message code; the API answers in the one error shape.
  const refuse = (code: ErrorCode, message: string, fields: Record<string, string[]> | undefined, notice: string): Response =>
    body.kind === 'form' ? seeOther(withBenchEcho(withNotice(back, 'bench', notice), body.form)) : apiError(code, message, fields);

  const limit = await consumeLimit('bench_report', String(user.id));
  if (!limit.ok) {
    const minutes = Math.ceil(limit.retryAfterSeconds / 60);
    const response = refuse(
      'too_many_requests',
      `You have saved many bench reports in a short time. Try again in about ${minutes} minutes.`,
      undefined,
      'rate_limited',
    );
    response.headers.set('Retry-After', String(limit.retryAfterSeconds));
    return response;
  }
  const parsed = benchReportInputSchema.safeParse(fromForm ? benchReportFromForm(body.form) : body.data);
  if (!parsed.success) {
    const fields = fieldErrors(parsed.error);
    return refuse('bad_request', 'Some fields of the bench report are not valid.', fields, formProblem(fields));
  }
  const saved = await saveBenchReport(user.id, parsed.data);
  if (!saved.ok) return refuse(saved.code, saved.message, saved.fields, saved.fields ? formProblem(saved.fields) : saved.code);
  if (fromForm) return seeOther(withNotice(back, 'bench', saved.report.counted ? 'saved' : 'saved_own'));
  return json({ report: saved.report }, { status: saved.report.created ? 201 : 200, cache: 'private' });
};
