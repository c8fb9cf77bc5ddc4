// Pages that plain form posts return to show fixed sentences for the code in their address, never its text.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { DEMO_PASSWORD, signIn } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
const planted = 'this fix was withdrawn by the site';
let member: string;
let moderator: string;

beforeAll(async () => {
  member = await signIn(base, 'member@example.test', DEMO_PASSWORD);
  moderator = await signIn(base, 'moderator@example.test', DEMO_PASSWORD);
});
afterAll(() => knex.destroy());

async function page(path: string, cookie: string): Promise<string> {
  const res = await fetch(`${base}${path}`, { headers: { Cookie: cookie } });
  expect(res.status).toBe(200);
  return res.text();
}

describe('pages after a form post', () => {
  it("shows the writer's own list a fixed sentence, whatever text the address carries", async () => {
    const html = await page(`/write/mine?error=${encodeURIComponent(planted)}`, member);
    expect(html).not.toContain(planted);
    expect(html).toContain('That change was not made: something went wrong.');
    expect(await page('/write/mine?error=conflict', member)).toContain('It was changed meanwhile');
  });

  it('shows the proofing desk fixed sentences for its error and for what a lock or hide did', async () => {
    const html = await page(`/proofing?error=${encodeURIComponent(planted)}&fix=${encodeURIComponent(planted)}`, moderator);
    expect(html).not.toContain(planted);
    expect(await page('/proofing?fix=lock', moderator)).toContain('Locked: only moderators may write new revisions');
  });

  it('answers a refused form post with the error code in the address, not the message', async () => {
    const revision = await knex('revisions').where({ state: 'proofed' }).orderBy('id').first('id');
    const res = await fetch(`${base}/api/v1/revisions/${revision.id}/withdraw`, {
      method: 'POST',
      headers: { Cookie: member, 'content-type': 'application/x-www-form-urlencoded', origin: base },
      body: '',
      redirect: 'manual',
    });
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toMatch(/^\/write\/mine\?error=[a-z_]+$/);
  });
});
