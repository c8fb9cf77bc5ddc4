// POST /api/v1/drafts/:id/discard: the writer gives up their draft from a plain form (the list of their revisions).
import type { APIRoute } from 'astro';
import { apiError } from '@/server/http/responses';
import { discardDraft } from '@/server/writing/drafts';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { respond } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such draft among yours.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  return answer(await discardDraft(user, id), input, { back: '/write/mine', done: '/write/mine?discarded=1' });
};
