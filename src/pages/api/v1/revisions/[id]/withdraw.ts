// POST /api/v1/revisions/:id/withdraw: the author takes back a revision that waits for proofing.
import type { APIRoute } from 'astro';
import { apiError } from '@/server/http/responses';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { withdrawRevision } from '@/server/writing/submit';
import { respond } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such revision among yours.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  return answer(await withdrawRevision(user, id), input, { back: '/write/mine', done: '/write/mine?withdrawn=1' });
};
