// POST /api/v1/fixes/:slug/reports: a verified member reports a fix (wrong, dangerous, spam, duplicate) with a reason.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { slugSchema } from '@/lib/schemas/slug';
import { apiError, fieldErrors } from '@/server/http/responses';
import { answer, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { createReport } from '@/server/fixes/reports';
import { reportInputSchema } from '@/lib/schemas/fix-report-input';
import { respond, refuse } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'report_fix')) return apiError('forbidden', 'Confirm your e-mail address to report a fix.');
  const slug = slugSchema.safeParse(params.slug);
  if (!slug.success) return apiError('not_found', 'There is no such fix.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const back = `/fixes/${slug.data}#report`;
  const body = reportInputSchema.safeParse(input.data);
  if (!body.success)
    return answer(refuse('bad_request', 'The report is not complete.', fieldErrors(body.error)), input, {
      back,
      errorParam: 'report_error',
    });
  return answer(await createReport(user, slug.data, body.data), input, {
    status: 201,
    back,
    done: `/fixes/${slug.data}?report=sent#report`,
    errorParam: 'report_error',
  });
};
