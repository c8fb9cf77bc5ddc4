// Signing in and out through the built server: cookies, one message for every failure, links, rate limits, origin check.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { linkIn, mailsTo, waitForMail } from '../support/mail';
import { clearsSession, cookiesFrom, createUser, postForm, signIn, uniqueClientIp, uniqueEmail, type TestUser } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let member: TestUser;

beforeAll(async () => {
  member = await createUser(knex, { tag: 'signin' });
});
afterAll(() => knex.destroy());

function passwordForm(email: string, password: string, ip = uniqueClientIp(), next = '/'): Promise<Response> {
  return postForm(base, '/sign-in', { intent: 'password', email, password, next }, { ip });
}

function linkForm(email: string, ip = uniqueClientIp()): Promise<Response> {
  return postForm(base, '/sign-in', { intent: 'link', email }, { ip });
}

async function medianMs(run: () => Promise<unknown>, times: number): Promise<number> {
  const spans: number[] = [];
  for (let i = 0; i < times; i++) {
    const start = performance.now();
    await run();
    spans.push(performance.now() - start);
  }
  return spans.sort((a, b) => a - b)[Math.floor(times / 2)]!;
}

describe('password sign-in', () => {
  it('sets an HttpOnly, SameSite=Lax session cookie and goes to the page asked for', async () => {
    const res = await passwordForm(member.email, member.password, uniqueClientIp(), '/machines');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('/machines');
    const session = res.headers.getSetCookie().find((c) => c.startsWith('authjs.session-token='));
    expect(session).toBeDefined();
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
    // PUBLIC_ORIGIN is http here, so not Secure; over https Auth.js adds Secure and the __Secure- prefix.
    expect(session).not.toMatch(/;\s*Secure/i);
    expect(res.headers.get('cache-control')).toBe('private, no-store');
  });

  it('never goes to another site after signing in', async () => {
    const res = await passwordForm(member.email, member.password, uniqueClientIp(), '//elsewhere.example/steal');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('/');
  });

  it('gives one answer for an unknown address and for a wrong password', async () => {
    const unknown = await passwordForm(uniqueEmail('nobody'), 'some-password-here');
    const wrong = await passwordForm(member.email, 'not-the-password-at-all');
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    const message = 'That e-mail address and password do not match an account.';
    expect(await unknown.text()).toContain(message);
    expect(await wrong.text()).toContain(message);
  });

  it('spends about as long on an unknown address as on a wrong password (a decoy hash is checked)', async () => {
    const unknownMs = await medianMs(() => passwordForm(uniqueEmail('timing'), 'some-password-here'), 5);
    const wrongMs = await medianMs(() => passwordForm(member.email, 'not-the-password-at-all'), 5);
    // Without the decoy an unknown address skips argon2 (tens of milliseconds) and answers several times faster.
    expect(unknownMs / wrongMs).toBeGreaterThan(0.5);
  });

  it('answers missing fields with field messages', async () => {
    const res = await postForm(base, '/sign-in', { intent: 'password', email: '', password: '' }, { ip: uniqueClientIp() });
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toContain('Enter your e-mail address.');
    expect(html).toContain('Enter your password.');
  });

  it('tells a suspended member with the right password that the account is suspended', async () => {
    const suspended = await createUser(knex, { suspended: true, tag: 'suspended-signin' });
    const res = await passwordForm(suspended.email, suspended.password);
    expect(res.status).toBe(403);
    expect(await res.text()).toContain('This account is suspended');
    expect(cookiesFrom(res)).not.toContain('authjs.session-token');
  });

  it('answers 429 after 8 failures for one account, even with the right password, from any address', async () => {
    const target = await createUser(knex, { tag: 'bruteforce' });
    const statuses: number[] = [];
    for (let i = 0; i < 8; i++) statuses.push((await passwordForm(target.email, `wrong-guess-${i}-abcdef`)).status);
    expect(statuses).toEqual(Array(8).fill(401));
    const blocked = await passwordForm(target.email, target.password);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  it('answers 429 after 30 failures from one address across many accounts', async () => {
    const ip = uniqueClientIp();
    for (let i = 0; i < 30; i++) expect((await passwordForm(uniqueEmail('spray'), 'wrong-guess-abcdef', ip)).status).toBe(401);
    expect((await passwordForm(member.email, member.password, ip)).status).toBe(429);
    // Another address is not held up.
    expect((await passwordForm(member.email, member.password)).status).toBe(303);
  });

  it('counts the nearest proxy’s address, not the first X-Forwarded-For value a client can write', async () => {
    const realClient = uniqueClientIp();
    for (let i = 0; i < 30; i++) {
      // A client rotating made-up addresses at the front of the header, behind one trusted proxy.
      const spoofed = `${uniqueClientIp()}, ${realClient}`;
      await passwordForm(uniqueEmail('rotate'), 'wrong-guess-abcdef', spoofed);
    }
    expect((await passwordForm(member.email, member.password, `${uniqueClientIp()}, ${realClient}`)).status).toBe(429);
  });
});

describe('sign-in link', () => {
  it('gives the same answer for a known and an unknown address', async () => {
    const known = await linkForm(member.email);
    const unknownEmail = uniqueEmail('nolink');
    const unknown = await linkForm(unknownEmail);
    expect(known.status).toBe(303);
    expect(unknown.status).toBe(303);
    expect(known.headers.get('location')).toBe('/sign-in/link-sent');
    expect(unknown.headers.get('location')).toBe('/sign-in/link-sent');
    // The owner of the unknown address gets a note, not a link.
    const note = await waitForMail(INTEGRATION_PORT, unknownEmail);
    expect(note.subject).toBe('About your request to Benchlore');
    expect(note.text).not.toContain('/sign-in/link');
  });

  it('signs in once with the e-mailed link and refuses it the second time', async () => {
    const user = await createUser(knex, { tag: 'link' });
    expect((await linkForm(user.email)).status).toBe(303);
    const mail = await waitForMail(INTEGRATION_PORT, user.email, { subject: 'sign-in link' });
    const landing = linkIn(mail, '/sign-in/link');
    // The landing page only shows a button: following the link alone signs nobody in.
    const page = await fetch(`${base}${landing.pathname}${landing.search}`);
    expect(page.status).toBe(200);
    expect(page.headers.getSetCookie()).toEqual([]);
    const html = await page.text();
    expect(html).toContain('action="/api/auth/callback/nodemailer"');

    const params = new URLSearchParams({
      token: landing.searchParams.get('token')!,
      email: landing.searchParams.get('email')!,
      callbackUrl: landing.searchParams.get('callbackUrl')!,
    });
    const first = await fetch(`${base}/api/auth/callback/nodemailer?${params}`, { redirect: 'manual' });
    expect(first.status).toBe(302);
    const cookie = cookiesFrom(first);
    expect(cookie).toContain('authjs.session-token=');
    const me = await (await fetch(`${base}/api/v1/account`, { headers: { cookie } })).json();
    expect(me.user.email).toBe(user.email);

    const second = await fetch(`${base}/api/auth/callback/nodemailer?${params}`, { redirect: 'manual' });
    expect(second.headers.get('location')).toContain('/sign-in/problem?error=Verification');
    const problem = await fetch(`${base}/sign-in/problem?error=Verification`);
    expect(problem.status).toBe(410);
    expect(await problem.text()).toContain('Send me a new sign-in link');
  });

  it('keeps sign-in links to 15 minutes', async () => {
    const user = await createUser(knex, { tag: 'linkage' });
    await linkForm(user.email);
    const row = await knex('verification_token').where({ identifier: user.email }).first();
    const minutes = (new Date(row.expires).getTime() - Date.now()) / 60_000;
    expect(minutes).toBeGreaterThan(14);
    expect(minutes).toBeLessThanOrEqual(15);
  });

  it('sends a suspended account no link, only the suspension and its reason', async () => {
    const suspended = await createUser(knex, { suspended: true, tag: 'suspended-link' });
    expect((await linkForm(suspended.email)).status).toBe(303);
    const mail = await waitForMail(INTEGRATION_PORT, suspended.email, { subject: 'suspended' });
    expect(mail.text).toContain('The reason they gave: test suspension');
    expect(mail.text).not.toContain('/sign-in/link');
    await new Promise((resolve) => setTimeout(resolve, 600));
    expect(await mailsTo(INTEGRATION_PORT, suspended.email)).toHaveLength(1);
  });

  it('answers 429 after 4 link requests for one address in an hour', async () => {
    const email = uniqueEmail('linklimit');
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await linkForm(email)).status);
    expect(statuses).toEqual([303, 303, 303, 303, 429]);
  });

  it('answers a bad address with a field message, never an Auth.js error page', async () => {
    const res = await linkForm('no-at-sign');
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('Enter an e-mail address such as name@example.org.');
  });
});

