// At 360 px wide, no main page scrolls sideways, signed out or signed in: wide tables scroll inside their own box.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { demoWorldFixes } from '../support/demo-world';
import { createUser, signIn, type TestUser } from '../support/sign-in';
import { describeOverflow, horizontalOverflow } from '../support/overflow';
import { walkPages } from '../support/page-walk';
import { call, completeValues, someMachineId } from '../fixtures/writing';
import { addToOrderList, fixPartsForOrder } from '@/server/bench-work/order-lists';
import { applyFixToJob, createJobSheet } from '@/server/bench-work/job-sheets';
import { createHandoverNote } from '@/server/bench-work/handover-notes';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { closeDb } from '@/server/core/db';

const base = `http://127.0.0.1:${E2E_PORT}`;
const PHONE = { width: 360, height: 740 };
const knex = testDb();
let browser: Browser;

/** The demo world's widest pages: the fix with the most parts and readings, its machine, family and maker. */
interface Places {
  fix: string;
  revisions: number;
  machine: string;
  chassis: string;
  maker: string;
}
let places: Places;
let member: TestUser;
let moderator: TestUser;
let admin: TestUser;
/** The member's own job sheet, hand-over note and draft, and a submitted revision for the desk. */
let own: { job: number; note: string; draft: number; submitted: number };

beforeAll(async () => {
  browser = await launchBrowser();
  const fix = await demoWorldFixes(knex)
    .join('chassis_families as c', 'c.id', 'm.chassis_family_id')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .orderByRaw('jsonb_array_length(r.parts) + jsonb_array_length(r.readings) DESC, f.id')
    .first('f.slug', 'r.number', 'm.slug as machine', 'c.slug as chassis', 'mk.slug as maker');
  places = { fix: fix.slug, revisions: fix.number, machine: fix.machine, chassis: fix.chassis, maker: fix.maker };

  member = await createUser(knex, { tag: 'e2e-phone-member' });
  moderator = await createUser(knex, { role: 'moderator', tag: 'e2e-phone-moderator' });
  admin = await createUser(knex, { role: 'admin', tag: 'e2e-phone-admin' });

  const parts = await fixPartsForOrder(places.fix, undefined, 'all');
  if (parts) await addToOrderList(member.id, parts.rows);
  const job = await createJobSheet(
    member.id,
    jobSheetCreateSchema.parse({
      customerRef: 'Counter ticket 3604 for a long-named customer at the back of the shop',
      machine: places.machine,
      serialNumber: 'SN-0042-99817-LONGSERIAL',
      reportedSymptom: 'Dead on arrival; the customer says it clicked once and then went quiet.',
      findings: 'Reservoir capacitor open; replaced and tested for two hours.',
    }),
  );
  if (!job.ok) throw new Error('could not open the job sheet');
  await applyFixToJob(member.id, job.value, places.fix);
  const note = await createHandoverNote(
    { id: member.id, shopName: 'Fernhollow Tape Works and Bench Repairs' },
    handoverNoteInputSchema.parse({
      fix: places.fix,
      jobSheetId: job.value,
      includeJobDetails: true,
      message: 'Your recorder is ready to collect.',
      partsReplaced: ['Reservoir capacitor 2200 µF 35 V 105 °C', 'Fuse T1.6AL 250V'],
    }),
  );
  if (!note.ok) throw new Error('could not write the note');

  const cookie = await signIn(base, member.email, member.password);
  const machineId = await someMachineId(knex, 3);
  const draft = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie });
  const submitted = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie });
  await call(base, `/api/v1/drafts/${submitted.body.revision.id}/submit`, { body: {}, cookie });
  own = { job: job.value, note: note.code, draft: draft.body.revision.id, submitted: submitted.body.revision.id };
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
  await closeDb();
});

/** Opens each path at 360 px; answers the pages that scroll sideways (with their widest element) or did not open. */
function overflowingPages(user: TestUser | undefined, paths: string[]): Promise<string[]> {
  return walkPages(browser, base, user, { viewport: PHONE }, paths, async (page, path, response) => {
    const found: string[] = [];
    const status = response?.status() ?? 0;
    if (status >= 400 && path !== '/no-such-page') found.push(`${path} answered ${status}`);
    const overflow = await horizontalOverflow(page);
    if (overflow) found.push(describeOverflow(path, overflow));
    return found;
  });
}

describe('pages at 360 px wide', () => {
  it('do not scroll sideways for a reader who is signed out', async () => {
    const fix = `/fixes/${places.fix}`;
    const found = await overflowingPages(undefined, [
      '/',
      '/machines',
      `/machines/${places.machine}`,
      '/makers',
      `/makers/${places.maker}`,
      `/chassis/${places.chassis}`,
      fix,
      `${fix}/history`,
      `${fix}/r/${places.revisions}`,
      `${fix}/compare`,
      '/search?q=no+power+clicks',
      '/tools',
      '/tools/value-decoder',
      '/tools/substitute-check?value=470uF&rating=16V',
      '/tools/esr',
      '/tools/bleed-down',
      '/tools/life-estimate',
      '/tools/preferred-values',
      '/help',
      '/help/working-safely',
      '/help/writing-a-good-fix',
      '/sign-in',
      '/sign-up',
      '/reset',
      '/order-list',
      `/n/${own.note}`,
      '/kept',
      '/offline',
      '/no-such-page',
    ]);
    expect(found).toEqual([]);
  });

  it('do not scroll sideways for a signed-in member: writing, job sheets, notes, the order list, kept and offline pages', async () => {
    const found = await overflowingPages(member, [
      '/',
      `/fixes/${places.fix}`,
      `/machines/${places.machine}`,
      '/write',
      `/write?draft=${own.draft}`,
      `/fixes/${places.fix}/edit`,
      '/write/mine',
      '/jobs',
      '/jobs/new',
      `/jobs/${own.job}`,
      '/notes',
      `/notes/${own.note}`,
      `/notes/new?fix=${places.fix}`,
      '/order-list',
      '/account',
      '/kept',
      '/offline',
    ]);
    expect(found).toEqual([]);
  });

  it('do not scroll sideways for a moderator and an admin: the desk, a revision on it, members, word families', async () => {
    // A wanted fix with a long machine-named query and many tries, as a busy site has them, so the table is full width.
    const machine = await knex('machines').orderBy('id').first('id');
    const query = `phone width check ${Date.now()} tray motor whines then the loader gives up half way`;
    await knex('search_misses').insert({ query_norm: query, query_text: query, machine_id: machine.id, count: 12345 });
    const found = [
      ...(await overflowingPages(moderator, ['/proofing', `/proofing/${own.submitted}`])),
      ...(await overflowingPages(admin, ['/admin/users', '/admin/word-families', '/admin/wanted-fixes'])),
    ];
    expect(found).toEqual([]);
  });
});
