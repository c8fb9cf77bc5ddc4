// At the bench with a phone and on paper: the bench view steps through a fix's cautions and remedy in large text by
// button and keyboard; a fix prints as a bench sheet (tick column, empty "measured" column, QR code to the revision)
// and a job sheet as a workshop ticket, with no navigation and no buttons on paper.
import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { demoWorldFixes } from '../support/demo-world';
import { makeMember, PASSWORD } from '../integration/bench-work-support';
import { createJobSheet } from '@/server/bench-work/job-sheets';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { horizontalOverflow } from '../support/overflow';
import { closeDb } from '@/server/core/db';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;
/** A live fix with cautions, parts and readings: the fullest bench sheet of the demo world. */
let fix: {
  slug: string;
  number: number;
  title: string;
  parts: { ref: string; value: string }[];
  readings: { testPoint: string }[];
  cautions: number;
  machine: string;
};

beforeAll(async () => {
  browser = await launchBrowser();
  fix = await demoWorldFixes(knex)
    .whereRaw('jsonb_array_length(r.cautions) > 0 AND jsonb_array_length(r.parts) > 0 AND jsonb_array_length(r.readings) > 0')
    .orderBy('f.id')
    .first(
      'f.slug',
      'r.number',
      'r.title',
      'r.parts',
      'r.readings',
      knex.raw('jsonb_array_length(r.cautions) AS cautions'),
      'm.slug as machine',
    );
  if (!fix) throw new Error('The demo world needs a live fix with cautions, parts and readings.');
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
  await closeDb();
});

/** Elements shown in the current media: their count by selector. */
async function shown(page: Page, selector: string): Promise<number> {
  return page
    .locator(selector)
    .evaluateAll((els) => els.filter((el) => el.getClientRects().length > 0 && getComputedStyle(el).visibility !== 'hidden').length);
}

describe('the bench view', () => {
  it('steps through the cautions and the remedy in large text by button and keyboard, and closes back to its button', async () => {
    for (const width of [1280, 360]) {
      const context = await browser.newContext({ viewport: { width, height: 740 } });
      const page = await context.newPage();
      await page.goto(`${base}/fixes/${fix.slug}`);
      const opener = page.getByRole('button', { name: 'Bench view' });
      await opener.click();
      const dialog = page.getByRole('dialog', { name: 'Bench view: the remedy step by step' });
      await dialog.waitFor();
      const count = dialog.locator('.bench-view__count');
      const total = Number(/of (\d+)$/.exec((await count.textContent()) ?? '')?.[1]);
      expect(total).toBeGreaterThan(Number(fix.cautions));
      expect(await count.textContent()).toBe(`Step 1 of ${total}`);
      expect(await dialog.locator('.bench-view__step .caution').count()).toBe(1);
      const size = await dialog.locator('.bench-view__step').evaluate((el) => parseFloat(getComputedStyle(el).fontSize));
      expect(size).toBeGreaterThanOrEqual(21);
      // The screen lock is asked for; whether headless Chromium grants it, the page says which.
      expect(await dialog.locator('.bench-view__awake').textContent()).toMatch(
        /^(The screen stays on while this is open\.|The screen could not be kept on \(battery saver\?\)\.)$/,
      );
      await page.keyboard.press('ArrowRight');
      expect(await count.textContent()).toBe(`Step 2 of ${total}`);
      await dialog.getByRole('button', { name: 'Next step' }).click();
      expect(await count.textContent()).toBe(`Step 3 of ${total}`);
      await page.keyboard.press('ArrowLeft');
      await dialog.getByRole('button', { name: 'Back' }).click();
      expect(await count.textContent()).toBe(`Step 1 of ${total}`);
      expect(await dialog.getByRole('button', { name: 'Back' }).isDisabled()).toBe(true);
      for (const button of await dialog.getByRole('button').all()) expect((await button.boundingBox())!.height).toBeGreaterThanOrEqual(44);
      expect(await horizontalOverflow(page)).toBeNull();
      await page.screenshot({ path: `/tmp/pwa-bench-view-${width}.png` });
      await page.keyboard.press('Escape');
      await dialog.waitFor({ state: 'detached' });
      expect(await opener.evaluate((el) => el === document.activeElement)).toBe(true);
      await context.close();
    }
  });
});

