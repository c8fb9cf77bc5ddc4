// GET, PUT and DELETE /api/v1/drafts/:id: read, save (autosave) and discard the writer's own draft.
import type { APIRoute } from 'astro';
import { draftSaveBodySchema as bodySchema } from '@/server/openapi/inputs';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { db } from '@/server/core/db';
import { discardDraft, saveDraft } from '@/server/writing/drafts';
import { answer, idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { respond } from '@/server/http/result';
import { loadRevision } from '@/server/writing/revisions';

export const GET: APIRoute = async ({ params, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  const id = idParam(params.id);
  const revision = id ? await loadRevision(db(), id) : null;
  if (!revision || revision.authorId !== user.id) return apiError('not_found', 'There is no such draft among yours.');
  return json({ revision, baseIsStale: revision.baseRevisionId !== revision.liveRevisionId }, { cache: 'private' });
};

export const PUT: APIRoute = async ({ params, request, locals }) => {
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
  const saveInput =
    body.data.baseRevisionId === undefined
      ? { values: body.data.values }
      : { values: body.data.values, baseRevisionId: body.data.baseRevisionId };
  return answer(await saveDraft(user, id, saveInput), { kind: 'json' }, { back: '/write' });
};

export const DELETE: APIRoute = async ({ params, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such draft among yours.');
  return answer(await discardDraft(user, id), { kind: 'json' }, { back: '/write' });
};
