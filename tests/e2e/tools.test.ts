// Bench tools in Chromium: the bleed-down tool answers as you type and draws its chart; a reader adds a fix's parts to the order list and downloads the CSV; a failed save never loses the browser copy.
import { readFile } from 'node:fs/promises';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page, Route } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser } from '../support/sign-in';

const base = `http://127.0.0.1:${E2E_PORT}`;
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** A demo fix with at least three capacitor rows, so the list has something to merge and total. */
async function fixWithCapacitors(): Promise<{ slug: string; partCount: number }> {
  const knex = testDb();
  try {
    const fix = await knex('fixes as f')
      .join('revisions as r', 'r.id', 'f.current_revision_id')
      .whereNull('f.deleted_at')
      .whereNull('f.hidden_at')
      .whereRaw(`(select count(*) from jsonb_array_elements(r.parts) p where p->>'kind' = 'capacitor') >= 3`)
      .orderBy('f.id')
      .first('f.slug', 'r.parts');
    return { slug: fix.slug, partCount: (fix.parts as Array<{ quantity: number }>).reduce((sum, p) => sum + p.quantity, 0) };
  } finally {
    await knex.destroy();
  }
}

async function addAllParts(page: Page, slug: string): Promise<void> {
  await page.goto(`${base}/fixes/${slug}`);
  await page.getByRole('button', { name: 'Add all parts to the order list' }).click();
  await page.waitForURL((url) => url.pathname === '/order-list' && !url.searchParams.has('add') && !url.searchParams.has('added'));
  await hydrated(page);
}

async function signIn(page: Page, member: { email: string; password: string }): Promise<void> {
  await page.goto(`${base}/sign-in`);
  await page.fill('#pw-email', member.email);
  await page.fill('#pw-password', member.password);
  await Promise.all([
    page.waitForURL((url) => url.pathname !== '/sign-in'),
    page.click('form:has(input[value="password"]) button[type="submit"]'),
  ]);
}

/** Astro drops the ssr attribute once an island has hydrated. */
async function hydrated(page: Page): Promise<void> {
  await page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });
}

/** How many pixels of the canvas are drawn on (not transparent). */
function drawnPixels(page: Page): Promise<number> {
  return page.$eval('.tool-chart canvas', (canvas) => {
    const c = canvas as HTMLCanvasElement;
    const data = c.getContext('2d')?.getImageData(0, 0, c.width, c.height).data ?? new Uint8ClampedArray();
    let drawn = 0;
    for (let i = 3; i < data.length; i += 4) if ((data[i] ?? 0) > 0) drawn += 1;
    return drawn;
  });
}

describe('bleed-down tool', () => {
  it('computes the worked example as you type and draws the decay', async () => {
    const page = await browser.newPage();
    await page.goto(`${base}/tools/bleed-down`);
    await hydrated(page);
    await page.getByLabel('Capacitance').pressSequentially('150uF');
    await page.getByLabel('Bleed resistor').pressSequentially('470k');
    await page.getByLabel('Starting voltage').pressSequentially('340V');
    // RC discharge: t = RC·ln(V0/Vsafe) = 70.5 s × ln(340/60) = 122 s to the 60 V ES1 limit of IEC 62368-1.
    await page.getByText('122 s (2 min 2 s)').first().waitFor();
    await expect(page.locator('.tool-result').textContent()).resolves.toContain('0.246 W');
    await page.waitForSelector('[data-chart-ready="true"] canvas');
    await page.waitForFunction(() => {
      const c = document.querySelector('.tool-chart canvas') as HTMLCanvasElement | null;
      return c !== null && c.width > 0 && c.height > 0;
    });
    expect(await drawnPixels(page)).toBeGreaterThan(500);
    // The address follows the fields, so the page can be shared or printed with its result.
    expect(new URL(page.url()).searchParams.get('capacitance')).toBe('150uF');
    // The figures stay readable as a table beside the chart.
    await expect(page.locator('table.tool-table').textContent()).resolves.toContain('reaches 60 V');
    await page.close();
  });

  it('shows the error and an example, never a figure, for a voltage where a capacitance is asked', async () => {
    const page = await browser.newPage();
    await page.goto(`${base}/tools/bleed-down`);
    await hydrated(page);
    await page.getByLabel('Capacitance').fill('16V');
    await page.getByLabel('Bleed resistor').fill('470k');
    await page.getByLabel('Starting voltage').fill('340V');
    await page.getByText('is a voltage, but a capacitance is expected here').waitFor();
    const result = (await page.locator('.tool-result').textContent()) ?? '';
    expect(result).not.toMatch(/NaN|Infinity|undefined|Time to/);
    await page.close();
  });
});