describe('on paper', () => {
  it('prints a fix as a bench sheet: cautions first, every part with a tick box, an empty measured column, the QR code', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${base}/fixes/${fix.slug}`);
    await page.emulateMedia({ media: 'print' });
    expect(await shown(page, 'nav, button, form, .site-search')).toBe(0);
    expect(await shown(page, '#cautions .caution')).toBe(Number(fix.cautions));
    const cautionsTop = await page.locator('#cautions').evaluate((el) => el.getBoundingClientRect().top);
    const remedyTop = await page.locator('#remedy-section').evaluate((el) => el.getBoundingClientRect().top);
    expect(cautionsTop).toBeLessThan(remedyTop);
    const partsText = (await page.locator('.parts-table').innerText()).replace(/\s+/g, ' ');
    expect(partsText).toContain('Got');
    for (const part of fix.parts) expect(partsText).toContain(part.value);
    expect(await shown(page, '.parts-table td.parts-check')).toBe(fix.parts.length);
    // Every reading, in the readings table or in the remedy's steps, has an empty "measured here" to write on.
    const tableCells = await page
      .locator('table:has(th:text-is("Measured here")) tbody tr')
      .evaluateAll((rows) => rows.map((row) => (row.querySelector('td.reading-measured') as HTMLElement | null)?.innerText ?? 'missing'));
    const inline = await page
      .locator('.prose-fix .reading dl')
      .evaluateAll((dls) => dls.map((dl) => getComputedStyle(dl, '::after').content));
    expect(tableCells.length + inline.length).toBeGreaterThan(0);
    expect(tableCells.every((cell) => cell === '')).toBe(true);
    expect(inline.every((content) => content === '"Measured here: ______________"')).toBe(true);
    expect(await shown(page, '.revision-qr svg')).toBe(1);
    expect(await page.locator('.revision-qr figcaption').innerText()).toContain(`/fixes/${fix.slug}/r/${fix.number}`);
    // The PDF Chromium prints, read back as text with poppler's pdftotext.
    writeFileSync('/tmp/pwa-print-fix.pdf', await page.pdf({ format: 'A4' }));
    const text = execFileSync('pdftotext', ['/tmp/pwa-print-fix.pdf', '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    // A long value wraps inside its cell on paper: its first words are checked in the PDF, all of it in the DOM above.
    for (const part of fix.parts) expect(text).toContain(part.value.split(' ').slice(0, 2).join(' '));
    expect(text).toContain('Measured here');
    for (const absent of ['Keep for the bench', 'Bench view', 'Skip to content', 'Add to order list', 'Search'])
      expect(text).not.toContain(absent);
    // The caution's label (set in capitals on paper) comes before the remedy.
    const firstCaution = (await page.locator('#cautions .caution').first().innerText()).split('\n')[0]!.trim().toLowerCase();
    const lower = text.toLowerCase();
    expect(lower.indexOf(firstCaution)).toBeGreaterThanOrEqual(0);
    const firstStep = (await page.locator('#remedy-section .prose-fix li').first().innerText()).slice(0, 30).toLowerCase();
    expect(lower.indexOf(firstStep)).toBeGreaterThan(0);
    expect(lower.indexOf(firstCaution)).toBeLessThan(lower.indexOf(firstStep));
    await page.screenshot({ path: '/tmp/pwa-print-fix.png', fullPage: true });
    await context.close();
  });

  it('prints a job sheet as a workshop ticket: reference, machine, serial, symptom and parts, no form, no buttons', async () => {
    const member = await makeMember(knex);
    const job = await createJobSheet(
      member.id,
      jobSheetCreateSchema.parse({
        customerRef: 'Ticket 5512',
        machine: fix.machine,
        serialNumber: 'SN-44-1099',
        reportedSymptom: 'Tray opens by itself',
        partsUsed: [{ ref: 'C12', kind: 'capacitor', value: '470 µF', rating: '16 V', quantity: 2 }],
      }),
    );
    if (!job.ok) throw new Error(job.message);
    const context = await signedInContext(browser, base, member.email, PASSWORD);
    const page = await context.newPage();
    await page.goto(`${base}/jobs/${job.value}`);
    expect(await shown(page, '.job-ticket')).toBe(0);
    await page.emulateMedia({ media: 'print' });
    expect(await shown(page, 'nav, button, form, input, select, textarea')).toBe(0);
    const ticket = (await page.locator('.job-ticket').innerText()).replace(/\s+/g, ' ');
    for (const text of ['Workshop ticket: Ticket 5512', 'SN-44-1099', 'Tray opens by itself', 'C12', '470 µF', '16 V'])
      expect(ticket).toContain(text);
    const machine = await knex('machines as m')
      .join('makers as mk', 'mk.id', 'm.maker_id')
      .where('m.slug', fix.machine)
      .first('mk.name', 'm.model_number');
    expect(ticket).toContain(`${machine.name} ${machine.model_number}`);
    await page.screenshot({ path: '/tmp/pwa-print-job.png', fullPage: true });
    await context.close();
  });
});
