// A bench technician on a phone in a workshop with poor reception: keeps the fix for the deck on the bench, loses the
// connection, follows the remedy in the bench view, writes the findings into the job sheet offline, and finds them
// saved when the connection comes back. On a connection that crawls, reads the saved copy and is told so; files a
// bench report with no connection at all and sees it sent when the connection returns. At the desk, finds a report
// filed offline refused on reconnect (a field forgotten), gets it back in the form as typed, completes and sends it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { createJobSheet } from '@/server/bench-work/job-sheets';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { closeDb } from '@/server/core/db';
import { base, Journey, PHONE_WIDTH, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let technician: TestUser;
let fix: { slug: string; title: string; number: number; machine: string; parts: number };
let jobId: number;

beforeAll(async () => {
  browser = await launchBrowser();
  technician = await createUser(knex, { tag: 'journey-bench-offline' });
  fix = await knex('fixes as f')
    .join('revisions as r', 'r.id', 'f.current_revision_id')
    .join('fix_machines as fm', 'fm.fix_id', 'f.id')
    .join('machines as m', 'm.id', 'fm.machine_id')
    .whereNull('f.hidden_at')
    .whereRaw('jsonb_array_length(r.cautions) > 0')
    .whereRaw('jsonb_array_length(r.parts) > 0')
    .whereExists(knex('revision_photos as rp').whereRaw('rp.revision_id = r.id'))
    .orderBy('f.id')
    .first('f.slug', 'r.title', 'r.number', 'm.slug as machine', knex.raw('jsonb_array_length(r.parts)::int as parts'));
  // Booked in at the counter this morning, before the technician took the deck to the bench.
  const job = await createJobSheet(
    technician.id,
    jobSheetCreateSchema.parse({ customerRef: 'Counter ticket 8127', machine: fix.machine, reportedSymptom: 'Picture bends at the top' }),
  );
  if (!job.ok) throw new Error(job.message);
  jobId = job.value;
});
afterAll(async () => {
  // The demo fix's bench score goes back to what other journeys expect.
  await knex('bench_reports').where({ member_id: technician.id }).delete();
  await browser?.close();
  await knex.destroy();
  await closeDb();
});

/** Waits until the service worker controls the page, then reloads it, so what the page loads is kept for offline. */
async function underServiceWorker(journey: Journey, page: Page): Promise<void> {
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller)
      await new Promise((resolve) => navigator.serviceWorker.addEventListener('controllerchange', resolve, { once: true }));
  });
  await journey.reload(page);
}

/** Reads the page through, so its photos (loaded as they scroll into view) are on the device too. */
async function readThrough(page: Page): Promise<void> {
  const photos = page.locator('figure.photo img');
  for (let i = 0; i < (await photos.count()); i++) await photos.nth(i).scrollIntoViewIfNeeded();
  await page.waitForFunction(() => [...document.querySelectorAll<HTMLImageElement>('figure.photo img')].every((img) => img.complete));
}

