// Auth.js callbacks: who may finish signing in, and what the session token carries (the user id only).
import type { Account, User } from '@auth/core/types';
import type { JWT } from '@auth/core/jwt';
import { signedInAt } from './session-cookie';
import { findUserByEmail, loadSessionUser } from './users';

interface SignInParams {
  user: User;
  account?: Account | null;
  email?: { verificationRequest?: boolean };
}

export async function allowSignIn({ user, account, email }: SignInParams): Promise<boolean> {
  // authorize() has already checked the password and the account.
  if (account?.provider === 'credentials') return true;
  // Asking for a link answers the same for every address; sendSignInLink decides what, if anything, to send.
  if (email?.verificationRequest) return true;
  // Following a link: only an existing, active account signs in (a link never creates one).
  if (!user.email) return false;
  const row = await findUserByEmail(user.email);
  return Boolean(row && !row.suspended_at);
}

interface JwtParams {
  token: JWT;
  user?: User | null;
}

/**
 * On sign-in the token gets the user id and nothing else. When Auth.js re-issues a token (its session
 * endpoint), the account must still be active and the token newer than any "sign out everywhere".
 */
export async function refreshToken({ token, user }: JwtParams): Promise<JWT | null> {
  // authAt: the sign-in moment to the millisecond, compared with "sign out everywhere" and password changes.
  if (user?.id) return { sub: String(user.id), authAt: Date.now() };
  const userId = Number(token.sub);
  if (!Number.isInteger(userId) || userId <= 0) return null;
  const authAt = signedInAt(token);
  const lookup = await loadSessionUser(userId, authAt);
  return lookup.user ? { sub: String(userId), authAt } : null;
}
