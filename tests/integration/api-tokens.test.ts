// Personal API tokens against the built server: created on the account page, used on the job-sheet and note API with
// If-Match, refused on moderation and account routes, for a missing scope, a suspended account and after revocation.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { cookiesFrom, createUser, postForm, signIn } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let cookie: string;
let userId: number;

/** Creates a token through the account page's form, as a member would, and reads it from the page that shows it once. */
async function createToken(name: string, scopes: string[]): Promise<string> {
  const body = new URLSearchParams({ intent: 'create', name });
  for (const scope of scopes) body.append('scopes', scope);
  const res = await fetch(`${base}/account/api-tokens`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', origin: base, cookie },
    body,
    redirect: 'manual',
  });
  expect(res.status, (await res.text()).slice(0, 300)).toBe(303);
  expect(res.headers.get('location')).toBe('/account/api-tokens?notice=created');
  const carried = cookiesFrom(res);
  expect(carried).toMatch(/^blt_new=/);
  const shown = await fetch(`${base}/account/api-tokens?notice=created`, { headers: { cookie: `${cookie}; ${carried}` } });
  // Shown once: the page clears the cookie that carried it.
  expect(shown.headers.getSetCookie().some((c) => c.startsWith('blt_new=') && /Expires=Thu, 01 Jan 1970|Max-Age=0/i.test(c))).toBe(true);
  const token = /value="(blt_[A-Za-z0-9_-]+)"/.exec(await shown.text())?.[1];
  expect(token).toBeDefined();
  return token!;
}

function call(token: string, path: string, init: RequestInit = {}): Promise<Response> {
  return fetch(`${base}${path}`, {
    ...init,
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json', ...(init.headers as Record<string, string>) },
  });
}

beforeAll(async () => {
  const user = await createUser(knex, { tag: 'api-token', verified: true });
  userId = user.id;
  cookie = await signIn(base, user.email, user.password);
});
afterAll(() => knex.destroy());