describe('substitute check from a fix', () => {
  it('shows no error before anything is typed, then checks the candidate typed by keyboard', async () => {
    const { slug } = await fixWithCapacitors();
    const page = await browser.newPage();
    await page.goto(`${base}/fixes/${slug}`);
    await Promise.all([
      page.waitForURL((url) => url.pathname === '/tools/substitute-check'),
      page.getByRole('link', { name: 'Check a substitute' }).first().click(),
    ]);
    // Nothing marked wrong on the page as served, nor once it has hydrated.
    const served = (await page.content()).toString();
    expect(served).not.toContain('tool-error');
    await hydrated(page);
    expect(await page.locator('.tool-error, .tool-invalid, [aria-invalid="true"]').count()).toBe(0);
    await page.getByText('Still needed: Candidate value').waitFor();
    await page.getByLabel('Candidate value').focus();
    await page.keyboard.type('470u');
    await page.keyboard.press('Tab');
    await page.keyboard.type('25V 105C');
    await page.locator('.tool-result table').waitFor();
    expect(await page.locator('.tool-result').textContent()).toMatch(/Rated voltage/);
    await page.close();
  });

  it('has no placeholder in any tool field: examples are in the hint', async () => {
    const page = await browser.newPage();
    for (const tool of ['value-decoder', 'preferred-values', 'substitute-check', 'esr', 'life-estimate', 'bleed-down']) {
      await page.goto(`${base}/tools/${tool}`);
      await hydrated(page);
      expect(await page.locator('.tool-form [placeholder]').count(), tool).toBe(0);
      expect(await page.locator('.tool-form').textContent(), tool).toMatch(/e\.g\. /);
    }
    await page.close();
  });
});

describe('value decoder', () => {
  it('reads a decimal comma and refuses mixed notations with the reason and an example, keeping what was typed', async () => {
    const page = await browser.newPage();
    await page.goto(`${base}/tools/value-decoder`);
    await hydrated(page);
    await page.getByLabel('Value').fill('4,7µF');
    await page.locator('.tool-result').getByText('4.7 µF').first().waitFor();
    await page.getByLabel('Value').fill('4k7Ω5');
    await page.getByText('mixes an RKM code with a unit').waitFor();
    expect(await page.locator('.tool-error').textContent()).toContain('For example: 4k7 or 4.7 kΩ');
    expect(await page.getByLabel('Value').inputValue()).toBe('4k7Ω5');
    await page.getByLabel('Value').fill('100uF/16V 105°C');
    await page.getByText('100 µF 16 V 105 °C').first().waitFor();
    await page.close();
  });
});

