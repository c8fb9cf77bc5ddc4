// Joining and confirming an address through the built server: field messages, no enumeration, single-use expiring links.
import { afterAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { countAfterPause, linkIn, waitForMail } from '../support/mail';
import { STRONG_PASSWORD, cookiesFrom, postForm, signIn, uniqueClientIp, uniqueEmail } from '../support/sign-in';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
afterAll(() => knex.destroy());

function signUp(fields: Record<string, string>, ip = uniqueClientIp()): Promise<Response> {
  return postForm(base, '/sign-up', fields, { ip });
}

/** The messages listed under one field of a rendered form. */
function fieldMessages(html: string, field: string): string[] {
  const list = html.match(new RegExp(`<ul id="${field}-error"[^>]*>([\\s\\S]*?)</ul>`));
  return list ? [...list[1]!.matchAll(/<li>([^<]*)<\/li>/g)].map((m) => m[1]!) : [];
}

describe('sign-up form', () => {
  it('answers empty fields with a message under each one and a 400, never a 500', async () => {
    const res = await signUp({});
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(fieldMessages(html, 'name')).toEqual(['Enter the name other members will see.']);
    expect(fieldMessages(html, 'email')).toEqual(['Enter your e-mail address.']);
    expect(fieldMessages(html, 'password')).toEqual(['Choose a password.']);
    // The one script is the browser check of the same schema; the form works without it.
    expect(scriptsBesideRegistration(html)).toEqual([expect.stringMatching(/type="module" src="\/_astro\/AccountFormCheck[^"]*\.js"/)]);
  });

  it('names the rule each bad value breaks and keeps what was typed, except the password', async () => {
    const res = await signUp({ name: 'X', email: 'not-an-address', password: 'short', shopName: 'y'.repeat(121) });
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(fieldMessages(html, 'name')).toEqual(['Use at least 2 characters for your name.']);
    expect(fieldMessages(html, 'email')).toEqual(['Enter an e-mail address such as name@example.org.']);
    expect(fieldMessages(html, 'password')).toEqual(['Use at least 10 characters.']);
    expect(fieldMessages(html, 'shopName')).toEqual(['Use at most 120 characters for the shop name.']);
    expect(html).toContain('value="not-an-address"');
    expect(html).not.toContain('value="short"');
  });

  it('refuses a password over 256 characters', async () => {
    const res = await signUp({ name: 'Long Password', email: uniqueEmail('long'), password: 'a1-'.repeat(90) });
    expect(res.status).toBe(400);
    expect(fieldMessages(await res.text(), 'password')).toEqual(['Use at most 256 characters.']);
  });

  it('refuses an easily guessed password with zxcvbn’s advice', async () => {
    const res = await signUp({ name: 'Weak Password', email: uniqueEmail('weak'), password: 'password123' });
    expect(res.status).toBe(400);
    const messages = fieldMessages(await res.text(), 'password');
    expect(messages[0]).toBe('This password would be easy to guess.');
    // zxcvbn-ts (language-en) warning for an entry of its common-password list.
    expect(messages).toContain('This is a commonly used password.');
  });

  it('refuses a password built from the member’s own name and address', async () => {
    const email = uniqueEmail('ownname');
    // zxcvbn alone scores "quillonmarsh" 3 or more; given the name as a user input it drops below 3.
    const res = await signUp({ name: 'Quillon Marsh', email, password: 'quillonmarsh' });
    expect(res.status).toBe(400);
    expect(fieldMessages(await res.text(), 'password')[0]).toBe('This password would be easy to guess.');
  });
});

describe('joining with an address', () => {
  it('signs a new member in at once, and never signs anyone in to an address that already has an account', async () => {
    const fresh = uniqueEmail('fresh');
    const first = await signUp({ name: 'Fresh Member', email: fresh, password: STRONG_PASSWORD });
    const again = await signUp({ name: 'Someone Else', email: fresh, password: STRONG_PASSWORD });
    expect(first.status).toBe(303);
    expect(again.status).toBe(303);
    // The same page either way, and the address typed never travels in it.
    expect(first.headers.get('location')).toBe('/sign-up/check-email');
    expect(again.headers.get('location')).toBe('/sign-up/check-email');
    const cookie = cookiesFrom(first);
    expect(cookie).toContain('authjs.session-token=');
    expect(again.headers.get('set-cookie')).toBeNull();
    const landing = await (await fetch(`${base}/sign-up/check-email`, { headers: { cookie } })).text();
    expect(landing).toContain('Welcome, Fresh Member: you are signed in.');
    expect(landing).toContain(fresh);
    const account = await fetch(`${base}/account`, { headers: { cookie }, redirect: 'manual' });
    expect(account.status).toBe(200);
    const signedOut = await (await fetch(`${base}/sign-up/check-email`)).text();
    expect(signedOut).not.toContain('you are signed in');
    // The owner hears about the second attempt; no second account exists.
    await waitForMail(INTEGRATION_PORT, fresh, { subject: 'Someone tried to join' });
    const rows = await knex('users').where({ email: fresh });
    expect(rows).toHaveLength(1);
    expect(rows[0].name).toBe('Fresh Member');
  });

  it('creates an unconfirmed member with an argon2id hash, then confirms with the e-mailed link once', async () => {
    const email = uniqueEmail('confirm');
    expect((await signUp({ name: 'Confirm Me', email, password: STRONG_PASSWORD, shopName: 'Confirm Bench' })).status).toBe(303);
    const user = await knex('users').where({ email }).first();
    expect(user.role).toBe('member');
    expect(user.emailVerified).toBeNull();
    expect(user.shop_name).toBe('Confirm Bench');
    // OWASP minimum for argon2id: m=19456 KiB, t=2, p=1, in the PHC string format.
    expect(user.password_hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);

    const mail = await waitForMail(INTEGRATION_PORT, email, { subject: 'Confirm your e-mail address' });
    expect(mail.html).toContain('Confirm my address');
    const link = linkIn(mail, '/verify');
    const token = link.searchParams.get('token')!;
    const stored = await knex('user_tokens').where({ user_id: user.id, purpose: 'verify_email' }).first();
    expect(stored.token_hash).not.toContain(token);
    // 24 hours, give or take the seconds the test took.
    const lifetimeHours = (new Date(stored.expires_at).getTime() - new Date(stored.created_at).getTime()) / 3_600_000;
    expect(lifetimeHours).toBeCloseTo(24, 2);

    const confirmed = await fetch(`${base}${link.pathname}${link.search}`);
    expect(confirmed.status).toBe(200);
    expect(await confirmed.text()).toContain('Your address is confirmed');
    expect((await knex('users').where({ id: user.id }).first()).emailVerified).not.toBeNull();

    const reused = await fetch(`${base}${link.pathname}${link.search}`);
    expect(reused.status).toBe(410);
    const reusedHtml = await reused.text();
    expect(reusedHtml).toContain('This link has already been used');
    expect(reusedHtml).toContain('href="/sign-in?next=%2Faccount"');
  });

  it('explains an expired confirmation link and points to sending a new one', async () => {
    const email = uniqueEmail('expired');
    await signUp({ name: 'Late Opener', email, password: STRONG_PASSWORD });
    const link = linkIn(await waitForMail(INTEGRATION_PORT, email), '/verify');
    const user = await knex('users').where({ email }).first();
    await knex('user_tokens')
      .where({ user_id: user.id })
      .update({ expires_at: knex.raw(`now() - interval '1 minute'`) });
    const res = await fetch(`${base}${link.pathname}${link.search}`);
    expect(res.status).toBe(410);
    const html = await res.text();
    expect(html).toContain('This link has expired');
    expect(html).toContain('send a new one from your account page');
    expect((await knex('users').where({ id: user.id }).first()).emailVerified).toBeNull();
  });

  it('answers a cut-off confirmation link with an explanation, not an error', async () => {
    const res = await fetch(`${base}/verify?token=abc`);
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('This link is incomplete');
  });

  it('lets an unconfirmed member sign in and read, but offers no writing until confirmed', async () => {
    const email = uniqueEmail('unconfirmed');
    await signUp({ name: 'Not Yet', email, password: STRONG_PASSWORD });
    const cookie = await signIn(base, email, STRONG_PASSWORD);
    const home = await fetch(`${base}/`, { headers: { cookie } });
    expect(home.status).toBe(200);
    const html = await home.text();
    expect(html).toContain('href="/account"');
    expect(html).not.toContain('Write a fix');
    const account = await (await fetch(`${base}/api/v1/account`, { headers: { cookie } })).json();
    expect(account.user.verified).toBe(false);
    expect(account.can).not.toContain('write_fix');
    expect(account.can).not.toContain('report_fix');
  });

  it('sends a fresh confirmation mail from the account page, and the old link stops working', async () => {
    const email = uniqueEmail('resend');
    await signUp({ name: 'Resend Please', email, password: STRONG_PASSWORD });
    const oldLink = linkIn(await waitForMail(INTEGRATION_PORT, email), '/verify');
    const cookie = await signIn(base, email, STRONG_PASSWORD);
    const res = await postForm(base, '/account?_action=account', { intent: 'resend-confirmation' }, { cookie, ip: uniqueClientIp() });
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('/account?notice=confirmation-sent');
    const newMail = await waitForMail(INTEGRATION_PORT, email, { count: 2 });
    const newLink = linkIn(newMail, '/verify');
    expect(newLink.href).not.toBe(oldLink.href);
    expect((await fetch(`${base}${oldLink.pathname}${oldLink.search}`)).status).toBe(410);
    expect((await fetch(`${base}${newLink.pathname}${newLink.search}`)).status).toBe(200);
  });

  it('rate-limits joining per address with a 429 and Retry-After', async () => {
    const email = uniqueEmail('limit');
    const statuses: number[] = [];
    // Three sign-ups per address per hour (src/server/http/rate-limit.ts), each from a different client.
    for (let i = 0; i < 4; i++) statuses.push((await signUp({ name: 'Limit Tester', email, password: STRONG_PASSWORD })).status);
    expect(statuses).toEqual([303, 303, 303, 429]);
    const limited = await signUp({ name: 'Limit Tester', email, password: STRONG_PASSWORD });
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(await limited.text()).toContain('Too many attempts from here');
  });

  it('sends no mail at all when the form was refused', async () => {
    const email = uniqueEmail('refused');
    await signUp({ name: 'R', email, password: STRONG_PASSWORD });
    expect(await countAfterPause(INTEGRATION_PORT, email)).toBe(0);
  });
});
