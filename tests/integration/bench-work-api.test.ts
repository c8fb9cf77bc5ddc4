// The bench work API through the built server: signed-in members, zod-checked input, the one error shape.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { signIn } from '../support/sign-in';
import { as, makeFix, makeMember, makeWorld, PASSWORD, type TestFix, type TestWorld } from './bench-work-support';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let world: TestWorld;
let fix: TestFix;
let member: { id: number; email: string };
let me: ReturnType<typeof as>;

beforeAll(async () => {
  world = await makeWorld(knex);
  fix = await makeFix(knex, {
    authorId: (await makeMember(knex)).id,
    machineIds: [world.machines[0]!.id],
    revisions: 2,
    cautions: [{ kind: 'mains' }],
  });
  member = await makeMember(knex, { shopName: 'Harbour Row Video' });
  me = as(base, await signIn(base, member.email, PASSWORD));
});
afterAll(() => knex.destroy());

describe('/api/v1/bench-reports', () => {
  it('creates a report (201), changes it on a second post (200) and lists it as the member’s own', async () => {
    const body = { fix: fix.slug, machine: world.machines[1]!.slug, outcome: 'fixed', note: 'Belt swapped, runs well.' };
    const created = await me.post('/api/v1/bench-reports', body);
    expect(created.status).toBe(201);
    expect((await created.json()).report).toMatchObject({
      created: true,
      counted: true,
      revisionNumber: 2,
      benchScore: { counted: 1, fixed: 1 },
    });
    const changed = await me.post('/api/v1/bench-reports', { ...body, outcome: 'came_back', heldDays: 30 });
    expect(changed.status).toBe(200);
    expect((await changed.json()).report.benchScore).toMatchObject({ counted: 1, fixed: 0, cameBack: 1 });
    const own = await (await me.get(`/api/v1/bench-reports?fix=${fix.slug}`)).json();
    expect(own.reports).toHaveLength(1);
    expect(own.reports[0]).toMatchObject({ outcome: 'came_back', heldDays: 30, machine: { slug: world.machines[1]!.slug } });
  });

  it('answers field-level messages in the one error shape', async () => {
    const res = await me.post('/api/v1/bench-reports', { fix: fix.slug, machine: world.outsider.slug, outcome: 'came_back' });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe('bad_request');
    expect(body.error.fields.heldDays[0]).toMatch(/how many days/);
    const wrongMachine = await (
      await me.post('/api/v1/bench-reports', { fix: fix.slug, machine: world.outsider.slug, outcome: 'fixed' })
    ).json();
    expect(wrongMachine.error.fields.machine[0]).toMatch(/applies to/);
  });

  it('refuses signed-out requests with 401 and unverified members with 403', async () => {
    const anonymous = await as(base, '').post('/api/v1/bench-reports', {
      fix: fix.slug,
      machine: world.machines[0]!.slug,
      outcome: 'fixed',
    });
    expect(anonymous.status).toBe(401);
    expect((await anonymous.json()).error.code).toBe('unauthorised');
    const unverified = await makeMember(knex, { verified: false });
    const res = await as(base, await signIn(base, unverified.email, PASSWORD)).post('/api/v1/bench-reports', {
      fix: fix.slug,
      machine: world.machines[0]!.slug,
      outcome: 'fixed',
    });
    expect(res.status).toBe(403);
  });

  it('refuses plain form posts, which the fix page sends to its own Action instead', async () => {
    const res = await me.form('/api/v1/bench-reports', {
      fix: fix.slug,
      machine: world.machines[0]!.slug,
      outcome: 'came_back',
      note: 'A note that must never travel through an address',
    });
    expect(res.status).toBe(415);
    expect(res.headers.get('location')).toBeNull();
    expect((await res.json()).error.message).toMatch(/JSON/);
  });

  it('limits each member to 30 reports an hour, then answers 429 with Retry-After', async () => {
    const busy = await makeMember(knex);
    const client = as(base, await signIn(base, busy.email, PASSWORD));
    const body = { fix: fix.slug, machine: world.machines[0]!.slug, outcome: 'fixed' };
    for (let i = 0; i < 30; i++) expect((await client.post('/api/v1/bench-reports', body)).status).toBeLessThan(300);
    const refused = await client.post('/api/v1/bench-reports', body);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0);
    expect((await refused.json()).error.code).toBe('too_many_requests');
  });
});

