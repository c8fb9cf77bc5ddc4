// POST /api/v1/proofing/:id/return: a moderator returns a waiting revision to its author with a note (required).
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError } from '@/server/http/responses';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { returnRevision } from '@/server/proofing/decisions';
import { respond } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'proof')) return apiError('forbidden', 'Only moderators return revisions.');
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such revision.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const note = (input.data as Record<string, unknown> | null)?.note;
  return answer(await returnRevision(user, id, note), input, { back: `/proofing/${id}`, done: '/proofing?returned=1' });
};
