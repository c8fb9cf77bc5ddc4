// In Chromium, a writer's draft with invalid fields: everything typed is saved, the fields are marked and still there
// after a reload, only submission waits for them, and once they are fixed the fix goes to the desk.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser } from '../support/sign-in';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

/** Waits until the server confirms the newest edit. */
async function saved(page: Page): Promise<void> {
  await page.waitForFunction(() => document.querySelector('[data-save-state]')?.getAttribute('data-save-state') === 'saved', null, {
    timeout: 15_000,
  });
}

describe('a draft with invalid fields', () => {
  it('is saved with everything typed, marked after a reload, and submitted once the fields are fixed', async () => {
    const machine = await knex('machines').whereNull('deleted_at').orderBy('id').offset(9).first('id', 'model_number');
    const user = await createUser(knex, { tag: 'e2e-held' });
    const context = await signedInContext(browser, base, user.email, user.password);
    const page = await context.newPage();
    const title = `Idler tyre slips on rewind ${Date.now()}`;
    await page.goto(`${base}/write`);
    await page.getByLabel('Title', { exact: true }).fill(title);
    await page.getByRole('combobox', { name: 'Add a machine or chassis family' }).fill(machine.model_number);
    await page.getByRole('option').filter({ hasText: machine.model_number }).first().click();
    await page.getByRole('textbox', { name: 'symptom 1', exact: true }).fill('No rewind, play works');
    await page.getByLabel('Bench time in minutes').fill('-5');
    await page.getByRole('button', { name: 'Add a part' }).click();
    await page.getByLabel('Kind of part 1').selectOption('idler_tyre');
    await page.getByLabel('Value of part 1').fill('idler tyre 18 mm');
    await page.getByLabel('Quantity of part 1').fill('0');
    await page.getByRole('textbox', { name: /Remedy/ }).click();
    await page.keyboard.type('Fit a new idler tyre.');
    await saved(page);

    // Saved, not refused: the two fields are marked where they stand, and the indicator counts them.
    await expect(page.locator('[data-held-count]').getAttribute('data-held-count')).resolves.toBe('2');
    await expect(page.locator('#field-timeMinutes-error').textContent()).resolves.toMatch(/whole number of minutes.*e\.g\. 45/);
    await expect(page.getByLabel('Bench time in minutes').getAttribute('aria-invalid')).resolves.toBe('true');
    await expect(page.getByLabel('Quantity of part 1').getAttribute('aria-invalid')).resolves.toBe('true');
    await expect(page.locator('#part-0-quantity-error').textContent()).resolves.toMatch(/from 1 to 999, e\.g\. 2/);
    await expect(page.getByText(/Not saved/).count()).resolves.toBe(0);

    // Edits elsewhere are saved with them.
    await page.getByLabel('Cause', { exact: true }).fill('The idler tyre has hardened and slips on the reel table.');
    await saved(page);
    await page.screenshot({ path: '/tmp/writer-held-before-reload.png', fullPage: true });

    await page.reload();
    await page.getByLabel('Title', { exact: true }).waitFor();
    await expect(page.getByLabel('Title', { exact: true }).inputValue()).resolves.toBe(title);
    await expect(page.getByLabel('Cause', { exact: true }).inputValue()).resolves.toBe(
      'The idler tyre has hardened and slips on the reel table.',
    );
    await expect(page.getByRole('textbox', { name: 'symptom 1', exact: true }).inputValue()).resolves.toBe('No rewind, play works');
    await expect(page.getByLabel('Value of part 1').inputValue()).resolves.toBe('idler tyre 18 mm');
    await expect(page.getByRole('textbox', { name: /Remedy/ }).textContent()).resolves.toBe('Fit a new idler tyre.');
    // The invalid fields come back as typed, still marked.
    await expect(page.getByLabel('Bench time in minutes').inputValue()).resolves.toBe('-5');
    await expect(page.getByLabel('Quantity of part 1').inputValue()).resolves.toBe('0');
    await expect(page.locator('#field-timeMinutes-error').textContent()).resolves.toMatch(/whole number of minutes/);
    await expect(page.locator('#part-0-quantity-error').textContent()).resolves.toMatch(/from 1 to 999/);
    await expect(page.locator('[data-held-count]').getAttribute('data-held-count')).resolves.toBe('2');

    // On a phone the parts and readings tables scroll inside their own boxes; the page does not scroll sideways.
    await page.setViewportSize({ width: 360, height: 800 });
    await page.getByRole('button', { name: 'Add a reading' }).click();
    await expect(page.evaluate(() => document.documentElement.scrollWidth)).resolves.toBeLessThanOrEqual(360);
    await page.screenshot({ path: '/tmp/writer-held-360.png', fullPage: true });
    await page.getByRole('button', { name: 'Remove reading 1' }).click();
    await page.setViewportSize({ width: 1280, height: 900 });

    // Submission waits for them, and says what to change; the page stays.
    await page.getByRole('button', { name: 'Submit for proofing' }).click();
    await expect(page.getByRole('alert').first().textContent()).resolves.toMatch(/not ready to submit/);
    await expect(page.getByRole('alert').first().textContent()).resolves.toMatch(/Bench time is a whole number of minutes/);
    expect(new URL(page.url()).pathname).toBe('/write');

    // Fixed: the marks go, and the fix goes to the desk.
    await page.getByLabel('Bench time in minutes').fill('30');
    await page.getByLabel('Quantity of part 1').fill('1');
    await saved(page);
    await expect(page.locator('[data-held-count]').count()).resolves.toBe(0);
    await expect(page.locator('#part-0-quantity-error').textContent()).resolves.toBe('');
    await Promise.all([page.waitForURL(/\/write\/mine\?submitted=/), page.getByRole('button', { name: 'Submit for proofing' }).click()]);
    const row = await knex('revisions').where({ author_id: user.id, title }).first('state', 'time_minutes', 'parts');
    expect(row.state).toBe('submitted');
    expect(row.time_minutes).toBe(30);
    expect(row.parts[0]).toMatchObject({ kind: 'idler_tyre', quantity: 1 });
    await context.close();
  });
});
