// Who is asking: the session cookie's user, read fresh from the database; a suspended or deleted one is signed out.
import type { AstroCookies } from 'astro';
import type { SessionUser } from '@/lib/permissions';
import { clearSessionCookies, readSessionClaims, sessionCookieName } from './session-cookie';
import { loadSessionUser } from './users';

/** Requests whose session cookie was cleared on the way: their answers must not be cached. */
const clearedSessions = new WeakSet<Request>();

export function sessionWasCleared(request: Request): boolean {
  return clearedSessions.has(request);
}

export async function resolveUser(request: Request, cookies: AstroCookies): Promise<SessionUser | null> {
  const cookieHeader = request.headers.get('cookie');
  if (!cookieHeader?.includes(sessionCookieName())) return null;
  const claims = await readSessionClaims(cookieHeader);
  const lookup = claims ? await loadSessionUser(claims.userId, claims.signedInAtMs) : null;
  if (lookup?.user) return lookup.user;
  // Expired, tampered with, suspended, deleted or ended elsewhere: stop the browser sending it.
  clearSessionCookies(cookies, cookieHeader);
  clearedSessions.add(request);
  return null;
}
