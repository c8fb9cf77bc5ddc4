// POST /api/v1/drafts/:id/discard: the writer gives up their draft from a plain form (the list of their revisions).
import type { APIRoute } from 'astro';
import { apiError } from '@/server/http/responses';
import { discardDraft } from '@/server/writing/drafts';
import { answer, idParam, isFailure, readInput, requireUser } from '@/server/proofing/http';
import { failureResponse } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such draft among yours.');
  const input = await readInput(request);
  if (isFailure(input)) return failureResponse(input);
  return answer(await discardDraft(user, id), input, { back: '/write/mine', done: '/write/mine?discarded=1' });
};
