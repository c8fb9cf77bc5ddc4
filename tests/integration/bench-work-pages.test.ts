// The bench work pages through the built server: the fix page form, the customer's note, job sheets, statistics.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { signIn } from '../support/sign-in';
import { as, makeFix, makeMember, makeWorld, PASSWORD, type TestFix, type TestWorld } from './bench-work-support';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
const anonymous = as(base, '');
let world: TestWorld;
let fix: TestFix;
let author: { id: number; email: string };
let me: ReturnType<typeof as>;

const html = async (res: Response): Promise<string> => res.text();

beforeAll(async () => {
  world = await makeWorld(knex);
  author = await makeMember(knex);
  fix = await makeFix(knex, {
    authorId: author.id,
    machineIds: [world.machines[0]!.id],
    revisions: 2,
    title: 'Deck stops after a few seconds',
    cautions: [{ kind: 'mains' }, { kind: 'laser' }, { kind: 'spring' }],
  });
  me = as(base, await signIn(base, (await makeMember(knex, { shopName: 'Saltmarsh Repairs' })).email, PASSWORD));
  // Reports for the statistics: three counted, one of them on the older revision, and the author's own.
  const reporters = await Promise.all([makeMember(knex), makeMember(knex), makeMember(knex)]);
  const row = (memberId: number, outcome: string, revisionId: number, heldDays: number | null = null) => ({
    fix_id: fix.id,
    revision_id: revisionId,
    machine_id: world.machines[0]!.id,
    member_id: memberId,
    outcome,
    held_days: heldDays,
  });
  await knex('bench_reports').insert([
    row(reporters[0]!.id, 'fixed', fix.revisionIds[1]!),
    row(reporters[1]!.id, 'came_back', fix.revisionIds[1]!, 60),
    row(reporters[2]!.id, 'fixed', fix.revisionIds[0]!),
    row(author.id, 'fixed', fix.revisionIds[1]!),
  ]);
});
afterAll(() => knex.destroy());

