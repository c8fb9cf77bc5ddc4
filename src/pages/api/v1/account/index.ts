// The signed-in account as JSON: who you are and what you may do; PATCH changes the name and shop name.
import type { APIRoute } from 'astro';
import { allowedActions } from '@/lib/permissions';
import { profileSchema } from '@/lib/schemas/profile';
import { apiError, fieldErrors, json } from '@/server/http/responses';
import { readBody } from '@/server/http/body';
import { respond } from '@/server/http/result';
import { updateProfile } from '@/server/auth/users';

export const GET: APIRoute = ({ locals }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to do this.');
  return json({ user, can: allowedActions(user) }, { cache: 'private' });
};

export const PATCH: APIRoute = async ({ locals, request }) => {
  const user = locals.user;
  if (!user) return apiError('unauthorised', 'Sign in to do this.');
  const read = await readBody(request, { json: 'account' });
  if (!read.ok) return respond(read);
  // Only the fields sent are changed; "shopName": "" or null removes the shop name.
  const parsed = profileSchema.partial().strict().safeParse(read.value.data);
  if (!parsed.success) return apiError('bad_request', 'Some fields are not valid.', fieldErrors(parsed.error));
  const changes = {
    ...(parsed.data.name !== undefined ? { name: parsed.data.name } : {}),
    ...('shopName' in parsed.data ? { shopName: parsed.data.shopName ?? null } : {}),
  };
  await updateProfile(user.id, changes);
  const updated = { ...user, ...changes };
  return json({ user: updated, can: allowedActions(updated) }, { cache: 'private' });
};
