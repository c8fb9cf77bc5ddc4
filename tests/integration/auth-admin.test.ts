// Roles and suspensions through the built server: effective on the next request, each one in the audit log.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { clearsSession, createUser, postForm, signIn, uniqueClientIp, type TestUser } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let admin: TestUser;
let adminCookie: string;
let moderator: TestUser;
let moderatorCookie: string;

beforeAll(async () => {
  admin = await createUser(knex, { role: 'admin' });
  adminCookie = await signIn(base, admin.email, admin.password);
  moderator = await createUser(knex, { role: 'moderator' });
  moderatorCookie = await signIn(base, moderator.email, moderator.password);
});
afterAll(() => knex.destroy());

function adminForm(cookie: string, fields: Record<string, string>): Promise<Response> {
  return postForm(base, '/admin/users?_action=adminUser', fields, { cookie, ip: uniqueClientIp() });
}

async function auditFor(userId: number, action: string): Promise<any[]> {
  return knex('audit_log')
    .where({ subject_type: 'user', subject_id: String(userId), action })
    .orderBy('id');
}

describe('admin users page', () => {
  it('lists and searches members for moderators and admins, not for members or editors', async () => {
    const member = await createUser(knex, { tag: 'listed' });
    const memberCookie = await signIn(base, member.email, member.password);
    const editor = await createUser(knex, { role: 'editor' });
    const editorCookie = await signIn(base, editor.email, editor.password);
    const search = `/admin/users?q=${encodeURIComponent(member.email)}`;
    const adminPage = await fetch(`${base}${search}`, { headers: { cookie: adminCookie } });
    expect(adminPage.status).toBe(200);
    const html = await adminPage.text();
    expect(html).toContain(member.email);
    expect(html).toContain('1 member matching');
    expect(html).toContain('name="role"');
    const moderatorHtml = await (await fetch(`${base}${search}`, { headers: { cookie: moderatorCookie } })).text();
    expect(moderatorHtml).toContain(member.email);
    // Moderators suspend; only admins see the role control.
    expect(moderatorHtml).not.toContain('name="role"');
    expect(moderatorHtml).toContain('value="suspend"');
    expect((await fetch(`${base}/admin/users`, { headers: { cookie: memberCookie } })).status).toBe(403);
    expect((await fetch(`${base}/admin/users`, { headers: { cookie: editorCookie } })).status).toBe(403);
  });

  it('answers a bad search with a message rather than an error', async () => {
    const res = await fetch(`${base}/admin/users?page=0`, { headers: { cookie: adminCookie } });
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('Pages start at 1.');
  });
});

describe('changing a role', () => {
  it('applies on the member’s next request and is written to the audit log with before and after', async () => {
    const member = await createUser(knex, { tag: 'promoted' });
    const cookie = await signIn(base, member.email, member.password);
    expect((await fetch(`${base}/admin/users`, { headers: { cookie } })).status).toBe(403);
    const before = await (await fetch(`${base}/`, { headers: { cookie } })).text();
    expect(before).not.toContain('Proofing desk');

    const res = await adminForm(adminCookie, { intent: 'role', userId: String(member.id), role: 'moderator', q: member.email });
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`/admin/users?notice=role-changed&q=${encodeURIComponent(member.email)}`);

    // Same session cookie, new role: read from the database on this request.
    expect((await fetch(`${base}/admin/users`, { headers: { cookie } })).status).toBe(200);
    expect(await (await fetch(`${base}/`, { headers: { cookie } })).text()).toContain('Proofing desk');
    const [entry] = await auditFor(member.id, 'user.role_change');
    expect(entry.actor_id).toBe(admin.id);
    expect(entry.detail).toEqual({ before: { role: 'member' }, after: { role: 'moderator' } });
    expect(new Date(entry.created_at).getTime()).toBeGreaterThan(Date.now() - 60_000);

    await adminForm(adminCookie, { intent: 'role', userId: String(member.id), role: 'member' });
    expect((await fetch(`${base}/admin/users`, { headers: { cookie } })).status).toBe(403);
    expect(await auditFor(member.id, 'user.role_change')).toHaveLength(2);
  });

  it('refuses role changes from moderators and an admin’s change to their own role', async () => {
    const member = await createUser(knex, { tag: 'not-promoted' });
    const byModerator = await adminForm(moderatorCookie, { intent: 'role', userId: String(member.id), role: 'admin' });
    expect(byModerator.status).toBe(403);
    const self = await adminForm(adminCookie, { intent: 'role', userId: String(admin.id), role: 'member' });
    expect(self.status).toBe(403);
    expect((await knex('users').where({ id: member.id }).first()).role).toBe('member');
    expect((await knex('users').where({ id: admin.id }).first()).role).toBe('admin');
    expect(await auditFor(member.id, 'user.role_change')).toHaveLength(0);
  });

  it('answers a bad role or member with field messages', async () => {
    const res = await adminForm(adminCookie, { intent: 'role', userId: 'abc', role: 'overlord' });
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toContain('Choose a member.');
    expect(html).toContain('Choose one of: member, editor, moderator, admin.');
    expect((await adminForm(adminCookie, { intent: 'role', userId: '999999999', role: 'editor' })).status).toBe(404);
  });
});

