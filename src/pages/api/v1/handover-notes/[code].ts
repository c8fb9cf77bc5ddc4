// GET /api/v1/handover-notes/:code: the public note (410 once revoked). DELETE, or POST from a form: revoke your own.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { apiError, json, seeOther } from '@/server/http/responses';
import { check, consume, requestClientKey } from '@/server/http/rate-limit';
import { respond } from '@/server/http/result';
import { findPublicNote, revokeNote } from '@/server/bench-work/handover-notes';

export const GET: APIRoute = async (context) => {
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