describe('order list', () => {
  it('adds all parts of a fix as an anonymous reader, keeps them in the browser and downloads the CSV', async () => {
    const { slug, partCount } = await fixWithCapacitors();
    const context = await browser.newContext({ acceptDownloads: true });
    const page = await context.newPage();
    await page.goto(`${base}/fixes/${slug}`);
    expect(await page.locator('script:not([type="application/ld+json"])').count()).toBe(0);
    await addAllParts(page, slug);
    await page.getByText(`Added ${partCount} ${partCount === 1 ? 'part' : 'parts'} to the list kept in this browser.`).waitFor();
    const rows = await page.locator('table.order-table tbody tr').count();
    expect(rows).toBeGreaterThan(0);

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download CSV' }).click()]);
    expect(download.suggestedFilename()).toBe('order-list.csv');
    const csv = (await readFile((await download.path()) ?? '', 'utf8')).replace(/^\uFEFF/, '');
    const lines = csv.trim().split('\n');
    expect(lines[0]).toBe('kind,part,quantity,spares,to order,refs,sources,notes,flag');
    expect(lines).toHaveLength(rows + 1);
    expect(csv).toContain('capacitor,');

    // Kept in this browser: the list is still there after a reload, and the same fix again doubles it.
    await page.reload();
    await hydrated(page);
    await expect(page.locator('table.order-table tbody tr').count()).resolves.toBe(rows);
    await addAllParts(page, slug);
    await expect(page.locator('table.order-table tbody tr').count()).resolves.toBe(rows);
    const totals = await page.locator('table.order-table tbody tr td:nth-child(6)').allTextContents();
    expect(totals.reduce((sum, t) => sum + Number(t), 0)).toBe(2 * partCount);
    await context.close();
  });

  it("merges the browser copy into a member's saved list on the first visit signed in, and saves edits", async () => {
    const { slug, partCount } = await fixWithCapacitors();
    const knex = testDb();
    const member = await createUser(knex, { tag: 'order-list' });
    await knex.destroy();
    const context = await browser.newContext();
    const page = await context.newPage();
    await addAllParts(page, slug);
    const rows = await page.locator('table.order-table tbody tr').count();

    await signIn(page, member);
    await page.goto(`${base}/order-list`);
    await hydrated(page);
    await page.getByText(`Merged ${rows} ${rows === 1 ? 'line' : 'lines'} kept in this browser into your saved list.`).waitFor();
    await page.getByText('Saved with your account.', { exact: true }).waitFor();
    expect(await page.evaluate(() => window.localStorage.getItem('benchlore.order-list.v1'))).toBeNull();
    const saved = await (await page.request.get(`${base}/api/v1/order-list`)).json();
    expect(saved.lines.reduce((sum: number, l: { quantity: number }) => sum + l.quantity, 0)).toBe(partCount);

    // An edit is saved with the account: it is there after a reload, from the server.
    const [put] = await Promise.all([
      page.waitForResponse((r) => r.url() === `${base}/api/v1/order-list` && r.request().method() === 'PUT'),
      page
        .getByLabel(/^Quantity of /)
        .first()
        .fill('7'),
    ]);
    expect(put.status()).toBe(200);
    await page.reload();
    await hydrated(page);
    await expect(
      page
        .getByLabel(/^Quantity of /)
        .first()
        .inputValue(),
    ).resolves.toBe('7');
    await context.close();
  });

  it('keeps the browser copy and says so when the first save signed in fails, and clears it once a save succeeds', async () => {
    const { slug, partCount } = await fixWithCapacitors();
    const knex = testDb();
    const member = await createUser(knex, { tag: 'order-list-fail' });
    await knex.destroy();
    const context = await browser.newContext();
    const page = await context.newPage();
    await addAllParts(page, slug);
    const rows = await page.locator('table.order-table tbody tr').count();
    const readBrowserCopy = async (): Promise<unknown> =>
      JSON.parse((await page.evaluate(() => window.localStorage.getItem('benchlore.order-list.v1'))) ?? 'null');
    const browserCopy = await readBrowserCopy();
    expect(browserCopy).toMatchObject({ lines: expect.arrayContaining([expect.objectContaining({ kind: 'capacitor' })]) });

    await signIn(page, member);
    // The server fails every save of the list until the route is removed.
    const failSaves = (route: Route) =>
      route.request().method() === 'PUT'
        ? route.fulfill({
            status: 500,
            contentType: 'application/json',
            body: JSON.stringify({ error: { code: 'internal', message: 'down' } }),
          })
        : route.continue();
    await page.route(`${base}/api/v1/order-list`, failSaves);
    await page.goto(`${base}/order-list`);
    await hydrated(page);
    await page.getByText('Could not save the last change; it is still on this page.').waitFor();
    expect(await readBrowserCopy()).toEqual(browserCopy);
    await page.getByText(`Could not add ${rows} ${rows === 1 ? 'line' : 'lines'} to your saved list; this browser still keeps`).waitFor();
    const unsaved = await (await page.request.get(`${base}/api/v1/order-list`)).json();
    expect(unsaved.lines).toEqual([]);

    // A reload while saves still fail merges the same copy again: nothing lost, nothing doubled.
    await page.reload();
    await hydrated(page);
    await page.getByText('Could not save the last change; it is still on this page.').waitFor();
    await expect(page.locator('table.order-table tbody tr').count()).resolves.toBe(rows);
    expect(await readBrowserCopy()).toEqual(browserCopy);

    // Once the server answers again, "Save again" stores the list and only then clears the browser copy.
    await page.unroute(`${base}/api/v1/order-list`, failSaves);
    await page.getByRole('button', { name: 'Save again' }).click();
    await page.getByText('Saved with your account.', { exact: true }).waitFor();
    await page.getByText(`Merged ${rows} ${rows === 1 ? 'line' : 'lines'} kept in this browser into your saved list.`).waitFor();
    expect(await page.evaluate(() => window.localStorage.getItem('benchlore.order-list.v1'))).toBeNull();
    const saved = await (await page.request.get(`${base}/api/v1/order-list`)).json();
    expect(saved.lines.reduce((sum: number, l: { quantity: number }) => sum + l.quantity, 0)).toBe(partCount);
    await context.close();
  });
});
