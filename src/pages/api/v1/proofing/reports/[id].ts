// POST /api/v1/proofing/reports/:id: a moderator resolves or dismisses an open report.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors } from '@/server/http/responses';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { closeReport } from '@/server/fixes/reports';
import { resolutionSchema } from '@/lib/schemas/report-resolution';
import { respond, refuse } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'moderate')) return apiError('forbidden', 'Only moderators handle reports.');
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such report.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const body = resolutionSchema.safeParse(input.data);
  const back = '/proofing#reports';
  if (!body.success) return answer(refuse('bad_request', 'The resolution is not valid.', fieldErrors(body.error)), input, { back });
  return answer(await closeReport(user, id, body.data), input, { back, done: '/proofing?report=closed#reports' });
};
