// Accounts for tests: made straight in the test database, signed in through the real /sign-in form.
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { hashPassword } from '../../src/server/auth/passwords';
import type { Role } from '../../src/lib/permissions';

/** The seeded demo accounts' password. */
export const DEMO_PASSWORD = 'bench-demo-2026';
/** Long and unrelated words: zxcvbn scores it 4. */
export const STRONG_PASSWORD = 'copper-idler-lantern-brisk-47';

export function uniqueEmail(tag: string): string {
  return `acc-${tag}-${randomBytes(5).toString('hex')}@example.test`;
}

/** A client address of its own (RFC 3849 documentation prefix), so rate limits of one test never touch another. */
export function uniqueClientIp(): string {
  const b = randomBytes(6).toString('hex');
  return `2001:db8:${b.slice(0, 4)}:${b.slice(4, 8)}::${b.slice(8, 12)}`;
}

export interface TestUser {
  id: number;
  email: string;
  password: string;
  name: string;
}

export async function createUser(
  knex: Knex,
  options: { role?: Role; verified?: boolean; suspended?: boolean; tag?: string; password?: string; email?: string } = {},
): Promise<TestUser> {
  const email = options.email ?? uniqueEmail(options.tag ?? options.role ?? 'member');
  const password = options.password ?? STRONG_PASSWORD;
  const name = `Test ${options.tag ?? options.role ?? 'member'} ${email.slice(4, 14)}`;
  const [row] = await knex('users')
    .insert({
      email,
      name,
      role: options.role ?? 'member',
      password_hash: await hashPassword(password),
      emailVerified: options.verified === false ? null : new Date(),
      suspended_at: options.suspended ? new Date() : null,
      suspended_reason: options.suspended ? 'test suspension' : null,
    })
    .returning<{ id: number }[]>('id');
  return { id: row!.id, email, password, name };
}

/** A same-origin form post, as a browser sends it. */
export function postForm(
  base: string,
  path: string,
  fields: Record<string, string>,
  options: { cookie?: string; origin?: string | null; ip?: string } = {},
): Promise<Response> {
  const headers: Record<string, string> = { 'content-type': 'application/x-www-form-urlencoded' };
  if (options.origin !== null) headers.origin = options.origin ?? base;
  if (options.cookie) headers.cookie = options.cookie;
  if (options.ip) headers['x-forwarded-for'] = options.ip;
  return fetch(`${base}${path}`, { method: 'POST', headers, body: new URLSearchParams(fields), redirect: 'manual' });
}

function isDeletion(setCookie: string): boolean {
  return /Expires=Thu, 01 Jan 1970/i.test(setCookie) || /Max-Age=0\b/i.test(setCookie);
}

/** The cookies a response sets, as a Cookie header value (deleted cookies left out). */
export function cookiesFrom(response: Response): string {
  return response.headers
    .getSetCookie()
    .filter((cookie) => !isDeletion(cookie))
    .map((cookie) => cookie.split(';')[0] ?? '')
    .filter((pair) => pair !== '' && !pair.endsWith('='))
    .join('; ');
}

/** Whether a response tells the browser to forget its session cookie. */
export function clearsSession(response: Response): boolean {
  return response.headers.getSetCookie().some((cookie) => cookie.startsWith('authjs.session-token=') && isDeletion(cookie));
}

/** Signs in with the password form; returns the Cookie header that carries the session. */
export async function signIn(base: string, email: string, password: string, ip?: string): Promise<string> {
  const response = await postForm(base, '/sign-in', { intent: 'password', email, password, next: '/' }, { ip: ip ?? uniqueClientIp() });
  if (response.status !== 303)
    throw new Error(`Signing in as ${email} answered ${response.status}: ${(await response.text()).slice(0, 300)}`);
  const cookie = cookiesFrom(response);
  if (!cookie.includes('authjs.session-token')) throw new Error(`Signing in as ${email} set no session cookie`);
  return cookie;
}