describe('fix page bench report form', () => {
  it('offers verified members a plain form for the fix’s machines and family, with no script on the page', async () => {
    const page = await html(await me.get(`/fixes/${fix.slug}`));
    expect(scriptsBesideRegistration(page)).toEqual([]);
    expect(page).toContain(`action="/fixes/${fix.slug}?_action=benchReport"`);
    for (const m of world.machines) expect(page).toContain(`value="${m.slug}"`);
    expect(page).not.toContain(`value="${world.outsider.slug}"`);
    expect(page).toMatch(new RegExp(`/notes/new\\?fix=${fix.slug}&(amp|#38);revision=2`));
  });

  it('shows the counts on this and older revisions, the author’s own apart', async () => {
    const page = await html(await anonymous.get(`/fixes/${fix.slug}`));
    expect(page).toMatch(/2 on\s+the live revision, 1 on older revisions/);
    expect(page).toMatch(/1 by the fix(&#39;|')s author, shown but not counted/);
    expect(page).toContain('2 of 3 technicians fixed it, for 1 the fault came back; few reports so far.');
  });

  it('asks signed-out readers to sign in instead of showing the form', async () => {
    const page = await html(await anonymous.get(`/fixes/${fix.slug}`));
    expect(page).not.toContain('?_action=benchReport');
    expect(page).toContain(`/sign-in?next=%2Ffixes%2F${fix.slug}`);
  });

  it('lists the member’s own report after a post, with the saved message', async () => {
    const posted = await me.form(`/fixes/${fix.slug}?_action=benchReport`, {
      fix: fix.slug,
      machine: world.machines[1]!.slug,
      revision: '2',
      outcome: 'partly',
    });
    expect(posted.status).toBe(303);
    expect(posted.headers.get('location')).toBe(`/fixes/${fix.slug}?bench=saved#bench-report`);
    const page = await html(await me.get(posted.headers.get('location') ?? '/'));
    expect(page).toContain('Your bench report is saved');
    expect(page).toMatch(/Partly fixed[\s\S]*?your report/);
  });
});

describe('customer’s note page', () => {
  it('is plain, printable, unindexed and lists the cautions that concern an owner', async () => {
    const { note } = await (
      await me.post('/api/v1/handover-notes', {
        fix: fix.slug,
        message: 'Thank you for bringing it in.',
        warranty: '3 months on parts and labour',
        partsReplaced: ['Drive belt'],
      })
    ).json();
    const res = await anonymous.get(`/n/${note.code}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('x-robots-tag')).toBe('noindex');
    expect(res.headers.get('cache-control')).toContain('no-store');
    const page = await html(res);
    expect(scriptsBesideRegistration(page)).toEqual([]);
    expect(page).toContain('<meta name="robots" content="noindex">');
    expect(page).toContain('Hand-over note from Saltmarsh Repairs');
    expect(page).toContain('Do not open the case');
    expect(page).toContain('Never look into the disc tray opening');
    expect(page).toContain('Do not force the cassette door or disc tray');
    expect(page).toContain('3 months on parts and labour');
    expect(page).toContain(`href="/fixes/${fix.slug}/r/2"`);
    // The print rules travel with the page (inlined or linked): the note is laid out for one sheet.
    const sheets = [...page.matchAll(/<link rel="stylesheet" href="([^"]+)"/g)].map((m) => m[1]!);
    const inline = [...page.matchAll(/<style>([\s\S]*?)<\/style>/g)].map((m) => m[1]!);
    const css = [...inline, ...(await Promise.all(sheets.map(async (href) => (await anonymous.get(href)).text())))].join('\n');
    expect(css).toMatch(/@media print\{[^}]*\.handover-note/);
  });

  it('links the member’s note view to its QR code and the line for an invoice', async () => {
    const { note } = await (await me.post('/api/v1/handover-notes', { fix: fix.slug })).json();
    const page = await html(await me.get(`/notes/${note.code}`));
    expect(page).toContain(`/api/v1/handover-notes/${note.code}/qr.svg`);
    expect(page).toContain(`/api/v1/handover-notes/${note.code}/qr.png`);
    expect(page).toContain(`value="Repair notes: ${base}/n/${note.code}"`);
  });

  it('writes a note from the plain form and sends the member to it', async () => {
    const res = await me.form('/notes/new?_action=handoverNote', {
      fix: `${base}/fixes/${fix.slug}/r/1`,
      shopName: '',
      message: 'All done.',
      partsReplaced: 'Belt\n\nIdler tyre\n',
      warranty: '',
    });
    expect(res.status).toBe(303);
    const code = /\/notes\/([A-Z0-9]+)\?note=created/.exec(res.headers.get('location') ?? '')?.[1] ?? '';
    const { note } = await (await anonymous.get(`/api/v1/handover-notes/${code}`)).json();
    expect(note).toMatchObject({ shopName: '', partsReplaced: ['Belt', 'Idler tyre'], fix: { revisionNumber: 1 } });
  });
});

describe('job sheet pages', () => {
  it('books in a machine, applies a fix, records a bench report and lists the sheet, all without script', async () => {
    const created = await me.form('/jobs/new?_action=newJob', {
      customerRef: 'Walk-in 44',
      machine: world.machines[1]!.slug,
      serialNumber: 'S-1',
      reportedSymptom: 'Stops',
      status: 'booked_in',
    });
    expect(created.status).toBe(303);
    const jobPath = (created.headers.get('location') ?? '').split('?')[0]!;
    expect(jobPath).toMatch(/^\/jobs\/\d+$/);
    const applied = await me.form(`${jobPath}?_action=jobSheet`, {
      job: jobPath.split('/').pop()!,
      intent: 'apply_fix',
      fix: fix.slug,
      fixLink: '',
    });
    expect(applied.headers.get('location')).toBe(`${jobPath}?job=fix_applied#applied-fixes`);
    const page = await html(await me.get(jobPath));
    expect(page).toContain('pinned to r2');
    expect(page).toMatch(new RegExp(`/notes/new\\?fix=${fix.slug}&(amp|#38);revision=2&(amp|#38);job=${jobPath.split('/')[2]}"`));
    expect(page).toContain(`action="${jobPath}?_action=benchReport"`);
    const report = await me.form(`${jobPath}?_action=benchReport`, {
      fix: fix.slug,
      machine: world.machines[1]!.slug,
      revision: '2',
      outcome: 'fixed',
      heldDays: '',
    });
    expect(report.headers.get('location')).toBe(`${jobPath}?bench=saved#fix-${fix.slug}`);
    const list = await me.get('/jobs?sort=customer');
    const listPage = await html(list);
    expect(listPage).toContain('Walk-in 44');
    expect(listPage).toContain(`href="${jobPath}"`);
    expect(listPage).toContain('astro-island');
  });

  it('saves findings, parts and labour from the form, and shows field messages for bad values', async () => {
    const created = await me.form('/jobs/new?_action=newJob', { customerRef: 'Walk-in 45', status: 'booked_in' });
    const jobPath = (created.headers.get('location') ?? '').split('?')[0]!;
    const bad = await me.form(`${jobPath}?_action=jobSheet`, {
      job: jobPath.split('/').pop()!,
      intent: 'save',
      customerRef: 'Walk-in 45',
      status: 'diagnosing',
      labourMinutes: 'forty',
      'parts.0.kind': 'capacitor',
      'parts.0.value': '470uF',
      'parts.0.quantity': '',
    });
    expect(bad.status).toBe(400);
    const badPage = await html(bad);
    expect(badPage).toContain('Give labour in whole minutes.');
    expect(badPage).toMatch(/quantity: [^<]*/);
    expect(badPage).toContain('value="470uF"');
    const good = await me.form(`${jobPath}?_action=jobSheet`, {
      job: jobPath.split('/').pop()!,
      intent: 'save',
      customerRef: 'Walk-in 45',
      status: 'repaired',
      labourMinutes: '40',
      findings: 'Dry joint on the motor plug',
      'parts.0.kind': 'capacitor',
      'parts.0.value': '470uF',
      'parts.0.rating': '16V',
      'parts.0.quantity': '2',
    });
    expect(good.status).toBe(303);
    const json = await (await me.get(`/api/v1/job-sheets/${jobPath.split('/')[2]}`)).json();
    expect(json.jobSheet).toMatchObject({
      status: 'repaired',
      labourMinutes: 40,
      findings: 'Dry joint on the motor plug',
      partsUsed: [{ kind: 'capacitor', value: '470uF', rating: '16V', quantity: 2, source: 'Job sheet Walk-in 45' }],
    });
  });

  it('sends signed-out readers to sign in', async () => {
    const res = await anonymous.get('/jobs');
    expect(res.status).toBe(302);
    expect(res.headers.get('location')).toBe('/sign-in?next=%2Fjobs');
  });
});

describe('statistics on catalogue pages', () => {
  it('draws the most reported faults and the outcomes of a machine as SVG, without script', async () => {
    const page = await html(await anonymous.get(`/machines/${world.machines[0]!.slug}`));
    expect(scriptsBesideRegistration(page)).toEqual([]);
    expect(page).toContain('Most reported faults (top 1)');
    expect(page).toContain('Outcomes of 3 bench reports');
    expect(page).toMatch(/<svg[^>]*role="img"/);
    expect(page).toContain(`<a href="/fixes/${fix.slug}">`);
    // The table behind the chart: Fixed 2, Partly 0, Not fixed 0, Came back 1.
    expect(page).toMatch(/<th scope="row">Fixed<\/th>\s*<td>2<\/td>/);
    expect(page).toMatch(/<th scope="row">Fault came back<\/th>\s*<td>1<\/td>/);
  });

  it('counts the family’s machines together on the chassis page', async () => {
    const page = await html(await anonymous.get(`/chassis/${world.chassisSlug}`));
    expect(scriptsBesideRegistration(page)).toEqual([]);
    expect(page).toMatch(/Outcomes of \d+ bench reports/);
    expect(page).toContain('Deck stops after a few seconds');
  });

  it('adds fixes and reports per family on the maker page', async () => {
    const page = await html(await anonymous.get(`/makers/${world.makerSlug}`));
    expect(page).toMatch(/1 fix · \d+ bench reports/);
  });
});
