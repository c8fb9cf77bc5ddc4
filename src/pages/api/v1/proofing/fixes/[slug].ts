// POST /api/v1/proofing/fixes/:slug: a moderator locks or unlocks a fix against edits, or hides or shows it.
import type { APIRoute } from 'astro';
import { can } from '@/lib/permissions';
import { slugSchema } from '@/lib/schemas/slug';
import { apiError, fieldErrors } from '@/server/http/responses';
import { setFixFlag } from '@/server/fixes/locks';
import { fixFlagSchema } from '@/lib/schemas/fix-flag';
import { answer, requireUser } from '@/server/http/endpoint';
import { readBody, writingInput } from '@/server/http/body';
import { respond, refuse } from '@/server/http/result';

export const POST: APIRoute = async ({ params, request, locals }) => {
  const user = requireUser(locals);
  if (user instanceof Response) return user;
  if (!can(user, 'lock_fix')) return apiError('forbidden', 'Only moderators lock or hide fixes.');
  const slug = slugSchema.safeParse(params.slug);
  if (!slug.success) return apiError('not_found', 'There is no such fix.');
  const read = await readBody(request, writingInput);
  if (!read.ok) return respond(read);
  const input = read.value;
  const body = fixFlagSchema.safeParse(input.data);
  // A plain form comes back to where it was sent from: the desk, or the moderation panel on the fix's history.
  const fromHistory = (input.data as { from?: unknown } | null)?.from === 'history';
  const page = fromHistory ? `/fixes/${slug.data}/history` : '/proofing';
  const anchor = fromHistory ? '#moderation' : '#fixes';
  const back = `${page}${anchor}`;
  if (!body.success) return answer(refuse('bad_request', 'Choose what to do with the fix.', fieldErrors(body.error)), input, { back });
  return answer(await setFixFlag(user, slug.data, body.data), input, { back, done: `${page}?fix=${body.data.action}${anchor}` });
};
