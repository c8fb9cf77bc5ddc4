// POST /api/v1/handover-notes: create a hand-over note pinned to a proofed revision. GET: your own notes.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { consumeLimit, readBenchBody } from '@/server/bench-work/bench-reports';
import { createHandoverNote, getOwnNote, listOwnNotes } from '@/server/bench-work/handover-notes';
import { handoverNoteInputSchema } from '@/lib/schemas/bench-work';

export const GET: APIRoute = async ({ locals }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to see your hand-over notes.');
  if (!can(user, 'write_handover_note')) return apiError('forbidden', 'Confirm your e-mail address first.');
  return json({ notes: await listOwnNotes(user.id) }, { cache: 'private' });
};

export const POST: APIRoute = async ({ locals, request }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to write a hand-over note.');
  if (!can(user, 'write_handover_note')) return apiError('forbidden', 'Confirm your e-mail address before you write hand-over notes.');
  const limit = await consumeLimit('note_create', String(user.id));
  if (!limit.ok) {
    const response = apiError('too_many_requests', 'You have written many hand-over notes in a short time. Try again later.');
    response.headers.set('Retry-After', String(limit.retryAfterSeconds));
    return response;
  }
  const body = await readBenchBody(request);
  if (body.kind === 'error') return body.response;
  if (body.kind !== 'json')
    return apiError('unsupported_media_type', 'Send the note as JSON; the form on /notes/new posts to its own page.');
  const parsed = handoverNoteInputSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the note are not valid.', fieldErrors(parsed.error));
  const created = await createHandoverNote({ id: user.id, shopName: user.shopName }, parsed.data);
  if (!created.ok) return apiError(created.code, created.message, created.fields);
  return json({ note: await getOwnNote(user.id, created.code) }, { status: 201, cache: 'private' });
};
