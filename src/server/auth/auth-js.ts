// Calls Auth.js in-process from our own sign-in page: a CSRF pair, then the credentials or e-mail step.
import { Auth } from '@auth/core';
import authConfig from '../../../auth.config';

/** auth-astro's own handler strips `prefix` the same way before calling Auth(). */
function authOptions(): Omit<typeof authConfig, 'prefix'> {
  const { prefix: _prefix, ...options } = authConfig;
  return options;
}

function authUrl(origin: string, action: string): URL {
  return new URL(`${authConfig.prefix ?? '/api/auth'}/${action}`, origin);
}

/** The cookie part ("name=value") of each Set-Cookie header. */
function cookiePairs(response: Response): string {
  return response.headers
    .getSetCookie()
    .map((cookie) => cookie.split(';')[0] ?? '')
    .filter((pair) => pair !== '')
    .join('; ');
}

async function csrfPair(origin: string): Promise<{ token: string; cookie: string }> {
  const response = await Auth(new Request(authUrl(origin, 'csrf')), authOptions());
  const body = (await response.json()) as { csrfToken?: string };
  if (!body.csrfToken) throw new Error('Auth.js gave no CSRF token');
  return { token: body.csrfToken, cookie: cookiePairs(response) };
}

async function postToAuth(origin: string, action: string, fields: Record<string, string>): Promise<Response> {
  const csrf = await csrfPair(origin);
  const body = new URLSearchParams({ ...fields, csrfToken: csrf.token });
  return Auth(
    new Request(authUrl(origin, action), {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: csrf.cookie },
      body,
    }),
    authOptions(),
  );
}

export type AuthOutcome = { ok: true; location: string; setCookies: string[] } | { ok: false; error: string; code: string | null };

function outcomeOf(response: Response, origin: string): AuthOutcome {
  const location = new URL(response.headers.get('location') ?? '/', origin);
  const error = location.searchParams.get('error');
  if (error) return { ok: false, error, code: location.searchParams.get('code') };
  // Only our own origin: Auth.js's redirect callback has already refused others.
  const path = location.origin === new URL(origin).origin ? `${location.pathname}${location.search}` : '/';
  return { ok: true, location: path, setCookies: response.headers.getSetCookie().filter((cookie) => !cookie.includes('csrf-token')) };
}

export async function signInWithPassword(origin: string, email: string, password: string, next: string): Promise<AuthOutcome> {
  return outcomeOf(await postToAuth(origin, 'callback/credentials', { email, password, callbackUrl: next }), origin);
}

export async function requestSignInLink(origin: string, email: string, next: string): Promise<AuthOutcome> {
  return outcomeOf(await postToAuth(origin, 'signin/nodemailer', { email, callbackUrl: next }), origin);
}
