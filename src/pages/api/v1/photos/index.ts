// POST /api/v1/photos: one photo (multipart: file, alt, caption) → 202 with its id, pending until its renditions exist.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError, json } from '@/server/http/responses';
import { db } from '@/server/core/db';
import { takeInPhoto } from '@/server/photos/intake';
import { readPhotoUpload } from '@/server/photos/multipart';
import { kickPhotoWork } from '@/server/photos/worker';
import { requireUser } from '@/server/http/endpoint';
import { respond } from '@/server/http/result';

export const POST: APIRoute = async ({ request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'upload_photo')) return apiError('forbidden', 'Confirm your e-mail address to upload photos.');
  const upload = await readPhotoUpload(request);
  if (!upload.ok) return respond(upload);
  const outcome = await takeInPhoto(db(), user, upload.value.bytes, upload.value.fields);
  if (!outcome.ok) return respond(outcome);
  // Renditions are made after the answer: a large photo takes seconds to resize, the writer should not wait for it.
  setImmediate(() => void kickPhotoWork());
  return json({ photo: outcome.value }, { status: 202, cache: 'private', headers: { Location: `/api/v1/photos/${outcome.value.id}` } });
};
