// In Chromium, the remedy editor's tables from the keyboard alone: reach the toolbar, insert a table, move
// between cells with Tab, get back to the toolbar from inside the table with Alt+F10, add a row.
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

const focusedLabel = (page: Page) => page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? '');

/** Arrow keys along the toolbar until the named button has focus (the toolbar is one tab stop). */
async function arrowTo(page: Page, label: string): Promise<void> {
  for (let i = 0; i < 30 && (await focusedLabel(page)) !== label; i++) await page.keyboard.press('ArrowRight');
  expect(await focusedLabel(page)).toBe(label);
}

describe('tables in the remedy editor from the keyboard', () => {
  it('inserts a table, fills cells with Tab, returns to the toolbar with Alt+F10 and adds a row', async () => {
    const user = await createUser(knex, { tag: 'e2e-keyboard-tables' });
    const context = await signedInContext(browser, base, user.email, user.password);
    const page = await context.newPage();
    await page.goto(`${base}/write`);
    const remedy = page.getByRole('textbox', { name: /Remedy/ });
    await remedy.focus();

    await page.keyboard.press('Alt+F10');
    expect(await page.evaluate(() => document.activeElement?.closest('[role="toolbar"]')?.getAttribute('aria-label'))).toBe(
      'Remedy formatting',
    );
    await arrowTo(page, 'Insert table');
    await page.keyboard.press('Enter');
    await expect(remedy.locator('table').count()).resolves.toBe(1);
    // The editor takes focus back a frame after the button's action; the typing below goes into the first cell.
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('role'))).toBe('textbox');

    for (const text of ['Test point', 'Expected', 'Measured', 'TP4', '12 V', '11.6 V']) {
      await page.keyboard.type(text);
      await page.keyboard.press('Tab');
    }
    await expect(remedy.locator('th').allTextContents()).resolves.toEqual(['Test point', 'Expected', 'Measured']);
    await expect(remedy.locator('tr').nth(1).locator('td').allTextContents()).resolves.toEqual(['TP4', '12 V', '11.6 V']);
    const rows = await remedy.locator('tr').count();

    // From inside the table, Tab belongs to the cells; Alt+F10 reaches the table buttons.
    await page.keyboard.press('Alt+F10');
    await arrowTo(page, 'Add table row below');
    await page.keyboard.press('Enter');
    await expect(remedy.locator('tr').count()).resolves.toBe(rows + 1);
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('role'))).toBe('textbox');
    await context.close();
  });
});
