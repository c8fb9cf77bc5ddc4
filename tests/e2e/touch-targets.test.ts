// At 360 px wide, every control of the main pages is at least 44 by 44 px: standalone links, buttons, select boxes,
// text inputs, checkboxes and radio buttons (by their label); links inside running text are exempt (see the helper).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContextOptions } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { demoWorldFixes } from '../support/demo-world';
import { createUser, type TestUser } from '../support/sign-in';
import { describeSmall, MIN_TARGET, smallTargets } from '../support/touch-targets';
import { walkPages } from '../support/page-walk';
import { addToOrderList, fixPartsForOrder } from '@/server/bench-work/order-lists';
import { applyFixToJob, createJobSheet } from '@/server/bench-work/job-sheets';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { closeDb } from '@/server/core/db';

const base = `http://127.0.0.1:${E2E_PORT}`;
const PHONE = { width: 360, height: 740 };
const knex = testDb();
let browser: Browser;
let places: { fix: string; machine: string; chassis: string; maker: string };
let member: TestUser;
let job: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const fix = await demoWorldFixes(knex)
    .join('chassis_families as c', 'c.id', 'm.chassis_family_id')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .orderByRaw('jsonb_array_length(r.parts) DESC, f.id')
    .first('f.slug', 'm.slug as machine', 'c.slug as chassis', 'mk.slug as maker');
  places = { fix: fix.slug, machine: fix.machine, chassis: fix.chassis, maker: fix.maker };
  member = await createUser(knex, { tag: 'e2e-touch-member' });
  const parts = await fixPartsForOrder(places.fix, undefined, 'all');
  if (parts) await addToOrderList(member.id, parts.rows);
  const sheet = await createJobSheet(
    member.id,
    jobSheetCreateSchema.parse({ customerRef: 'Counter ticket 4410', machine: places.machine }),
  );
  if (!sheet.ok) throw new Error('could not open the job sheet');
  await applyFixToJob(member.id, sheet.value, places.fix);
  job = sheet.value;
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
  await closeDb();
});

/** Opens each path at 360 px (or as `device` says); answers every control smaller than 44 px, by page. */
function smallOn(user: TestUser | undefined, paths: string[], device: BrowserContextOptions = { viewport: PHONE }): Promise<string[]> {
  return walkPages(browser, base, user, device, paths, async (page, path) => describeSmall(path, await smallTargets(page)));
}

describe('touch targets at 360 px wide', () => {
  it('are at least 44 px each way on the main pages for a reader who is signed out', async () => {
    const fix = `/fixes/${places.fix}`;
    const found = await smallOn(undefined, [
      '/',
      '/machines',
      `/machines/${places.machine}`,
      '/makers',
      `/makers/${places.maker}`,
      `/chassis/${places.chassis}`,
      fix,
      `${fix}/history`,
      '/search?q=no+power',
      '/tools',
      '/tools/value-decoder',
      '/tools/substitute-check?value=470uF&rating=16V',
      '/tools/esr',
      '/tools/bleed-down',
      '/tools/life-estimate',
      '/tools/preferred-values',
      '/help',
      '/sign-in',
      '/sign-up',
      '/kept',
      '/offline',
    ]);
    expect(found).toEqual([]);
  });

  it('are at least 44 px each way for a signed-in member: the bench report form, job sheets, notes, the order list', async () => {
    const found = await smallOn(member, [
      '/',
      `/fixes/${places.fix}`,
      '/jobs',
      '/jobs/new',
      `/jobs/${job}`,
      '/notes',
      '/order-list',
      '/write/mine',
      '/account',
    ]);
    expect(found).toEqual([]);
  });

  it("are 44 px on a tablet's touch screen too, though a desk computer with a mouse keeps its lists compact", async () => {
    const tablet = { viewport: { width: 1024, height: 768 }, hasTouch: true, isMobile: true };
    const found = await smallOn(undefined, ['/', '/machines', `/fixes/${places.fix}`, '/search?q=no+power', '/tools'], tablet);
    expect(found).toEqual([]);
    // With a mouse on a wide screen the same links keep the height of their line of text.
    const desk = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await desk.newPage();
    await page.goto(`${base}/`);
    const heights = await page.locator('.tap').evaluateAll((links) => links.map((l) => l.getBoundingClientRect().height));
    expect(heights.length).toBeGreaterThan(5);
    expect(Math.max(...heights)).toBeLessThan(MIN_TARGET);
    await desk.close();
  });
});
