// A technician reading without signing in, on the shop's phone: opens a fix, comes back to it (the page is answered
// from its validators, not sent again), and after the fix is proofed anew sees the new text at once.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { makeFix, makeMember, makeWorld, proofNewRevision, type TestFix } from '../integration/bench-work-support';
import { Journey, PHONE_WIDTH } from './support/journey';

const knex = testDb();
let browser: Browser;
let fix: TestFix;
let authorId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const world = await makeWorld(knex);
  authorId = (await makeMember(knex)).id;
  fix = await makeFix(knex, { authorId, machineIds: [world.machines[0]!.id], title: 'Counter stops while the reels turn' });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

describe('a reader who is not signed in', () => {
  it('opens a fix twice, the second time answered from validators, and sees the new text after a proofing', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ width: PHONE_WIDTH });

    let etag = '';
    await journey.step('opens the fix', async () => {
      const response = await journey.goto(page, `/fixes/${fix.slug}`);
      expect(response?.status()).toBe(200);
      etag = response?.headers()['etag'] ?? '';
      expect(etag).toMatch(/^W\//);
      await expect(page.locator('h1').textContent()).resolves.toBe('Counter stops while the reels turn');
    });

    await journey.step('comes back to it: the browser asks whether it changed and is told it did not', async () => {
      // The browser shows a revalidated page as 200 from its cache; what came over the wire is in DevTools' extra info.
      const cdp = await page.context().newCDPSession(page);
      await cdp.send('Network.enable');
      const wire: { status: number; etag: string | undefined }[] = [];
      cdp.on('Network.responseReceivedExtraInfo', (e) => wire.push({ status: e.statusCode, etag: e.headers['etag'] ?? e.headers['ETag'] }));
      await journey.reload(page);
      await expect(page.locator('h1').textContent()).resolves.toBe('Counter stops while the reels turn');
      expect(wire.filter((w) => w.etag === etag)).toEqual([{ status: 304, etag }]);
      await cdp.detach();
    });

    await journey.step('after a moderator proofs a new revision, sees the new text when coming back', async () => {
      await proofNewRevision(knex, fix, authorId);
      await journey.reload(page);
      await expect(page.locator('h1').textContent()).resolves.toBe('Rewritten fault r2');
      await expect(page.getByText('Revision r2', { exact: false }).first().isVisible()).resolves.toBe(true);
    });

    await journey.close();
  });
});