describe('personal API tokens', () => {
  it('are stored only as a hash and shown once', async () => {
    const token = await createToken('Front desk invoicing', ['bench_work']);
    const rows = await knex('api_tokens').where({ user_id: userId });
    expect(rows.some((r) => JSON.stringify(r).includes(token))).toBe(false);
    expect(rows.map((r) => r.name)).toContain('Front desk invoicing');
    const page = await (await fetch(`${base}/account/api-tokens`, { headers: { cookie } })).text();
    expect(page).toContain('Front desk invoicing');
    expect(page).not.toContain(token);
    expect(page).toContain('last used never');
  });

  it('refuses a form without a name or a scope, keeping what was typed', async () => {
    const res = await postForm(base, '/account/api-tokens', { intent: 'create', name: 'Ticket program' }, { cookie });
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toContain('Tick at least one scope');
    expect(html).toContain('value="Ticket program"');
  });

  it('create, read, list and update a job sheet; a stale If-Match answers 412 with the current version', async () => {
    const token = await createToken('Workshop sync', ['bench_work']);
    const created = await call(token, '/api/v1/job-sheets', {
      method: 'POST',
      body: JSON.stringify({ customerRef: 'INV-3318', reportedSymptom: 'Tray opens then closes again', labourMinutes: 45 }),
    });
    expect(created.status).toBe(201);
    expect(created.headers.get('etag')).toBe('"v1"');
    const sheet = (await created.json()).jobSheet;
    const path = `/api/v1/job-sheets/${sheet.id}`;

    const read = await call(token, path);
    expect(read.status).toBe(200);
    expect(read.headers.get('etag')).toBe('"v1"');

    // Without If-Match a program is told to send it.
    const blind = await call(token, path, { method: 'PATCH', body: JSON.stringify({ status: 'diagnosing' }) });
    expect(blind.status).toBe(428);
    expect((await blind.json()).error.code).toBe('precondition_required');

    // The technician changes the sheet in the browser meanwhile (session, no If-Match).
    const browser = await fetch(`${base}${path}`, {
      method: 'PATCH',
      headers: { cookie, origin: base, 'content-type': 'application/json' },
      body: JSON.stringify({ findings: 'Loading belt glazed' }),
    });
    expect(browser.status).toBe(200);
    expect(browser.headers.get('etag')).toBe('"v2"');

    const stale = await call(token, path, {
      method: 'PATCH',
      headers: { 'if-match': '"v1"' },
      body: JSON.stringify({ findings: 'Overwritten?' }),
    });
    expect(stale.status).toBe(412);
    const staleBody = await stale.json();
    expect(staleBody.error.code).toBe('precondition_failed');
    expect(staleBody.current.version).toBe(2);
    expect(staleBody.current.findings).toBe('Loading belt glazed');

    const fresh = await call(token, path, {
      method: 'PATCH',
      headers: { 'if-match': '"v2"' },
      body: JSON.stringify({ status: 'repaired' }),
    });
    expect(fresh.status).toBe(200);
    expect(fresh.headers.get('etag')).toBe('"v3"');
    const after = (await fresh.json()).jobSheet;
    expect(after.findings).toBe('Loading belt glazed');
    expect(after.status).toBe('repaired');

    const list = await (await call(token, '/api/v1/job-sheets?perPage=1&q=INV-3318')).json();
    expect(list).toMatchObject({ page: 1, perPage: 1, total: 1, pageCount: 1 });
    expect(list.jobSheets[0].id).toBe(sheet.id);

    const csv = await call(token, `${path}/invoice-lines.csv`);
    expect(csv.status).toBe(200);
    expect(await csv.text()).toMatch(/^kind,description,quantity,unit,link\r?\nlabour,Labour,0\.75,h,/);
    const lines = await (await call(token, `${path}/invoice-lines.json`)).json();
    expect(lines.lines[0]).toEqual({ kind: 'labour', description: 'Labour', quantity: 0.75, unit: 'h', link: '' });

    // Deleting stays in the browser.
    expect((await call(token, path, { method: 'DELETE' })).status).toBe(403);
  });

  it('is refused on moderation and account routes, and without the scope a route needs', async () => {
    const token = await createToken('Everything I may', ['read', 'bench_work', 'order_list']);
    const moderation = await call(token, '/api/v1/proofing/1/proof', { method: 'POST', body: '{}' });
    expect(moderation.status).toBe(403);
    expect((await moderation.json()).error.message).toMatch(/never take a token/);
    const account = await call(token, '/api/v1/account', { method: 'PATCH', body: JSON.stringify({ name: 'Someone else' }) });
    expect(account.status).toBe(403);
    expect((await knex('users').where({ id: userId }).first('name')).name).not.toBe('Someone else');

    const readOnly = await createToken('Catalogue only', ['read']);
    const noScope = await call(readOnly, '/api/v1/job-sheets');
    expect(noScope.status).toBe(403);
    expect((await noScope.json()).error.message).toMatch(/"bench_work" scope/);
    expect((await call(readOnly, '/api/v1/machines?perPage=2')).status).toBe(200);
  });

  it('shows when a token was last used, and refuses it once revoked', async () => {
    const token = await createToken('Old till', ['bench_work']);
    expect((await call(token, '/api/v1/handover-notes')).status).toBe(200);
    const row = await knex('api_tokens').where({ user_id: userId, name: 'Old till' }).first('id', 'last_used_at');
    expect(row.last_used_at).not.toBeNull();
    const page = await (await fetch(`${base}/account/api-tokens`, { headers: { cookie } })).text();
    expect(page).toMatch(/Old till[\s\S]*?last used \d/);

    const revoke = await postForm(base, '/account/api-tokens', { intent: 'revoke', id: String(row.id) }, { cookie });
    expect(revoke.status).toBe(303);
    expect(revoke.headers.get('location')).toBe('/account/api-tokens?notice=revoked');
    const refused = await call(token, '/api/v1/handover-notes');
    expect(refused.status).toBe(401);
    expect((await refused.json()).error.code).toBe('unauthorised');
  });

  it('is refused while its account is suspended', async () => {
    const other = await createUser(knex, { tag: 'api-suspended' });
    const otherCookie = await signIn(base, other.email, other.password);
    const saved = cookie;
    cookie = otherCookie;
    const token = await createToken('Suspended shop', ['bench_work']);
    cookie = saved;
    expect((await call(token, '/api/v1/job-sheets')).status).toBe(200);
    await knex('users').where({ id: other.id }).update({ suspended_at: new Date(), suspended_reason: 'token test' });
    const refused = await call(token, '/api/v1/job-sheets');
    expect(refused.status).toBe(403);
    expect((await refused.json()).error.message).toMatch(/suspended/);
  });

  it('counts requests per token in the one rate limiter', async () => {
    const token = await createToken('Busy sync', ['read']);
    const row = await knex('api_tokens').where({ user_id: userId, name: 'Busy sync' }).first('id');
    // Use up the window in the limiter's own table, as 600 requests would.
    await knex('rate_limits')
      .insert({ key: `api_token:account:token:${row.id}`, points: 600, expire: Date.now() + 60_000 })
      .onConflict('key')
      .merge();
    const res = await call(token, '/api/v1/machines');
    expect(res.status).toBe(429);
    expect(Number(res.headers.get('retry-after'))).toBeGreaterThan(0);
  });

  it('a hand-over note: create, read with ETag, update with If-Match', async () => {
    const token = await createToken('Note printer', ['bench_work']);
    const fix = await knex('fixes')
      .whereNotNull('current_revision_id')
      .whereNull('hidden_at')
      .whereNull('deleted_at')
      .orderBy('id')
      .first('slug');
    const created = await call(token, '/api/v1/handover-notes', {
      method: 'POST',
      body: JSON.stringify({ fix: fix.slug, warranty: '90 days' }),
    });
    expect(created.status).toBe(201);
    const note = (await created.json()).note;
    const path = `/api/v1/handover-notes/${note.code}`;
    const read = await call(token, path);
    expect(read.headers.get('etag')).toBe('"v1"');
    expect((await read.json()).note.warranty).toBe('90 days');
    const changed = await call(token, path, {
      method: 'PATCH',
      headers: { 'if-match': '"v1"' },
      body: JSON.stringify({ warranty: '6 months' }),
    });
    expect(changed.status).toBe(200);
    expect(changed.headers.get('etag')).toBe('"v2"');
    const stale = await call(token, path, {
      method: 'PATCH',
      headers: { 'if-match': '"v1"' },
      body: JSON.stringify({ warranty: '1 year' }),
    });
    expect(stale.status).toBe(412);
    expect((await stale.json()).current.warranty).toBe('6 months');
    // The fix a note is pinned to never changes.
    const pinned = await call(token, path, {
      method: 'PATCH',
      headers: { 'if-match': '"v2"' },
      body: JSON.stringify({ fix: 'another-fix' }),
    });
    expect(pinned.status).toBe(400);
  });
});
