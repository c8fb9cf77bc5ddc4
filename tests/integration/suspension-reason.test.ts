// A suspension's reason reaches the member: by mail when a moderator suspends them, and on the sign-in page.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { waitForMail } from '../support/mail';
import { createUser, postForm, signIn, uniqueClientIp, type TestUser } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let moderator: TestUser;
let moderatorCookie: string;

beforeAll(async () => {
  moderator = await createUser(knex, { role: 'moderator', tag: 'reason-mod' });
  moderatorCookie = await signIn(base, moderator.email, moderator.password);
});
afterAll(() => knex.destroy());

describe('the reason for a suspension', () => {
  const reason = 'Posted the same shop advert in five fixes after two warnings.';

  it('is mailed to the member when a moderator suspends them on the members page', async () => {
    const member = await createUser(knex, { tag: 'reason-mail' });
    const answer = await postForm(
      base,
      '/admin/users?_action=adminUser',
      { intent: 'suspend', userId: String(member.id), reason },
      { cookie: moderatorCookie, ip: uniqueClientIp() },
    );
    expect(answer.status).toBe(303);
    const mail = await waitForMail(INTEGRATION_PORT, member.email, { subject: 'Your Benchlore account is suspended' });
    expect(mail.text).toContain(`The reason they gave: ${reason}`);
    expect(mail.html).toContain('Posted the same shop advert in five fixes after two warnings.');
    expect(mail.text).toContain('/help/house-rules');
  });

  it('is shown to the member when they sign in with the right password, and to nobody with a wrong one', async () => {
    const member = await createUser(knex, { tag: 'reason-signin' });
    await knex('users').where({ id: member.id }).update({ suspended_at: new Date(), suspended_reason: reason });
    const refused = await postForm(
      base,
      '/sign-in',
      { intent: 'password', email: member.email, password: member.password, next: '/' },
      { ip: uniqueClientIp() },
    );
    expect(refused.status).toBe(403);
    const html = await refused.text();
    expect(html).toContain('This account is suspended and cannot sign in.');
    expect(html).toContain(`The reason the moderator gave: “${reason}”`);
    expect(refused.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token=') && !/Max-Age=0|1970/.test(c))).toBe(false);

    const wrong = await postForm(
      base,
      '/sign-in',
      { intent: 'password', email: member.email, password: 'not-the-password-at-all', next: '/' },
      { ip: uniqueClientIp() },
    );
    expect(wrong.status).toBe(401);
    expect(await wrong.text()).not.toContain(reason);
  });

  it('keeps the reason as typed, beside its member, when the form refuses it', async () => {
    const member = await createUser(knex, { tag: 'reason-short' });
    const refused = await postForm(
      base,
      `/admin/users?_action=adminUser&q=${encodeURIComponent(member.email)}`,
      { intent: 'suspend', userId: String(member.id), reason: 'no', q: member.email },
      { cookie: moderatorCookie, ip: uniqueClientIp() },
    );
    expect(refused.status).toBe(400);
    const html = await refused.text();
    expect(html).toMatch(new RegExp(`id="reason-${member.id}"[^>]*value="no"`));
    expect(html).toContain('Shown to the member when they sign in, and e-mailed to them.');
  });
});
