// Behind https (PUBLIC_ORIGIN), the session cookie is Secure with the __Secure- prefix, and it still works.
// A second server of our own, started with an https public address; TLS itself ends at the proxy in
// production, so the test speaks plain http to it as such a proxy would.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { startServer } from '../support/server';
import { INTEGRATION_PORT } from '../support/test-env';
import { createUser, postForm, uniqueClientIp, type TestUser } from '../support/sign-in';

const port = INTEGRATION_PORT + 7;
const base = `http://127.0.0.1:${port}`;
const knex = testDb();
let stop: () => Promise<void>;
let member: TestUser;

beforeAll(async () => {
  stop = await startServer(port, { PUBLIC_ORIGIN: 'https://bench.example.test' });
  member = await createUser(knex, { tag: 'secure-cookie' });
}, 60_000);
afterAll(async () => {
  await stop?.();
  await knex.destroy();
});

describe('session cookie over https', () => {
  it('is Secure, HttpOnly, SameSite=Lax and carries the __Secure- prefix', async () => {
    const res = await postForm(
      base,
      '/sign-in',
      { intent: 'password', email: member.email, password: member.password, next: '/' },
      { ip: uniqueClientIp() },
    );
    expect(res.status).toBe(303);
    const cookies = res.headers.getSetCookie();
    const session = cookies.find((c) => c.startsWith('__Secure-authjs.session-token='));
    expect(session).toBeDefined();
    expect(session).toMatch(/;\s*Secure/i);
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
    expect(cookies.some((c) => c.startsWith('authjs.session-token='))).toBe(false);

    const cookie = session!.split(';')[0]!;
    const account = await fetch(`${base}/api/v1/account`, { headers: { cookie } });
    expect(account.status).toBe(200);
  });
});
