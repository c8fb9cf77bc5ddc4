// The account page and API through the built server: profile, password, signing out everywhere, deleting (anonymising).
import { randomBytes } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { clearsSession, createUser, postForm, signIn, uniqueClientIp } from '../support/sign-in';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
afterAll(() => knex.destroy());

function accountForm(cookie: string, fields: Record<string, string>): Promise<Response> {
  return postForm(base, '/account?_action=account', fields, { cookie, ip: uniqueClientIp() });
}

describe('account page', () => {
  it('shows the name, e-mail and role of the signed-in member and is never cached', async () => {
    const user = await createUser(knex, { tag: 'page' });
    const cookie = await signIn(base, user.email, user.password);
    const res = await fetch(`${base}/account`, { headers: { cookie } });
    expect(res.status).toBe(200);
    expect(res.headers.get('cache-control')).toBe('private, no-store');
    const html = await res.text();
    expect(html).toContain(user.email);
    expect(html).toContain(`value="${user.name}"`);
    // The one script is the browser check of the same schema; the form works without it.
    expect(scriptsBesideRegistration(html)).toEqual([expect.stringMatching(/type="module" src="\/_astro\/AccountFormCheck[^"]*\.js"/)]);
  });

  it('saves the name and shop name, and answers bad values with field messages', async () => {
    const user = await createUser(knex, { tag: 'profile' });
    const cookie = await signIn(base, user.email, user.password);
    const saved = await accountForm(cookie, { intent: 'profile', name: 'Renamed Person', shopName: 'Renamed Repairs' });
    expect(saved.status).toBe(303);
    const row = await knex('users').where({ id: user.id }).first();
    expect([row.name, row.shop_name]).toEqual(['Renamed Person', 'Renamed Repairs']);

    const bad = await accountForm(cookie, { intent: 'profile', name: ' ', shopName: 'z'.repeat(200) });
    expect(bad.status).toBe(400);
    const html = await bad.text();
    expect(html).toContain('Use at least 2 characters for your name.');
    expect(html).toContain('Use at most 120 characters for the shop name.');
  });

  it('answers an unknown form with a message, not a 500', async () => {
    const user = await createUser(knex, { tag: 'intent' });
    const cookie = await signIn(base, user.email, user.password);
    expect((await accountForm(cookie, { intent: 'launch' })).status).toBe(400);
    expect((await postForm(base, '/account?_action=account', {}, { cookie })).status).toBe(400);
  });

  it('changes the password only with the current one, then ends every session', async () => {
    const user = await createUser(knex, { tag: 'password' });
    const cookie = await signIn(base, user.email, user.password);
    const wrong = await accountForm(cookie, {
      intent: 'password',
      currentPassword: 'not-my-password-x',
      newPassword: 'harbour-spindle-quartz-meadow-6',
    });
    expect(wrong.status).toBe(400);
    expect(await wrong.text()).toContain('That is not your current password.');
    const weak = await accountForm(cookie, { intent: 'password', currentPassword: user.password, newPassword: 'abcdefghij' });
    expect(weak.status).toBe(400);
    expect(await weak.text()).toContain('This password would be easy to guess.');

    const done = await accountForm(cookie, {
      intent: 'password',
      currentPassword: user.password,
      newPassword: 'harbour-spindle-quartz-meadow-6',
    });
    expect(done.status).toBe(303);
    expect(done.headers.get('location')).toBe('/sign-in?notice=password-changed');
    expect((await fetch(`${base}/api/v1/account`, { headers: { cookie } })).status).toBe(401);
    await signIn(base, user.email, 'harbour-spindle-quartz-meadow-6');
  });

  it('signs out every browser at once', async () => {
    const user = await createUser(knex, { tag: 'everywhere' });
    const first = await signIn(base, user.email, user.password);
    const second = await signIn(base, user.email, user.password);
    expect((await accountForm(first, { intent: 'sign-out-everywhere' })).status).toBe(303);
    for (const cookie of [first, second]) {
      const res = await fetch(`${base}/api/v1/account`, { headers: { cookie } });
      expect(res.status).toBe(401);
      // The stale cookie is cleared on the way.
      expect(clearsSession(res)).toBe(true);
    }
  });
});

describe('account API', () => {
  it('answers 401 in the JSON error shape when signed out', async () => {
    const res = await fetch(`${base}/api/v1/account`);
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({ error: { code: 'unauthorised', message: 'Sign in to do this.' } });
  });

  it('changes only the fields sent and answers bad JSON with field messages', async () => {
    const user = await createUser(knex, { tag: 'api' });
    const cookie = await signIn(base, user.email, user.password);
    const patch = (body: string) =>
      fetch(`${base}/api/v1/account`, { method: 'PATCH', headers: { cookie, 'content-type': 'application/json' }, body });
    const ok = await patch(JSON.stringify({ shopName: 'Api Bench' }));
    expect(ok.status).toBe(200);
    const body = await ok.json();
    expect(body.user).toMatchObject({ id: user.id, name: user.name, shopName: 'Api Bench', role: 'member', verified: true });
    expect(body.can).toContain('write_fix');

    const bad = await patch(JSON.stringify({ name: 'x', role: 'admin' }));
    expect(bad.status).toBe(400);
    const error = (await bad.json()).error;
    expect(error.code).toBe('bad_request');
    expect(error.fields.name).toEqual(['Use at least 2 characters for your name.']);
    expect(Object.keys(error.fields)).toContain('_');
    expect((await patch('{not json')).status).toBe(400);
    expect((await knex('users').where({ id: user.id }).first()).role).toBe('member');
  });
});

describe('deleting an account', () => {
  it('anonymises the member, removes private records and keeps their fixes credited to a former member', async () => {
    const user = await createUser(knex, { tag: 'delete' });
    const slug = `acc-delete-check-${randomBytes(4).toString('hex')}`;
    // A fix of their own, kept out of every listing (deleted_at) so the demo world is untouched.
    const [fix] = await knex('fixes').insert({ slug, created_by: user.id, deleted_at: new Date() }).returning('id');
    await knex('revisions').insert({
      fix_id: fix.id,
      number: 1,
      author_id: user.id,
      title: 'A draft of theirs',
      body: { type: 'doc', content: [] },
    });
    await knex('job_sheets').insert({ owner_id: user.id, customer_ref: 'Bench job 1' });
    await knex('order_lists').insert({ owner_id: user.id, name: 'Capacitors to buy' });
    const cookie = await signIn(base, user.email, user.password);

    const refused = await accountForm(cookie, { intent: 'delete', password: user.password, confirm: 'yes' });
    expect(refused.status).toBe(400);
    expect(await refused.text()).toContain('Type the word delete to confirm.');
    const wrongPassword = await accountForm(cookie, { intent: 'delete', password: 'wrong-password-1', confirm: 'delete' });
    expect(wrongPassword.status).toBe(400);

    const deleted = await accountForm(cookie, { intent: 'delete', password: user.password, confirm: 'delete' });
    expect(deleted.status).toBe(303);
    expect(deleted.headers.get('location')).toBe('/account/deleted');

    const row = await knex('users').where({ id: user.id }).first();
    expect(row.name).toBe('a former member');
    expect(row.email).not.toBe(user.email);
    expect(row.email).toMatch(/^deleted-\d+-[0-9a-f]{12}@deleted\.invalid$/);
    expect(row.password_hash).toBeNull();
    expect(row.shop_name).toBeNull();
    expect(row.deleted_at).not.toBeNull();
    expect(await knex('job_sheets').where({ owner_id: user.id })).toHaveLength(0);
    expect(await knex('order_lists').where({ owner_id: user.id })).toHaveLength(0);
    expect(await knex('user_tokens').where({ user_id: user.id })).toHaveLength(0);
    const revision = await knex('revisions').where({ fix_id: fix.id }).first();
    expect(revision.author_id).toBe(user.id);
    expect((await knex('fixes').where({ id: fix.id }).first()).created_by).toBe(user.id);
    const audit = await knex('audit_log')
      .where({ subject_type: 'user', subject_id: String(user.id), action: 'user.delete' })
      .first();
    expect(audit.actor_id).toBe(user.id);
    expect(audit.detail).toEqual({ jobSheets: 1, orderLists: 1 });

    // Signed out, and the old address and password open nothing.
    const after = await fetch(`${base}/account`, { headers: { cookie }, redirect: 'manual' });
    expect(after.status).toBe(302);
    expect(clearsSession(after)).toBe(true);
    expect(
      (await postForm(base, '/sign-in', { intent: 'password', email: user.email, password: user.password }, { ip: uniqueClientIp() }))
        .status,
    ).toBe(401);
  });
});
