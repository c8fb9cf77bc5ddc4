// Search in Chromium: results with JavaScript off; with it on, results as you type, "/" to focus, arrows and Enter to open.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { E2E_PORT } from '../support/test-env';

const base = `http://127.0.0.1:${E2E_PORT}`;
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('the search page without JavaScript', () => {
  it('answers a query typed in the form with results rendered on the server', async () => {
    const page = await browser.newPage({ javaScriptEnabled: false });
    await page.goto(`${base}/search`);
    await page.getByRole('combobox').fill('tary wont close');
    await page.getByRole('button', { name: 'Search', exact: true }).last().click();
    await page.waitForURL(/\/search\?q=tary\+wont\+close/);
    await expect(page.locator('#results-heading').textContent()).resolves.toMatch(/fix(es)? match/);
    await expect(page.locator('[data-results] a[href="/fixes/orx5-tray-will-not-close-ld-err-1"]').count()).resolves.toBe(1);
    await expect(page.getByText('Searched for').textContent()).resolves.toContain('tray');
    await page.close();
  });
});

describe('the search box with JavaScript', () => {
  it('shows results as you type, focuses on "/", and opens a result with the arrow keys and Enter', async () => {
    const page = await browser.newPage();
    const requests: string[] = [];
    page.on('request', (r) => {
      if (r.url().includes('/api/v1/search?')) requests.push(r.url());
    });
    await page.goto(`${base}/search`);
    // Wait until the box's script has taken over the input.
    await page.locator('[data-live-search][data-enhanced]').waitFor({ state: 'attached' });
    const box = page.getByRole('combobox');
    await page.locator('h1').click();
    await page.keyboard.press('/');
    await expect(box.evaluate((el) => el === document.activeElement)).resolves.toBe(true);

    await page.keyboard.type('no rewind', { delay: 30 });
    const options = page.getByRole('option');
    await options.first().waitFor({ state: 'visible', timeout: 10_000 });
    await expect(options.first().textContent()).resolves.toMatch(/rewind/i);
    await expect(box.getAttribute('aria-expanded')).resolves.toBe('true');
    await expect(options.first().textContent()).resolves.toMatch(/Bench score [01]\.\d\d from \d+ bench reports?|No bench reports yet/);
    // Typing is debounced: far fewer requests than keystrokes.
    expect(requests.length).toBeLessThan('no rewind'.length);

    await page.keyboard.press('ArrowDown');
    await expect(options.first().getAttribute('aria-selected')).resolves.toBe('true');
    const activeId = await box.getAttribute('aria-activedescendant');
    expect(activeId).toBe(await options.first().getAttribute('id'));
    const firstTitle = (await options.first().locator('span').first().textContent()) ?? '';
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/fixes\/[a-z0-9-]+$/);
    await expect(page.locator('h1').textContent()).resolves.toContain(firstTitle.trim());
    await page.close();
  });

  it('shows the newest query’s answer, never an older one that arrives late', async () => {
    const page = await browser.newPage();
    // Hold back the answer for "tray" so it lands after the answer for "tray motor hums".
    await page.route('**/api/v1/search?*', async (route) => {
      const q = new URL(route.request().url()).searchParams.get('q');
      if (q === 'tray') await new Promise((r) => setTimeout(r, 1500));
      await route.continue().catch(() => undefined);
    });
    await page.goto(`${base}/search`);
    await page.locator('[data-live-search][data-enhanced]').waitFor({ state: 'attached' });
    const box = page.getByRole('combobox');
    await box.click();
    await page.keyboard.type('tray');
    await page.waitForTimeout(400);
    await page.keyboard.type(' motor hums');
    await page.getByRole('option').first().waitFor({ state: 'visible' });
    await page.waitForTimeout(2000);
    const titlesOf = async (q: string) =>
      ((await (await fetch(`${base}/api/v1/search?q=${encodeURIComponent(q)}&perPage=6`)).json()).hits as { title: string }[]).map(
        (h) => h.title,
      );
    const [newest, older] = await Promise.all([titlesOf('tray motor hums'), titlesOf('tray')]);
    expect(newest).not.toEqual(older);
    const shown = await page.getByRole('option').locator('span.font-serif').allTextContents();
    expect(shown).toEqual(newest);
    await page.close();
  });
});