describe('signing out and forged requests', () => {
  it('clears the session cookie on sign-out', async () => {
    const cookie = await signIn(base, member.email, member.password);
    const res = await postForm(base, '/account/sign-out', {}, { cookie });
    expect(res.status).toBe(303);
    expect(clearsSession(res)).toBe(true);
  });

  it('refuses a cross-origin form post with 403 and accepts the same form from our own origin', async () => {
    const email = uniqueEmail('crosssite');
    const fields = { name: 'Cross Site', email, password: 'copper-idler-lantern-brisk-47' };
    const forged = await postForm(base, '/sign-up', fields, { origin: 'http://elsewhere.example', ip: uniqueClientIp() });
    expect(forged.status).toBe(403);
    expect(await knex('users').where({ email }).first()).toBeUndefined();
    const noOrigin = await postForm(base, '/sign-up', fields, { origin: null, ip: uniqueClientIp() });
    expect(noOrigin.status).toBe(403);
    const same = await postForm(base, '/sign-up', fields, { ip: uniqueClientIp() });
    expect(same.status).toBe(303);
    expect(await knex('users').where({ email }).first()).toBeDefined();
  });

  it('refuses posts straight to Auth.js, so nothing goes round the rate limits', async () => {
    const res = await postForm(base, '/api/auth/callback/credentials', { email: member.email, password: member.password });
    expect(res.status).toBe(405);
    expect((await res.json()).error.code).toBe('method_not_allowed');
  });

  it('keeps the security headers on sign-in pages, refusals and Auth.js answers', async () => {
    const answers = [
      await fetch(`${base}/sign-in`),
      await passwordForm(member.email, 'wrong-password-again'),
      await fetch(`${base}/api/auth/csrf`),
      await fetch(`${base}/api/v1/account`),
      await fetch(`${base}/account`, { redirect: 'manual' }),
      await fetch(`${base}/no-such-page`),
    ];
    for (const res of answers) {
      expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
      expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    }
    expect(answers[0]!.headers.get('cache-control')).toBe('private, no-store');
  });
});
