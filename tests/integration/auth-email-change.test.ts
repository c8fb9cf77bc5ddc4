// Changing the account's e-mail address through the built server: the link goes to the new address, only
// the button behind it moves the account, the old address is told, and bad or reused links explain.
import { afterAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, postForm, signIn, uniqueClientIp, uniqueEmail } from '../support/sign-in';
import { countAfterPause, linkIn, waitForMail } from '../support/mail';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
afterAll(() => knex.destroy());

const accountForm = (cookie: string, fields: Record<string, string>) =>
  postForm(base, '/account?_action=account', fields, { cookie, ip: uniqueClientIp() });

async function askForChange(tag: string) {
  const user = await createUser(knex, { tag });
  const cookie = await signIn(base, user.email, user.password);
  const newEmail = uniqueEmail(`${tag}-new`);
  const asked = await accountForm(cookie, { intent: 'email', newEmail: newEmail.toUpperCase(), currentPassword: user.password });
  expect(asked.status).toBe(303);
  expect(asked.headers.get('location')).toBe('/account?notice=email-link-sent');
  const mail = await waitForMail(INTEGRATION_PORT, newEmail, { subject: 'Confirm your new e-mail address' });
  return { user, cookie, newEmail, link: linkIn(mail, '/account/email') };
}

describe('changing the e-mail address', () => {
  it('moves the account only when the button behind the mailed link is pressed, ends its sessions and tells the old address', async () => {
    const { user, cookie, newEmail, link } = await askForChange('move');
    expect(link.pathname).toBe('/account/email');
    // Opening the link (as a mail scanner would) changes nothing.
    const page = await fetch(link);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain(newEmail);
    expect((await knex('users').where({ id: user.id }).first()).email).toBe(user.email);

    const done = await postForm(base, '/account/email', { token: link.searchParams.get('token') ?? '' });
    expect(done.status).toBe(200);
    expect(await done.text()).toContain('Your account has its new address');
    const row = await knex('users').where({ id: user.id }).first();
    expect(row.email).toBe(newEmail);
    expect(row.emailVerified).not.toBeNull();
    expect((await fetch(`${base}/api/v1/account`, { headers: { cookie } })).status).toBe(401);
    await signIn(base, newEmail, user.password);
    const told = await waitForMail(INTEGRATION_PORT, user.email, { subject: 'has a new e-mail address' });
    expect(told.text).toContain(newEmail);
    const [audit] = await knex('audit_log').where({ action: 'user.email_change', subject_id: String(user.id) });
    expect(audit.actor_id).toBe(user.id);
    expect(JSON.stringify(audit.detail)).not.toContain('@');

    const again = await postForm(base, '/account/email', { token: link.searchParams.get('token') ?? '' });
    expect(again.status).toBe(410);
    expect(await again.text()).toContain('This link has already been used');
  });

  it('refuses a wrong password and a malformed address with field messages, and sends nothing', async () => {
    const user = await createUser(knex, { tag: 'refuse' });
    const cookie = await signIn(base, user.email, user.password);
    const newEmail = uniqueEmail('refuse-new');
    const wrong = await accountForm(cookie, { intent: 'email', newEmail, currentPassword: 'not-the-password-at-all' });
    expect(wrong.status).toBe(400);
    expect(await wrong.text()).toContain('That is not your current password.');
    const malformed = await accountForm(cookie, { intent: 'email', newEmail: 'bench at example', currentPassword: user.password });
    expect(malformed.status).toBe(400);
    expect(await malformed.text()).toContain('Enter an e-mail address such as name@example.org.');
    expect(await countAfterPause(INTEGRATION_PORT, newEmail)).toBe(0);
    expect((await knex('users').where({ id: user.id }).first()).email).toBe(user.email);
  });

  it('changes nothing when the new address belongs to another account by the time the link is used', async () => {
    const { user, newEmail, link } = await askForChange('taken');
    await createUser(knex, { email: newEmail });
    const res = await postForm(base, '/account/email', { token: link.searchParams.get('token') ?? '' });
    expect(res.status).toBe(409);
    expect(await res.text()).toContain('That address is in use');
    expect((await knex('users').where({ id: user.id }).first()).email).toBe(user.email);
  });

  it('explains a cut-short link instead of failing', async () => {
    const res = await fetch(`${base}/account/email?token=abc`);
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('This link is incomplete');
  });
});
