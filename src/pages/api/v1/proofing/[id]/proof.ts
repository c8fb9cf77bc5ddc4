// POST /api/v1/proofing/:id/proof: a moderator proofs a waiting revision; it goes live. Never the moderator's own.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError } from '@/server/http/responses';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { proofRevision } from '@/server/proofing/decisions';
import { respond } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'proof')) return apiError('forbidden', 'Only moderators proof revisions.');
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such revision.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const note = (input.data as Record<string, unknown> | null)?.note ?? '';
  return answer(await proofRevision(user, id, note), input, { back: `/proofing/${id}`, done: '/proofing?proofed=1' });
};
