// In Chromium: while a member writes a symptom for a machine, live fixes for it that look the same are named,
// with links that open in a new tab; nothing shows when nothing is alike, nor for the fix being edited itself.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page, Response } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { DEMO_PASSWORD, createUser } from '../support/sign-in';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;

/** A seeded fix for the seeded machine below, whose symptoms include "tray won't open". */
const SEEDED_FIX = 'tl2-tray-will-not-open-e21';
const MACHINE = { model: 'DR-4120K', label: 'DR-4120K (PAL)' };

/** The next answer of the similar-fixes endpoint whose symptom contains `words`. */
function similarAnswer(page: Page, words: string): Promise<Response> {
  return page.waitForResponse((r) => {
    const url = new URL(r.url());
    return url.pathname === '/api/v1/search/similar' && (url.searchParams.get('symptom') ?? '').includes(words);
  });
}

const notice = (page: Page) => page.locator('[role="status"]:has([data-similar-fixes])');

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

describe('the duplicate warning on the writing page', () => {
  it('names a live fix for the machine that looks like the symptom, and goes when the symptom matches nothing', async () => {
    const fix = await knex('fixes as f')
      .join('revisions as r', 'r.id', 'f.current_revision_id')
      .where('f.slug', SEEDED_FIX)
      .first('r.title');
    expect(fix?.title).toBeTruthy();
    const context = await signedInContext(browser, base, 'member@example.test', DEMO_PASSWORD);
    const page = await context.newPage();
    await page.goto(`${base}/write`);
    await page.getByRole('combobox', { name: 'Add a machine or chassis family' }).fill(MACHINE.model);
    await page.getByRole('option').filter({ hasText: MACHINE.label }).first().click();

    const answered = similarAnswer(page, 'will not open');
    await page.getByRole('textbox', { name: 'symptom 1', exact: true }).fill('The tray will not open');
    expect((await answered).status()).toBe(200);
    await notice(page).waitFor({ timeout: 10_000 });
    // Other test files may add fixes to the machine's family, which widens the heading: any of its machine forms.
    await expect(notice(page).textContent()).resolves.toMatch(
      /These fixes for this machine( and its chassis family|'s chassis family)? look similar/,
    );
    const link = notice(page).getByRole('link', { name: new RegExp(fix.title.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')) });
    await expect(link.getAttribute('href')).resolves.toBe(`/fixes/${SEEDED_FIX}`);
    await expect(link.getAttribute('target')).resolves.toBe('_blank');
    await expect(notice(page).textContent()).resolves.toMatch(/Bench score [01]\.\d\d from \d+ bench reports?|No bench reports yet/);

    // A symptom like nothing written: the server answers no fixes, and the notice goes.
    const nothing = similarAnswer(page, 'quibbling');
    await page.getByRole('textbox', { name: 'symptom 1', exact: true }).fill('Zarnock quibbling on the vexmeter');
    const empty = await nothing;
    expect(((await empty.json()) as { items: unknown[] }).items).toEqual([]);
    await notice(page).waitFor({ state: 'detached', timeout: 10_000 });
    await expect(page.locator('[data-similar-fixes]').count()).resolves.toBe(0);
    await context.close();
  });

  it('never offers the fix being edited as a duplicate of itself', async () => {
    const user = await createUser(knex, { role: 'member', tag: 'e2e-duplicate-editor' });
    const context = await signedInContext(browser, base, user.email, user.password);
    const page = await context.newPage();
    // The live fix's own symptom and machines fill the form, so the endpoint finds the fix itself.
    const answered = similarAnswer(page, '');
    await page.goto(`${base}/fixes/${SEEDED_FIX}/edit`);
    const answer = (await (await answered).json()) as { items: { slug: string }[] };
    expect(answer.items.map((i) => i.slug)).toContain(SEEDED_FIX);
    // Let the answer render, then check the fix is not linked (other fixes of the family may be).
    await page.waitForTimeout(300);
    await expect(page.locator(`[data-similar-fixes] a[href="/fixes/${SEEDED_FIX}"]`).count()).resolves.toBe(0);
    await context.close();
  });
});