describe('/api/v1/fixes/:slug/bench-reports', () => {
  it('gives the public counts per revision, without who reported', async () => {
    const res = await as(base, '').get(`/api/v1/fixes/${fix.slug}/bench-reports`);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.fix).toEqual({ slug: fix.slug, liveRevision: 2 });
    expect(body.benchScore.counted).toBeGreaterThan(0);
    expect(body.byRevision[0]).toMatchObject({ revisionNumber: 2, isCurrent: true });
    expect(JSON.stringify(body)).not.toContain(member.email);
    expect((await as(base, '').get('/api/v1/fixes/no-such-fix/bench-reports')).status).toBe(404);
  });
});

describe('/api/v1/handover-notes', () => {
  it('creates a note with the account’s shop name, lists it, and serves its public JSON signed out', async () => {
    const res = await me.post('/api/v1/handover-notes', {
      fix: fix.slug,
      revision: 1,
      message: 'Thanks for waiting.',
      partsReplaced: ['Drive belt'],
    });
    expect(res.status).toBe(201);
    const { note } = await res.json();
    expect(note.code).toMatch(/^[23456789ABCDEFGHJKMNPQRSTUVWXYZ]{10}$/);
    expect(note.invoiceLine).toBe(`Repair notes: ${base}/n/${note.code}`);
    expect(note.shopName).toBe('Harbour Row Video');
    const mine = await (await me.get('/api/v1/handover-notes')).json();
    expect(mine.notes.map((n: { code: string }) => n.code)).toContain(note.code);
    const open = await as(base, '').get(`/api/v1/handover-notes/${note.code}`);
    expect(open.status).toBe(200);
    expect((await open.json()).note.fix).toMatchObject({ revisionNumber: 1, permalink: `/fixes/${fix.slug}/r/1`, cautionKinds: ['mains'] });
  });

  it('serves the QR code as SVG and PNG to the owner only', async () => {
    const { note } = await (await me.post('/api/v1/handover-notes', { fix: fix.slug })).json();
    const svg = await me.get(`/api/v1/handover-notes/${note.code}/qr.svg`);
    expect(svg.headers.get('content-type')).toContain('image/svg+xml');
    expect(await svg.text()).toMatch(/^<svg[^>]*xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    const png = new Uint8Array(await (await me.get(`/api/v1/handover-notes/${note.code}/qr.png`)).arrayBuffer());
    // The PNG signature, PNG specification (ISO/IEC 15948) section 5.2: 89 50 4E 47 0D 0A 1A 0A.
    expect([...png.slice(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    const other = as(base, await signIn(base, (await makeMember(knex)).email, PASSWORD));
    expect((await other.get(`/api/v1/handover-notes/${note.code}/qr.svg`)).status).toBe(404);
  });

  it('revokes by its owner only; afterwards the code answers 410', async () => {
    const { note } = await (await me.post('/api/v1/handover-notes', { fix: fix.slug })).json();
    const other = as(base, await signIn(base, (await makeMember(knex)).email, PASSWORD));
    expect((await other.delete(`/api/v1/handover-notes/${note.code}`)).status).toBe(404);
    const revoked = await me.delete(`/api/v1/handover-notes/${note.code}`);
    expect(revoked.status).toBe(200);
    expect(await revoked.json()).toEqual({ revoked: true, alreadyRevoked: false });
    const gone = await as(base, '').get(`/api/v1/handover-notes/${note.code}`);
    expect(gone.status).toBe(410);
    expect((await gone.json()).error.code).toBe('gone');
  });

  it('revokes from the plain button on the note page and sends the member back to it', async () => {
    const { note } = await (await me.post('/api/v1/handover-notes', { fix: fix.slug })).json();
    const res = await me.form(`/api/v1/handover-notes/${note.code}`, {});
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`/notes/${note.code}?note=revoked`);
    const page = await (await me.get(res.headers.get('location')!)).text();
    expect(page).toContain('The note is withdrawn');
    expect(page).not.toContain('Withdraw this note</button>');
  });

  it('answers bad note input with field messages', async () => {
    const res = await me.post('/api/v1/handover-notes', { fix: fix.slug, revision: 0, partsReplaced: [''], warranty: 'x'.repeat(301) });
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(Object.keys(error.fields).sort()).toEqual(['partsReplaced.0', 'revision', 'warranty']);
  });
});

describe('/api/v1/job-sheets', () => {
  it('creates, reads, changes and lists a job sheet of one’s own', async () => {
    const created = await me.post('/api/v1/job-sheets', {
      customerRef: 'API ticket 1',
      machine: world.machines[0]!.slug,
      reportedSymptom: 'No rewind',
    });
    expect(created.status).toBe(201);
    const { jobSheet } = await created.json();
    expect(created.headers.get('location')).toBe(`/api/v1/job-sheets/${jobSheet.id}`);
    const patched = await me.patch(`/api/v1/job-sheets/${jobSheet.id}`, { status: 'waiting_for_parts', labourMinutes: 45 });
    expect((await patched.json()).jobSheet).toMatchObject({ status: 'waiting_for_parts', labourMinutes: 45, reportedSymptom: 'No rewind' });
    const list = await (await me.get('/api/v1/job-sheets?status=waiting_for_parts')).json();
    expect(list.jobSheets.map((j: { id: number }) => j.id)).toContain(jobSheet.id);
    expect((await me.get('/api/v1/job-sheets?status=lost')).status).toBe(400);
  });

  it('applies a fix with its pinned revision and exports invoice lines as CSV and JSON', async () => {
    const { jobSheet } = await (
      await me.post('/api/v1/job-sheets', {
        customerRef: 'API ticket 2',
        labourMinutes: 30,
        partsUsed: [{ kind: 'belt', value: '=HYPERLINK("x"), 4 mm', quantity: 1 }],
      })
    ).json();
    const applied = await me.post(`/api/v1/job-sheets/${jobSheet.id}/fixes`, { fix: fix.slug, revision: 1 });
    expect((await applied.json()).jobSheet.fixes[0]).toMatchObject({ slug: fix.slug, revisionNumber: 1 });
    const { note } = await (await me.post('/api/v1/handover-notes', { fix: fix.slug, revision: 1, jobSheetId: jobSheet.id })).json();
    const csv = await me.get(`/api/v1/job-sheets/${jobSheet.id}/invoice-lines.csv`);
    expect(csv.headers.get('content-type')).toContain('text/csv');
    const rows: string[][] = parse(await csv.text());
    expect(rows[0]).toEqual(['kind', 'description', 'quantity', 'unit', 'link']);
    expect(rows[1]).toEqual(['labour', 'Labour', '0.5', 'h', '']);
    // Quotes and commas typed by the member survive the round trip through csv-parse.
    expect(rows[2]).toEqual(['part', 'belt =HYPERLINK("x"), 4 mm', '1', 'pcs', '']);
    expect(rows.some((r) => r[0] === 'repair_notes' && r[4] === `${base}/n/${note.code}`)).toBe(true);
    const json = await (await me.get(`/api/v1/job-sheets/${jobSheet.id}/invoice-lines.json`)).json();
    expect(json.lines).toHaveLength(rows.length - 1);
  });

  it('deletes a sheet for good (204, then 404)', async () => {
    const { jobSheet } = await (await me.post('/api/v1/job-sheets', { customerRef: 'API ticket 3' })).json();
    expect((await me.delete(`/api/v1/job-sheets/${jobSheet.id}`)).status).toBe(204);
    expect((await me.get(`/api/v1/job-sheets/${jobSheet.id}`)).status).toBe(404);
  });
});
