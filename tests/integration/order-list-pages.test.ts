// Parts tables on fix pages (decoded, still script-free) and the plain-HTML add-to-order-list flow, anonymous and signed in.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { signIn } from '../support/sign-in';
import { as, makeMember, makeWorld, PASSWORD, unique } from './bench-work-support';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const anonymous = as(base, '');
let knex: Knex;
let fix: { slug: string };

const parts = [
  { ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C low-ESR', quantity: 1, notes: 'beside the regulator' },
  { ref: 'C513', kind: 'capacitor', value: '470 µF', rating: '16 V 105 °C low ESR', quantity: 2, notes: '' },
  { ref: 'R803', kind: 'resistor', value: '470k', rating: '0.5W', quantity: 1, notes: '' },
  { ref: 'C9', kind: 'capacitor', value: '47x', rating: '', quantity: 1, notes: 'as printed in the service notes' },
  { ref: '', kind: 'belt', value: 'flat belt 92mm x 4mm', rating: '', quantity: 1, notes: '' },
];

beforeAll(async () => {
  knex = testDb();
  const author = await makeMember(knex);
  const world = await makeWorld(knex);
  fix = await makeFixWithParts(author.id, world.machines[0]!.id);
});

/** A live fix of our own whose one proofed revision has the parts above (revisions are never changed in place). */
async function makeFixWithParts(authorId: number, machineId: number): Promise<{ slug: string }> {
  const proofer = await knex('users').where({ email: 'moderator@example.test' }).first('id');
  const [created] = await knex('fixes')
    .insert({ slug: `order-list-fix-${unique()}`, created_by: authorId })
    .returning(['id', 'slug']);
  const body = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Replace the dried-out capacitors.' }] }] };
  const [revision] = await knex('revisions')
    .insert({
      fix_id: created.id,
      number: 1,
      author_id: authorId,
      title: 'Order list test fault',
      body: JSON.stringify(body),
      symptoms: ['Dead after a few minutes'],
      cause: 'Dried-out capacitors beside the regulator.',
      parts: JSON.stringify(parts),
      state: 'proofed',
      proofer_id: proofer.id,
      proofed_at: new Date(),
    })
    .returning('id');
  await knex('revision_machines').insert({ revision_id: revision.id, machine_id: machineId });
  await knex('fixes').where({ id: created.id }).update({ current_revision_id: revision.id });
  await knex('fix_machines').insert({ fix_id: created.id, machine_id: machineId });
  await knex('fix_search').insert({ fix_id: created.id, revision_id: revision.id, title: 'Order list test fault', proofed_at: new Date() });
  return { slug: created.slug };
}

afterAll(async () => {
  await knex?.destroy();
});

function addQuery(location: string | null): URLSearchParams {
  expect(location).toBeTruthy();
  return new URL(location ?? '', base).searchParams;
}

describe('the parts table on a fix page', () => {
  it('shows each value decoded beside the value as written, and still ships no script', async () => {
    const html = await (await anonymous.get(`/fixes/${fix.slug}`)).text();
    expect(scriptsBesideRegistration(html)).toEqual([]);
    // Two spellings of the same part read as one canonical form.
    expect(html.match(/470 µF 16 V 105 °C low-ESR/g)?.length).toBe(2);
    expect(html).toContain('470 kΩ 0.5 W');
    expect(html).toContain('Not decoded: check this value against the board.');
  });

  it('has a plain form per part and one for all parts, and a prefilled substitute check beside capacitors', async () => {
    const html = await (await anonymous.get(`/fixes/${fix.slug}`)).text();
    expect(html.match(/<form method="post" action="\/order-list\/add"/g)?.length).toBe(parts.length + 1);
    expect(html).toContain('name="row" value="all"');
    expect(html).toContain(`href="/tools/substitute-check?value=470uF&#38;rating=16V+105C+low-ESR"`);
  });

  it('carries the revision number on a permalink page', async () => {
    const html = await (await anonymous.get(`/fixes/${fix.slug}/r/1`)).text();
    expect(html).toContain('name="r" value="1"');
    expect(scriptsBesideRegistration(html)).toEqual([]);
  });
});

describe('adding parts as a reader who is not signed in', () => {
  it('redirects to the order list naming the fix, its revision and the rows, never the parts’ text', async () => {
    const res = await anonymous.form('/order-list/add', { fix: fix.slug, row: 'all' });
    expect(res.status).toBe(303);
    const query = addQuery(res.headers.get('location'));
    expect([query.get('add'), query.get('from')]).toEqual(['1.all', fix.slug]);
    const html = await (await anonymous.get(res.headers.get('location') ?? '')).text();
    for (const ref of ['C512', 'C513', 'R803', 'C9']) expect(html).toContain(ref);
    expect(html).toContain('Order list test fault (r1)');
  });

  it('adds one part by its row, and the order-list page lists the parts merged by canonical spec', async () => {
    const one = await anonymous.form('/order-list/add', { fix: fix.slug, r: '1', row: '2' });
    expect(addQuery(one.headers.get('location')).get('add')).toBe('1.2');
    const onePage = await (await anonymous.get(one.headers.get('location') ?? '')).text();
    expect(onePage).toContain('R803');
    expect(onePage).not.toContain('C512');

    const all = await anonymous.form('/order-list/add', { fix: fix.slug, row: 'all' });
    const page = await anonymous.get(all.headers.get('location') ?? '');
    expect(page.status).toBe(200);
    expect(page.headers.get('cache-control')).toContain('no-store');
    const html = await page.text();
    // C512 and C513 are one line of 3; the unreadable row stays on the list, flagged.
    expect(html).toContain('470 µF 16 V 105 °C low-ESR');
    expect(html).toContain('C512 C513');
    expect(html).toContain('Not decoded, kept as written');
  });

  it('answers a missing fix, a bad row or a cross-site post without adding anything', async () => {
    const missing = await anonymous.form('/order-list/add', { fix: 'no-such-fix', row: 'all' });
    expect(missing.headers.get('location')).toBe('/order-list?problem=not-found');
    const outOfRange = await anonymous.form('/order-list/add', { fix: fix.slug, row: '99' });
    expect(outOfRange.headers.get('location')).toBe('/order-list?problem=not-found');
    const bad = await anonymous.form('/order-list/add', { fix: fix.slug, row: 'some' });
    expect(bad.headers.get('location')).toBe('/order-list?problem=bad-form');
    const notice = await (await anonymous.get('/order-list?problem=not-found')).text();
    expect(notice).toContain('nothing was added');
    const crossSite = await fetch(`${base}/order-list/add`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded', Origin: 'http://elsewhere.example' },
      body: new URLSearchParams({ fix: fix.slug, row: 'all' }),
    });
    expect(crossSite.status).toBe(403);
  });

  it('shows a readable notice for a damaged parts link, never a server error', async () => {
    const res = await anonymous.get('/order-list?add=not*base64');
    expect(res.status).toBe(200);
    expect(await res.text()).toContain('nothing was added');
  });
});

