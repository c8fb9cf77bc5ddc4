// An editor reaches their pages from the header: word families (adds one) and wanted fixes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { Journey, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let editor: TestUser;

beforeAll(async () => {
  browser = await launchBrowser();
  editor = await createUser(knex, { role: 'editor', tag: 'journey-editor' });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

describe('an editor', () => {
  it('opens word families and wanted fixes from the header and adds a word family', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: editor });
    // Staff pages sit in the header's second row, beside the main navigation.
    const nav = page.getByRole('banner');
    // Invented words of this run only, so no other test's search changes.
    const suffix = Date.now().toString(36);
    const family = `Journey spindle ${suffix}`;

    await journey.step('sees their pages in the header', async () => {
      await journey.goto(page, '/');
      await sees(nav.getByRole('link', { name: /Word families/i }));
      await sees(nav.getByRole('link', { name: /Wanted fixes/i }));
      await expect(nav.getByRole('link', { name: /Proofing desk/i }).count()).resolves.toBe(0);
    });

    await journey.step('opens word families and adds one', async () => {
      await journey.navigates(page, /\/admin\/word-families$/, () => nav.getByRole('link', { name: /Word families/i }).click());
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Word families');
      await page.getByRole('region', { name: 'Add a family' }).getByLabel('Name').fill(family);
      await page
        .getByRole('region', { name: 'Add a family' })
        .getByLabel(/Terms, one per line/)
        .fill(`jspindle${suffix}\njturntable${suffix}`);
      await journey.navigates(page, /\/admin\/word-families/, () => page.getByRole('button', { name: 'Add family' }).click());
      await sees(page.getByRole('button', { name: `Retire “${family}”` }));
    });

    await journey.step('opens wanted fixes and sees the searches that found nothing', async () => {
      await journey.navigates(page, /\/admin\/wanted-fixes$/, () => nav.getByRole('link', { name: /Wanted fixes/i }).click());
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Wanted fixes');
      await expect(page.getByRole('main').innerText()).resolves.toMatch(/search/i);
    });

    await journey.close();
  });
});
