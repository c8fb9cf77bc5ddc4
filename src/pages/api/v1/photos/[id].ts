// GET /api/v1/photos/:id: processing state of one's own photo; PATCH: change its alt text or caption while unpublished.
import type { APIRoute } from 'astro';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { db } from '@/server/core/db';
import { updatePhotoText } from '@/server/photos/photo-text';
import { photoRef } from '@/server/photos/photo-refs';
import { kickPhotoWork } from '@/server/photos/worker';
import { photoTextSchema } from '@/lib/schemas/photo-text';
import { idParam, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { respond } from '@/server/http/result';

export const GET: APIRoute = async ({ params, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  const id = idParam(params.id);
  const photo = id ? await photoRef(db(), id) : null;
  if (!photo || photo.ownerId !== user.id) return apiError('not_found', 'There is no such photo among yours.');
  if (photo.state === 'pending') {
    // A poll is also a nudge: if this instance restarted since the upload, the work is done now, not at the next sweep.
    void kickPhotoWork();
  }
  return json({ photo }, { cache: 'private' });
};

export const PATCH: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  const id = idParam(params.id);
  if (!id) return apiError('not_found', 'There is no such photo among yours.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const text = photoTextSchema.safeParse(input.data);
  if (!text.success) return apiError('bad_request', 'The alt text or caption is not valid.', fieldErrors(text.error));
  const outcome = await updatePhotoText(db(), user, id, text.data);
  if (!outcome.ok) return respond(outcome);
  return json({ photo: outcome.value }, { cache: 'private' });
};
