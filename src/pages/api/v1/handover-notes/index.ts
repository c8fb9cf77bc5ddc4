// POST /api/v1/handover-notes: create a hand-over note pinned to a proofed revision. GET: your own notes.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { consume } from '@/server/http/rate-limit';
import { respond } from '@/server/http/result';
import { createHandoverNote, getOwnNote, listOwnNotes } from '@/server/bench-work/handover-notes';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';

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
  const limit = await consume('note_create', { account: String(user.id) });
  if (!limit.ok) return respond(limit);
  const read = await readBody(request, { json: 'benchWork', form: 'benchWork' });
  if (!read.ok) return respond(read);
  const body = read.value;
  if (body.kind !== 'json')
    return apiError('unsupported_media_type', 'Send the note as JSON; the form on /notes/new posts to its own page.');
  const parsed = handoverNoteInputSchema.safeParse(body.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the note are not valid.', fieldErrors(parsed.error));
  const created = await createHandoverNote({ id: user.id, shopName: user.shopName }, parsed.data);
  if (!created.ok) return respond(created);
  return json({ note: await getOwnNote(user.id, created.code) }, { status: 201, cache: 'private' });
};