describe('suspending', () => {
  it('signs the member out on their next request, clears the cookie, and logs it; lifting it lets them back', async () => {
    const member = await createUser(knex, { tag: 'suspend-me' });
    const cookie = await signIn(base, member.email, member.password);
    expect((await fetch(`${base}/api/v1/account`, { headers: { cookie } })).status).toBe(200);

    const missingReason = await adminForm(moderatorCookie, { intent: 'suspend', userId: String(member.id), reason: '' });
    expect(missingReason.status).toBe(400);
    expect(await missingReason.text()).toContain('Give a reason of at least 3 characters');

    expect((await adminForm(moderatorCookie, { intent: 'suspend', userId: String(member.id), reason: 'Posting spam links' })).status).toBe(
      303,
    );
    const api = await fetch(`${base}/api/v1/account`, { headers: { cookie } });
    expect(api.status).toBe(401);
    expect(clearsSession(api)).toBe(true);
    const page = await fetch(`${base}/`, { headers: { cookie } });
    expect(await page.text()).toMatch(/>\s*Sign in\s*</);
    const [entry] = await auditFor(member.id, 'user.suspend');
    expect(entry.actor_id).toBe(moderator.id);
    expect(entry.detail).toEqual({ before: { suspended: false }, after: { suspended: true, reason: 'Posting spam links' } });

    expect((await adminForm(adminCookie, { intent: 'unsuspend', userId: String(member.id) })).status).toBe(303);
    const [lifted] = await auditFor(member.id, 'user.unsuspend');
    expect(lifted.actor_id).toBe(admin.id);
    expect(lifted.detail).toEqual({ before: { suspended: true, reason: 'Posting spam links' }, after: { suspended: false } });
    // Signed out for good: the cookie kept from before the suspension stays refused; a new sign-in works.
    expect((await fetch(`${base}/api/v1/account`, { headers: { cookie } })).status).toBe(401);
    const fresh = await signIn(base, member.email, member.password);
    expect((await fetch(`${base}/api/v1/account`, { headers: { cookie: fresh } })).status).toBe(200);
  });

  it('keeps moderators from suspending admins or other moderators', async () => {
    const otherModerator = await createUser(knex, { role: 'moderator', tag: 'other-mod' });
    expect((await adminForm(moderatorCookie, { intent: 'suspend', userId: String(admin.id), reason: 'Trying it on' })).status).toBe(403);
    expect(
      (await adminForm(moderatorCookie, { intent: 'suspend', userId: String(otherModerator.id), reason: 'Trying it on' })).status,
    ).toBe(403);
    expect((await knex('users').where({ id: admin.id }).first()).suspended_at).toBeNull();
    expect(await auditFor(otherModerator.id, 'user.suspend')).toHaveLength(0);
  });
});
