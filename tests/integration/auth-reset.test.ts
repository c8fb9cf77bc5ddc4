// Choosing a new password by e-mail through the built server: same answer for every address, one-hour single-use links.
import { afterAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { linkIn, waitForMail } from '../support/mail';
import { createUser, postForm, signIn, uniqueClientIp, uniqueEmail } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
afterAll(() => knex.destroy());

const NEW_PASSWORD = 'walnut-capstan-ferrite-ochre-19';

function askForReset(email: string, ip = uniqueClientIp()): Promise<Response> {
  return postForm(base, '/reset', { email }, { ip });
}

async function resetLink(email: string): Promise<URL> {
  expect((await askForReset(email)).status).toBe(303);
  return linkIn(await waitForMail(INTEGRATION_PORT, email, { subject: 'Choose a new Benchlore password' }), '/reset/password');
}

describe('asking for a reset link', () => {
  it('answers a known and an unknown address alike', async () => {
    const user = await createUser(knex, { tag: 'reset-known' });
    const unknownEmail = uniqueEmail('reset-unknown');
    const known = await askForReset(user.email);
    const unknown = await askForReset(unknownEmail);
    expect(known.status).toBe(303);
    expect(unknown.status).toBe(303);
    const shape = (res: Response, email: string) => res.headers.get('location')!.replace(encodeURIComponent(email), '<email>');
    expect(shape(known, user.email)).toBe(shape(unknown, unknownEmail));
    const knownPage = await (await fetch(`${base}${known.headers.get('location')}`)).text();
    const unknownPage = await (await fetch(`${base}${unknown.headers.get('location')}`)).text();
    expect(knownPage.replaceAll(user.email, '<email>')).toBe(unknownPage.replaceAll(unknownEmail, '<email>'));
    expect(knownPage).toContain(`If an account uses ${user.email}`);
    // The known address gets a link; the unknown one a note with no link to reset anything.
    await waitForMail(INTEGRATION_PORT, user.email, { subject: 'Choose a new Benchlore password' });
    const note = await waitForMail(INTEGRATION_PORT, unknownEmail);
    expect(note.text).not.toContain('/reset/password');
  });

  it('answers a bad address with a field message', async () => {
    const res = await askForReset('nobody@');
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('Enter an e-mail address such as name@example.org.');
  });

  it('answers 429 after 4 requests for one address in an hour', async () => {
    const user = await createUser(knex, { tag: 'reset-limit' });
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) statuses.push((await askForReset(user.email)).status);
    expect(statuses).toEqual([303, 303, 303, 303, 429]);
  });

  it('answers 429 after 12 requests from one client address in an hour', async () => {
    const ip = uniqueClientIp();
    for (let i = 0; i < 12; i++) expect((await askForReset(uniqueEmail('reset-ip'), ip)).status).toBe(303);
    expect((await askForReset(uniqueEmail('reset-ip'), ip)).status).toBe(429);
  });
});

describe('using a reset link', () => {
  it('sets the new password once, ends old sessions and confirms the address', async () => {
    const user = await createUser(knex, { tag: 'reset-use', verified: false });
    const oldSession = await signIn(base, user.email, user.password);
    const link = await resetLink(user.email);
    const stored = await knex('user_tokens').where({ user_id: user.id, purpose: 'reset_password' }).orderBy('id', 'desc').first();
    // One hour (OWASP Forgot Password Cheat Sheet: reset tokens short-lived).
    expect((new Date(stored.expires_at).getTime() - new Date(stored.created_at).getTime()) / 60_000).toBeCloseTo(60, 1);

    const form = await fetch(`${base}${link.pathname}${link.search}`);
    expect(form.status).toBe(200);
    expect(await form.text()).toContain('Set the new password');
    const token = link.searchParams.get('token')!;
    const res = await postForm(base, `/reset/password?token=${token}`, { token, password: NEW_PASSWORD }, { ip: uniqueClientIp() });
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe('/sign-in?notice=password-reset');

    // Old browser signed out, new password works, old one does not, address confirmed.
    expect((await fetch(`${base}/api/v1/account`, { headers: { cookie: oldSession } })).status).toBe(401);
    await signIn(base, user.email, NEW_PASSWORD);
    expect(
      (await postForm(base, '/sign-in', { intent: 'password', email: user.email, password: user.password }, { ip: uniqueClientIp() }))
        .status,
    ).toBe(401);
    expect((await knex('users').where({ id: user.id }).first()).emailVerified).not.toBeNull();

    const again = await postForm(
      base,
      `/reset/password?token=${token}`,
      { token, password: 'another-fresh-choice-of-words-8' },
      { ip: uniqueClientIp() },
    );
    expect(again.status).toBe(410);
    const shown = await fetch(`${base}${link.pathname}${link.search}`);
    expect(shown.status).toBe(410);
    const html = await shown.text();
    expect(html).toContain('This link has already been used');
    expect(html).toContain('href="/reset"');
  });

  it('explains an expired link and offers a new one', async () => {
    const user = await createUser(knex, { tag: 'reset-expired' });
    const link = await resetLink(user.email);
    await knex('user_tokens')
      .where({ user_id: user.id, purpose: 'reset_password' })
      .update({ expires_at: knex.raw(`now() - interval '1 second'`) });
    const res = await fetch(`${base}${link.pathname}${link.search}`);
    expect(res.status).toBe(410);
    const html = await res.text();
    expect(html).toContain('This link has expired');
    expect(html).toContain('Ask for a new link');
    const token = link.searchParams.get('token')!;
    expect(
      (await postForm(base, `/reset/password?token=${token}`, { token, password: NEW_PASSWORD }, { ip: uniqueClientIp() })).status,
    ).toBe(410);
  });

  it('stops an older link working once a newer one is sent', async () => {
    const user = await createUser(knex, { tag: 'reset-newer' });
    const first = await resetLink(user.email);
    expect((await askForReset(user.email)).status).toBe(303);
    await waitForMail(INTEGRATION_PORT, user.email, { subject: 'Choose a new Benchlore password', count: 2 });
    expect((await fetch(`${base}${first.pathname}${first.search}`)).status).toBe(410);
  });

  it('refuses a weak new password with a field message and keeps the link usable', async () => {
    const user = await createUser(knex, { tag: 'reset-weak' });
    const link = await resetLink(user.email);
    const token = link.searchParams.get('token')!;
    const weak = await postForm(base, `/reset/password?token=${token}`, { token, password: 'qwertyuiop' }, { ip: uniqueClientIp() });
    expect(weak.status).toBe(400);
    expect(await weak.text()).toContain('This password would be easy to guess.');
    expect((await fetch(`${base}${link.pathname}${link.search}`)).status).toBe(200);
  });

  it('answers a made-up token with an explanation, not an error', async () => {
    const res = await fetch(`${base}/reset/password?token=${'A'.repeat(43)}`);
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('This link does not work');
  });
});
