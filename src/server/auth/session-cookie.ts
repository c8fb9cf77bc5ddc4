// The Auth.js session cookie: its name, reading the signed-in user id from it, and clearing it.
import { getToken } from '@auth/core/jwt';
import type { AstroCookies } from 'astro';
import { config } from '../core/config';

/** Secure cookies (and their __Secure- prefix) whenever the public address is https. */
export function useSecureCookies(): boolean {
  return config().PUBLIC_ORIGIN.startsWith('https:');
}

export function sessionCookieName(secure: boolean = useSecureCookies()): string {
  return `${secure ? '__Secure-' : ''}authjs.session-token`;
}

/** A tampered or expired cookie is routine: getToken's own console logging would only be noise. */
const quiet = { error: (): void => {}, warn: (): void => {}, debug: (): void => {} };

export interface SessionClaims {
  userId: number;
  /** When the member signed in, in milliseconds (our authAt claim; the JWT's iat has whole seconds only). */
  signedInAtMs: number | undefined;
}

/**
 * Decrypted session tokens by the Cookie header that carried them, until the token's own expiry: decrypting derives
 * a key (HKDF) and opens a JWE on every request, a noticeable share of a signed-in autosave. The same header always
 * decrypts to the same claims, so keeping them changes nothing but the cost; whether the member may still act is
 * read from the database on every request (loadSessionUser), never from here. Bounded, oldest out first.
 */
const decrypted = new Map<string, { claims: SessionClaims; expiresAtMs: number }>();
const DECRYPTED_LIMIT = 1000;

/** The user id from a valid, unexpired session token in the Cookie header; null otherwise. */
export async function readSessionClaims(cookieHeader: string | null): Promise<SessionClaims | null> {
  const secret = config().AUTH_SECRET;
  if (!cookieHeader || !secret) return null;
  const name = sessionCookieName();
  if (!cookieHeader.includes(name)) return null;
  const known = decrypted.get(cookieHeader);
  if (known && known.expiresAtMs > Date.now()) return known.claims;
  if (known) decrypted.delete(cookieHeader);
  // Only the cookie: a bearer header is not a way in.
  const req = new Request('http://session.invalid/', { headers: { cookie: cookieHeader } });
  const token = await getToken({ req, secret, secureCookie: useSecureCookies(), cookieName: name, salt: name, logger: quiet });
  const userId = Number(token?.sub);
  if (!token || !Number.isInteger(userId) || userId <= 0) return null;
  const claims = { userId, signedInAtMs: signedInAt(token) };
  if (typeof token.exp === 'number') {
    if (decrypted.size >= DECRYPTED_LIMIT) decrypted.delete(decrypted.keys().next().value!);
    decrypted.set(cookieHeader, { claims, expiresAtMs: token.exp * 1000 });
  }
  return claims;
}

/** The sign-in time a token carries: our millisecond claim, else the JWT's whole-second iat. */
export function signedInAt(token: { authAt?: unknown; iat?: unknown }): number | undefined {
  if (typeof token.authAt === 'number') return token.authAt;
  return typeof token.iat === 'number' ? token.iat * 1000 : undefined;
}

/** Removes the session cookie and any chunks of it, so a signed-out browser stops sending it. */
export function clearSessionCookies(cookies: AstroCookies, cookieHeader: string | null): void {
  const name = sessionCookieName();
  const present = (cookieHeader ?? '')
    .split(';')
    .map((part) => part.trim().split('=')[0] ?? '')
    .filter((cookie) => cookie === name || cookie.startsWith(`${name}.`));
  for (const cookie of new Set([name, ...present])) {
    cookies.delete(cookie, { path: '/', httpOnly: true, sameSite: 'lax', secure: useSecureCookies() });
  }
}
