// POST /api/v1/revisions/:id/amend: a new draft continuing a returned (or waiting) revision; the original stays as it is.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError } from '@/server/http/responses';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { amendRevision } from '@/server/writing/submit';
import { respond, succeed } from '@/server/http/result';
import { editorPath } from '@/server/writing/paths';
import { localPathOr } from '@/lib/local-path';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'write_fix')) return apiError('forbidden', 'Confirm your e-mail address to write fixes.');
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such revision.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const outcome = await amendRevision(user, id);
  if (!outcome.ok)
    return answer(outcome, input, { back: localPathOr((input.data as Record<string, unknown> | null)?.back, '/write/mine') });
  const path = editorPath(outcome.value.revision);
  return answer(succeed({ ...outcome.value, editorPath: path }), input, { status: 201, back: '/write/mine', done: path });
};
