// GET /api/v1/handover-notes/:code: the public note (410 once revoked); with an API token, your own note with its
// version as ETag. PATCH (If-Match, required with a token): change its words. DELETE, or POST from a form: revoke your own.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError, json, seeOther } from '@/server/http/responses';
import { check, consume, requestClientKey } from '@/server/http/rate-limit';
import { respond } from '@/server/http/result';
import { findPublicNote, getOwnNote, revokeNote, updateOwnNote } from '@/server/bench-work/handover-notes';
import { readBody } from '@/server/http/body';
import { fieldErrors } from '@/server/http/responses';
import { handoverNotePatchSchema } from '@/lib/schemas/handover-note';
import { ifMatchVersion, versionTag } from '@/server/http/if-match';

export const GET: APIRoute = async (context) => {
  // A shop's program reads its own note, as written, with the version to send back in If-Match.
  if (context.locals.apiToken && context.locals.user) {
    const own = await getOwnNote(context.locals.user.id, context.params.code ?? '');
    if (!own) return apiError('not_found', 'You have no hand-over note with that code.');
    return json({ note: own }, { cache: 'private', headers: { ETag: versionTag(own.version) } });
  }
  const clientKey = requestClientKey(context);
  const limit = await check('note_miss', { ip: clientKey });
  if (!limit.ok) return respond(limit);
  const lookup = await findPublicNote(context.params.code ?? '');
  if (lookup.state === 'not_found') {
    // Only misses count: a customer opening a real note is never held up, a guesser soon is.
    await consume('note_miss', { ip: clientKey });
    return apiError('not_found', 'No hand-over note has that code. Check it against your invoice.');
  }
  if (lookup.state === 'revoked') {
    return apiError('gone', 'The repair shop has withdrawn this hand-over note.');
  }
  return json({ note: lookup.note }, { cache: 'private' });
};

export const PATCH: APIRoute = async ({ locals, params, request }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to change a note.');
  if (!can(user, 'write_handover_note')) return apiError('forbidden', 'Your account may not change notes.');
  const expected = ifMatchVersion(request, { required: locals.apiToken !== undefined });
  if (!expected.ok) return respond(expected);
  const read = await readBody(request, { json: 'benchWork' });
  if (!read.ok) return respond(read);
  if (read.value.kind !== 'json') return apiError('unsupported_media_type', 'Send the changes as JSON, e.g. { "warranty": "90 days" }.');
  const parsed = handoverNotePatchSchema.safeParse(read.value.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields of the note are not valid.', fieldErrors(parsed.error));
  const updated = await updateOwnNote(user.id, params.code ?? '', parsed.data, expected.value);
  if (!updated.ok) return respond(updated);
  return json({ note: updated.value }, { cache: 'private', headers: { ETag: versionTag(updated.value.version) } });
};

async function revoke(
  locals: App.Locals,
  code: string,
): Promise<{ status: 'revoked' | 'already_revoked' | 'not_found' } | { denied: Response }> {
  const user = locals.user;
  if (!user) return { denied: apiError('unauthorised', 'Sign in to withdraw a note.') };
  if (!can(user, 'write_handover_note')) return { denied: apiError('forbidden', 'Your account may not withdraw notes.') };
  return { status: await revokeNote(user.id, code) };
}

export const DELETE: APIRoute = async ({ locals, params }) => {
  const result = await revoke(locals, params.code ?? '');
  if ('denied' in result) return result.denied;
  // Another member's code answers exactly like an unknown one.
  if (result.status === 'not_found') return apiError('not_found', 'You have no hand-over note with that code.');
  return json({ revoked: true, alreadyRevoked: result.status === 'already_revoked' }, { cache: 'private' });
};

/** The revoke button on /notes/:code is a plain form. */
export const POST: APIRoute = async ({ locals, params }) => {
  const code = params.code ?? '';
  const result = await revoke(locals, code);
  if ('denied' in result) return result.denied;
  if (result.status === 'not_found') return apiError('not_found', 'You have no hand-over note with that code.');
  return seeOther(`/notes/${encodeURIComponent(code.toUpperCase())}?note=revoked`);
};