describe('a bench technician with a dropping connection', () => {
  it('keeps a fix, goes offline, follows the bench view, edits the job sheet and finds it saved on reconnect', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: technician, width: PHONE_WIDTH });
    const context = page.context();
    const jobPage = await context.newPage();

    await journey.step('opens the fix on the phone and keeps it for the bench', async () => {
      await journey.goto(page, `/fixes/${fix.slug}`);
      await page.evaluate(async () => {
        await navigator.serviceWorker.ready;
        if (!navigator.serviceWorker.controller)
          await new Promise((resolve) => navigator.serviceWorker.addEventListener('controllerchange', resolve, { once: true }));
      });
      await page.getByRole('button', { name: 'Keep for the bench' }).click();
      await sees(page.getByText(/^Kept on this device: r\d+/));
    });

    await journey.step('opens the job sheet in a second tab', async () => {
      await journey.goto(jobPage, `/jobs/${jobId}`);
      await sees(jobPage.getByRole('heading', { name: 'Counter ticket 8127' }));
    });

    await journey.step('loses the connection and still reads the kept fix, marked as a saved copy', async () => {
      await context.setOffline(true);
      await journey.reload(page);
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(fix.title);
      await sees(page.getByText(/^Saved copy from .+; you are offline\.$/));
      await journey.goto(page, '/kept');
      await sees(page.getByRole('link', { name: fix.title }));
      await journey.navigates(page, new RegExp(`/fixes/${fix.slug}$`), () => page.getByRole('link', { name: fix.title }).click());
    });

    await journey.step('follows the remedy in the bench view, caution first, by keyboard', async () => {
      await page.getByRole('button', { name: 'Bench view' }).focus();
      await page.keyboard.press('Enter');
      const dialog = page.getByRole('dialog', { name: /Bench view/ });
      await sees(dialog);
      await sees(dialog.locator('.caution'));
      await page.keyboard.press('ArrowRight');
      await page.keyboard.press('ArrowRight');
      await sees(dialog.getByText(/^Step 3 of \d+$/));
      await page.keyboard.press('Escape');
      await dialog.waitFor({ state: 'detached' });
    });

    await journey.step('writes the findings into the job sheet offline and is told they wait', async () => {
      await jobPage.bringToFront();
      await jobPage.getByLabel('Findings').fill('Back tension band glazed; fitted a new band, verticals straight again');
      await jobPage.getByLabel('Labour (minutes)').fill('50');
      await jobPage.getByRole('button', { name: 'Save the job sheet' }).click();
      await sees(
        jobPage.getByText(
          /One change is waiting to be sent from this device: your changes to job sheet Counter ticket 8127\. You are offline/,
        ),
      );
      expect(await knex('job_sheets').where({ id: jobId }).first('findings')).toEqual({ findings: '' });
    });

    await journey.step('gets the connection back and finds the job sheet saved', async () => {
      await journey.navigates(jobPage, /\?job=saved$/, () => context.setOffline(false));
      await sees(jobPage.getByText('Saved.'));
      await expect(jobPage.getByLabel('Findings').inputValue()).resolves.toBe(
        'Back tension band glazed; fitted a new band, verticals straight again',
      );
      expect(await knex('job_sheets').where({ id: jobId }).first('findings', 'labour_minutes')).toEqual({
        findings: 'Back tension band glazed; fitted a new band, verticals straight again',
        labour_minutes: 50,
      });
      await jobPage.screenshot({ path: '/tmp/pwa-journey-saved-360.png', fullPage: true });
    });

    await journey.close();
  });

  it('is told a page is a saved copy when the connection crawls, and files a bench report offline that is sent later', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: technician, width: PHONE_WIDTH });
    const context = page.context();
    const address = `${base}/fixes/${fix.slug}`;
    const note = `Journey ${Date.now()}: new back tension band, verticals straight after an hour's soak test`;

    await journey.step('opens the fix on the phone while the connection is good', async () => {
      await journey.goto(page, `/fixes/${fix.slug}`);
      await underServiceWorker(journey, page);
      await sees(page.getByRole('heading', { level: 1, name: fix.title }));
      expect(await page.locator('.saved-copy').count()).toBe(0);
      await readThrough(page);
    });

    await journey.step('the connection crawls: the page comes from the saved copy and says the connection is slow', async () => {
      // Each answer for the fix page takes ten seconds, far past the few seconds the phone waits.
      await context.route(address, async (route) => {
        await new Promise((resolve) => setTimeout(resolve, 10_000));
        await route.continue().catch(() => {});
      });
      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.clearBrowserCache');
      await cdp.detach();
      await journey.reload(page);
      await sees(page.getByText(/^Saved copy from .+; the connection is slow, so this may be out of date\.$/));
      await context.unroute(address);
    });

    await journey.step('loses the connection, files a bench report and is told it waits on the phone', async () => {
      await context.setOffline(true);
      const form = page.locator('#bench-report-form');
      await form.getByLabel('Fixed', { exact: true }).check();
      await form.getByLabel(/Note for other technicians/).fill(note);
      await form.getByRole('button', { name: 'Save the bench report' }).click();
      // The line under the form's button (the parts table has one of its own).
      await sees(
        page
          .locator('#bench-report-form + [role="status"]')
          .getByText(
            `One change is waiting to be sent from this device: your bench report on “${fix.title}”. You are offline: they are sent, in order, when the connection comes back.`,
            { exact: true },
          ),
      );
    });

    await journey.step('still offline, puts the fix’s parts on the order list and sees both changes waiting', async () => {
      await page.getByRole('button', { name: 'Add all parts to the order list' }).click();
      await sees(
        page
          .locator('[aria-labelledby="parts"] [role="status"]')
          .getByText(
            `2 changes are waiting to be sent from this device: your bench report on “${fix.title}”; adding all parts of this fix to your order list. You are offline: they are sent, in order, when the connection comes back.`,
            { exact: true },
          ),
      );
      expect(await knex('bench_reports').where({ member_id: technician.id }).count({ n: '*' })).toEqual([{ n: '0' }]);
      await page.screenshot({ path: '/tmp/pwa-journey-bench-report-waiting-360.png' });
    });

    await journey.step('gets the connection back, sees the report sent and finds it among what other benches found', async () => {
      await context.setOffline(false);
      await sees(
        page
          .locator('#bench-report-form + [role="status"]')
          .getByText(`Sent from this device: your bench report on “${fix.title}”; adding all parts of this fix to your order list.`, {
            exact: true,
          }),
      );
      const list = await knex('order_lists').where({ owner_id: technician.id }).first('lines');
      expect((list?.lines as unknown[] | undefined)?.length).toBe(fix.parts);
      await page.screenshot({ path: '/tmp/pwa-journey-bench-report-sent-360.png' });
      await journey.reload(page);
      await sees(page.locator('.bench-note', { hasText: note }));
    });

    await journey.close();
  });

  it('at the desk, gets a report refused on reconnect back in its form as typed, completes it and sends it', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: technician, width: 1280 });
    const context = page.context();
    const note = `Journey ${Date.now()}: the drawer belt slipped again after the customer's move`;
    await journey.step('opens the fix with the connection up, so the page can hold a report offline', async () => {
      await journey.goto(page, `/fixes/${fix.slug}`);
      await underServiceWorker(journey, page);
      await readThrough(page);
      await page.waitForFunction(() => document.querySelector<HTMLElement>('#bench-report-form')?.dataset.outboxReady === 'yes');
    });

    await journey.step('offline, files "fault came back" with a note but forgets the days it held', async () => {
      await context.setOffline(true);
      const form = page.locator('#bench-report-form');
      await form.getByLabel('Fault came back', { exact: true }).check();
      await form.getByLabel(/Note for other technicians/).fill(note);
      await form.getByRole('button', { name: 'Save the bench report' }).press('Enter');
      await sees(page.locator('#bench-report-form + [role="status"]').getByText(/^One change is waiting to be sent/));
      // The form is cleared for the next report only by the page itself; the typed note lives in the queue now.
      await form.getByLabel(/Note for other technicians/).fill('');
    });

    await journey.step('back online, is told the report was refused and what it can do, by keyboard', async () => {
      await context.setOffline(false);
      const status = page.locator('#bench-report-form + [role="status"]');
      await sees(status.getByText(/was refused: .*It stays waiting and holds up what follows it: choose below\.$/));
      await page.screenshot({ path: '/tmp/journey-bench-report-refused-1280.png' });
      const back = status.getByRole('button', { name: 'Put it back in the form to change it' });
      await back.focus();
      await page.keyboard.press('Enter');
      const form = page.locator('#bench-report-form');
      await expect(form.getByLabel(/Note for other technicians/).inputValue()).resolves.toBe(note);
      expect(await form.getByLabel('Fault came back', { exact: true }).isChecked()).toBe(true);
      expect(await knex('bench_reports').where({ member_id: technician.id, note }).count({ n: '*' })).toEqual([{ n: '0' }]);
    });

    await journey.step('adds the days the repair held and sends it, and finds it among what other benches found', async () => {
      const form = page.locator('#bench-report-form');
      await form.getByLabel(/Days the repair held/).fill('45');
      await journey.navigates(page, /\/fixes\//, () => form.getByRole('button', { name: 'Save the bench report' }).click());
      await sees(page.locator('.bench-note', { hasText: note }));
      const saved = await knex('bench_reports').where({ member_id: technician.id, note }).first('outcome', 'held_days');
      expect(saved).toEqual({ outcome: 'came_back', held_days: 45 });
    });

    await journey.close();
  });
});
