// POST /api/v1/drafts/:id/submit: sends the draft to the proofing desk (409 with both versions on a stale base).
import type { APIRoute } from 'astro';
import { draftSubmitBodySchema as bodySchema } from '@/server/openapi/inputs';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors } from '@/server/http/responses';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { submitDraft } from '@/server/writing/submit';
import { respond } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'write_fix')) return apiError('forbidden', 'Confirm your e-mail address to write fixes.');
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such draft among yours.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const body = bodySchema.safeParse(input.data);
  if (!body.success) return apiError('bad_request', 'The request is not valid.', fieldErrors(body.error));
  const outcome = await submitDraft(user, id, body.data.values === undefined ? {} : { values: body.data.values });
  return answer(outcome, input, { back: '/write/mine', done: '/write/mine?submitted=1' });
};
