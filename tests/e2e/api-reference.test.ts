// /api in Chromium: the guides and every documented operation render from the local viewer, with no request to any other host.
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

describe('the API reference page', () => {
  for (const width of [1280, 360]) {
    it(`renders every operation at ${width} px without asking any other host`, async () => {
      const context = await browser.newContext({ viewport: { width, height: 900 } });
      const page = await context.newPage();
      const outside: string[] = [];
      const errors: string[] = [];
      // Every request the page makes, images and fonts included: only this server (or inline data) may answer.
      page.on('request', (request) => {
        const url = request.url();
        if (!url.startsWith(`${base}/`) && !url.startsWith('data:') && !url.startsWith('blob:')) outside.push(url);
      });
      page.on('console', (message) => {
        if (message.type() === 'error') errors.push(message.text());
      });
      page.on('pageerror', (error) => errors.push(error.message));
      await page.goto(`${base}/api`);
      for (const guide of ['Authentication', 'Rate limits', 'Errors and versions', 'Paging'])
        await page.getByRole('heading', { name: guide, level: 2 }).waitFor({ state: 'visible', timeout: 5_000 });
      await page.waitForSelector('.opblock-summary-control');
      const doc = await (await fetch(`${base}/api/v1/openapi.json`)).json();
      const documented = Object.values(doc.paths as Record<string, object>).reduce((n, methods) => n + Object.keys(methods).length, 0);
      await expect(page.locator('.opblock').count()).resolves.toBe(documented);
      // Open one operation by keyboard: its token rule is shown.
      await page.locator('.opblock-summary-control').filter({ hasText: '/api/v1/job-sheets/{id}' }).first().focus();
      await page.keyboard.press('Enter');
      // The operation opens with an animation: wait for its text rather than asking once.
      await page.getByText('An API token with the bench_work scope may call it.').first().waitFor({ state: 'visible', timeout: 5_000 });
      await page.waitForLoadState('networkidle');
      expect(outside).toEqual([]);
      expect(errors).toEqual([]);
      const sideways = await page.evaluate('document.documentElement.scrollWidth - document.documentElement.clientWidth');
      expect(sideways).toBeLessThanOrEqual(0);
      await context.close();
    });
  }
});
