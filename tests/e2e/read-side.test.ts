// A reader in Chromium goes home → machine → fix; cautions stand above the remedy; the fix page has no script.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${E2E_PORT}`;
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe('reading a fix', () => {
  it('follows home → machine → fix and finds the cautions above the remedy', async () => {
    const knex = testDb();
    // A machine whose fixes include one with a caution, so the walk ends on a page that has both.
    const target = await knex('fix_machines as fm')
      .join('fixes as f', 'f.id', 'fm.fix_id')
      .join('revisions as r', 'r.id', 'f.current_revision_id')
      .join('machines as m', 'm.id', 'fm.machine_id')
      .join('makers as mk', 'mk.id', 'm.maker_id')
      .whereRaw('jsonb_array_length(r.cautions) > 0')
      .first('m.slug as machine_slug', 'mk.slug as maker_slug', 'f.slug as fix_slug');
    await knex.destroy();

    const page = await browser.newPage({ javaScriptEnabled: false });
    await page.goto(`${base}/`);
    await expect(page.getByRole('searchbox').first().isVisible()).resolves.toBe(true);
    await page.click(`a[href="/makers/${target.maker_slug}"]`);
    await page.click(`a[href="/machines/${target.machine_slug}"]`);
    expect(page.url()).toBe(`${base}/machines/${target.machine_slug}`);
    await page.click(`a[href="/fixes/${target.fix_slug}"]`);
    expect(page.url()).toBe(`${base}/fixes/${target.fix_slug}`);

    const cautions = await page.locator('#cautions').boundingBox();
    const remedy = await page.locator('#remedy').boundingBox();
    expect(cautions).not.toBeNull();
    expect(remedy).not.toBeNull();
    expect(cautions!.y).toBeLessThan(remedy!.y);
    expect(scriptsBesideRegistration(await page.content())).toEqual([]);
    await expect(page.locator('h1').textContent()).resolves.toBeTruthy();
    await page.close();
  });
});
