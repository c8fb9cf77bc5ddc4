// A bench technician on a phone in a workshop with poor reception: keeps the fix for the deck on the bench, loses the
// connection, follows the remedy in the bench view, writes the findings into the job sheet offline, and finds them
// saved when the connection comes back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { createJobSheet } from '@/server/bench-work/job-sheets';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { closeDb } from '@/server/core/db';
import { Journey, PHONE_WIDTH, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let technician: TestUser;
let fix: { slug: string; title: string; number: number; machine: string };
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
    .whereExists(knex('revision_photos as rp').whereRaw('rp.revision_id = r.id'))
    .orderBy('f.id')
    .first('f.slug', 'r.title', 'r.number', 'm.slug as machine');
  // Booked in at the counter this morning, before the technician took the deck to the bench.
  const job = await createJobSheet(
    technician.id,
    jobSheetCreateSchema.parse({ customerRef: 'Counter ticket 8127', machine: fix.machine, reportedSymptom: 'Picture bends at the top' }),
  );
  if (!job.ok) throw new Error(job.message);
  jobId = job.value;
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
  await closeDb();
});

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
});