describe('adding parts as a signed-in member', () => {
  it('merges the parts into the saved list, and adding again adds the quantities', async () => {
    const member = await makeMember(knex);
    const cookie = await signIn(base, member.email, PASSWORD);
    const me = as(base, cookie);
    const first = await me.form('/order-list/add', { fix: fix.slug, row: 'all' });
    expect(first.status).toBe(303);
    expect(first.headers.get('location')).toBe(`/order-list?added=${parts.length}&from=${fix.slug}`);
    await me.form('/order-list/add', { fix: fix.slug, row: '0' });

    const saved = await (await me.get('/api/v1/order-list')).json();
    const capacitor = saved.lines.find((l: any) => l.label === '470 µF 16 V 105 °C low-ESR');
    expect(capacitor).toEqual(expect.objectContaining({ quantity: 4, refs: ['C512', 'C513'] }));
    expect(saved.lines).toHaveLength(4);

    const page = await (await me.get('/order-list?added=5')).text();
    expect(page).toContain('This list is saved with your account.');
    expect(page).toContain('Added 5 parts to your saved list.');
    // Without JavaScript the saved list can still be downloaded.
    expect(page).toContain('href="/api/v1/order-list?format=csv"');
  });

  it('saves edits with PUT, refuses bad lines with 400, and answers the CSV', async () => {
    const member = await makeMember(knex);
    const cookie = await signIn(base, member.email, PASSWORD);
    const me = as(base, cookie);
    await me.form('/order-list/add', { fix: fix.slug, row: '2' });
    const { lines } = await (await me.get('/api/v1/order-list')).json();
    const edited = lines.map((l: any) => ({ ...l, quantity: 3, spares: 1 }));
    expect((await putList('', { lines: edited })).status).toBe(401);
    const saved = await putList(cookie, { lines: edited });
    expect(saved.status).toBe(200);
    expect((await me.get('/api/v1/order-list').then((r) => r.json())).lines[0]).toEqual(
      expect.objectContaining({ quantity: 3, spares: 1 }),
    );

    const bad = await putList(cookie, { lines: [{ ...edited[0], quantity: -1 }] });
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toEqual(['lines.0.quantity']);

    const csv = await me.get('/api/v1/order-list?format=csv');
    expect(csv.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    expect(csv.headers.get('content-disposition')).toContain('filename="order-list.csv"');
    expect(await csv.text()).toContain('resistor,470 kΩ 0.5 W,3,1,4,R803');
  });

  it('keeps an unconfirmed account on the browser list: the add goes by the address, the API answers 403', async () => {
    const member = await makeMember(knex, { verified: false });
    const me = as(base, await signIn(base, member.email, PASSWORD));
    const res = await me.form('/order-list/add', { fix: fix.slug, row: 'all' });
    expect(addQuery(res.headers.get('location')).get('add')).toBeTruthy();
    expect((await me.get('/api/v1/order-list')).status).toBe(403);
  });
});

/** PUT of the saved list with a session cookie (empty for signed out); the support helper has no PUT. */
function putList(cookie: string, body: unknown): Promise<Response> {
  return fetch(`${base}/api/v1/order-list`, {
    method: 'PUT',
    headers: { ...(cookie ? { Cookie: cookie } : {}), 'Content-Type': 'application/json' },
    body: JSON.stringify(body),
  });
}
