// `npm run admin:create`: makes or promotes an admin, with a one-time password link or a given password.
import { spawnSync } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT, testEnv } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, postForm, signIn, uniqueClientIp, uniqueEmail } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
afterAll(() => knex.destroy());

function adminCreate(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const res = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/admin-create.ts', ...args], {
    env: { ...testEnv(), PUBLIC_ORIGIN: base },
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: res.status, stdout: res.stdout, stderr: res.stderr };
}

describe('admin:create', () => {
  it('creates a confirmed admin and prints a one-time link that sets the password', async () => {
    const email = uniqueEmail('first-admin');
    const run = adminCreate(['--email', email, '--name', 'Ines Calloway']);
    expect(run.status, run.stderr).toBe(0);
    const row = await knex('users').where({ email }).first();
    expect(row).toMatchObject({ role: 'admin', name: 'Ines Calloway', password_hash: null });
    expect(row.emailVerified).not.toBeNull();
    const link = new URL(run.stdout.match(/https?:\/\/\S+\/reset\/password\?token=\S+/)![0]);
    const token = link.searchParams.get('token')!;
    const set = await postForm(
      base,
      `/reset/password?token=${token}`,
      { token, password: 'lodestar-pinion-saffron-wharf-3' },
      { ip: uniqueClientIp() },
    );
    expect(set.status).toBe(303);
    const cookie = await signIn(base, email, 'lodestar-pinion-saffron-wharf-3');
    expect((await fetch(`${base}/admin/users`, { headers: { cookie } })).status).toBe(200);
    const audit = await knex('audit_log')
      .where({ subject_type: 'user', subject_id: String(row.id), action: 'user.create_admin' })
      .first();
    expect(audit.actor_id).toBeNull();
  });

  it('promotes an existing member, keeps their name, sets a given password and logs the change', async () => {
    const member = await createUser(knex, { tag: 'to-promote', suspended: true });
    const run = adminCreate(['--email', member.email, '--name', 'Another Name', '--password', 'gimbal-cordage-umber-trellis-5']);
    expect(run.status, run.stderr).toBe(0);
    expect(run.stdout).toContain('is now an admin');
    const row = await knex('users').where({ id: member.id }).first();
    expect(row).toMatchObject({ role: 'admin', name: member.name, suspended_at: null });
    await signIn(base, member.email, 'gimbal-cordage-umber-trellis-5');
    const audit = await knex('audit_log')
      .where({ subject_type: 'user', subject_id: String(member.id), action: 'user.role_change' })
      .first();
    expect(audit.detail).toEqual({ before: { role: 'member' }, after: { role: 'admin' }, via: 'admin:create' });
  });

  it('refuses bad arguments and weak passwords with a message and exit code 1', async () => {
    const bad = adminCreate(['--email', 'not-an-address', '--name', 'X']);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toContain('--email: Enter an e-mail address such as name@example.org.');
    expect(bad.stderr).toContain('--name: Use at least 2 characters for your name.');
    const weak = adminCreate(['--email', uniqueEmail('weak-admin'), '--name', 'Weak Admin', '--password', 'password1234']);
    expect(weak.status).toBe(1);
    expect(weak.stderr).toContain('This password would be easy to guess.');
    const unknown = adminCreate(['--mail', 'x@example.test']);
    expect(unknown.status).toBe(1);
    expect(unknown.stderr).toContain('Usage: npm run admin:create');
  });
});
