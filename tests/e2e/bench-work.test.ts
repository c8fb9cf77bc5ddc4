// A technician in Chromium: sign in, book in a demo machine, apply a fix, write a hand-over note; the customer reads it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { makeFix, makeMember, makeWorld, PASSWORD } from '../integration/bench-work-support';
import { createHandoverNote } from '@/server/bench-work/handover-notes';
import { createJobSheet } from '@/server/bench-work/job-sheets';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { cautionKinds } from '@/lib/schemas/revision';
import { closeDb } from '@/server/core/db';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${E2E_PORT}`;
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await closeDb();
});

/** A demo machine with a live fix that carries a laser or mains caution, so the customer's page has cautions. */
async function demoTarget(): Promise<{ machineSlug: string; fixSlug: string; revision: number; title: string; email: string }> {
  const knex = testDb();
  try {
    const row = await knex('fix_machines as fm')
      .join('fixes as f', 'f.id', 'fm.fix_id')
      .join('revisions as r', 'r.id', 'f.current_revision_id')
      .join('machines as m', 'm.id', 'fm.machine_id')
      .whereNull('f.hidden_at')
      .whereRaw(`r.cautions @> '[{"kind": "laser"}]'::jsonb OR r.cautions @> '[{"kind": "mains"}]'::jsonb`)
      .orderBy('f.id')
      .first('m.slug as machine_slug', 'f.slug as fix_slug', 'r.number', 'r.title');
    const member = await makeMember(knex, { shopName: 'Fernhollow Tape Works' });
    return { machineSlug: row.machine_slug, fixSlug: row.fix_slug, revision: row.number, title: row.title, email: member.email };
  } finally {
    await knex.destroy();
  }
}

/** Pages in a PDF from Chromium: one "/Type /Page" object per page (ISO 32000-1, 7.7.3.3), "/Pages" being the tree. */
function pdfPages(pdf: Buffer): number {
  return (pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length;
}

describe('a bench report in the browser', () => {
  it('keeps a 20 kB note when a field is refused, marks the field, then saves it and lists it first', async () => {
    const target = await demoTarget();
    for (const width of [1280, 360]) {
      const context = await signedInContext(browser, base, target.email, PASSWORD);
      const page = await context.newPage();
      await page.setViewportSize({ width, height: 900 });
      const statuses: number[] = [];
      page.on('response', (r) => statuses.push(r.status()));
      await page.goto(`${base}/fixes/${target.fixSlug}`);
      // By keyboard: from the machine list, Tab to the outcome and arrow across to "Fault came back".
      await page.focus('#bench-machine');
      await page.keyboard.press('Tab');
      for (let i = 0; i < 3; i++) await page.keyboard.press('ArrowRight');
      expect(await page.isChecked('input[name="outcome"][value="came_back"]')).toBe(true);
      const note = Array.from({ length: 700 }, (_, i) => `Step ${i}: 11.8 V at TP${i % 9} <ok> & "fine"`).join('\n');
      expect(note.length).toBeGreaterThan(20_000);
      await page.fill('#bench-note', note);
      await page.fill('input[name="readings.0.testPoint"]', 'TP3');
      await page.fill('input[name="readings.0.expected"]', '12 V');
      await page.click('#bench-report-form button[type="submit"]');
      await page.waitForLoadState();
      expect(statuses).not.toContain(431);
      expect(page.url().length).toBeLessThan(200);
      expect(await page.inputValue('#bench-note')).toBe(note);
      expect(await page.inputValue('input[name="readings.0.testPoint"]')).toBe('TP3');
      expect(await page.getAttribute('#bench-held', 'aria-invalid')).toBe('true');
      await expect(page.locator('#bench-problem').textContent()).resolves.toMatch(/how many days/);
      // Nothing on the page is wider than the screen, the long note included.
      expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBe(0);
      await page.fill('#bench-held', '30');
      await page.focus('#bench-held');
      await page.keyboard.press('Enter');
      await page.waitForURL(/bench=saved/);
      const first = page.locator('#bench-notes-section li').first();
      await expect(first.textContent()).resolves.toMatch(/Fault came back after 30 days[\s\S]*your report/);
      await expect(first.locator('.bench-note__text').textContent()).resolves.toBe(note);
      expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBe(0);
      await context.close();
    }
  });
});

describe('bench work in the browser', () => {
  it('signs in, opens a job sheet, applies a fix, writes a note; signed out, the note shows the pinned revision and cautions', async () => {
    const target = await demoTarget();
    const context = await browser.newContext();
    const page = await context.newPage();

    await page.goto(`${base}/sign-in?next=/jobs`);
    await page.fill('#pw-email', target.email);
    await page.fill('#pw-password', PASSWORD);
    await page.click('form[action="/sign-in"] button[type="submit"] >> nth=0');
    await page.waitForURL(`${base}/jobs`);

    await page.click('a[href="/jobs/new"]');
    await page.fill('#customerRef', 'Counter ticket 5150');
    await page.selectOption('#machine', target.machineSlug);
    await page.fill('#reportedSymptom', 'Customer says it stopped working');
    await page.click('button:has-text("Open the job sheet")');
    await page.waitForURL(/\/jobs\/\d+\?job=created$/);
    const jobUrl = page.url().split('?')[0]!;

    await page.selectOption('#fix', target.fixSlug);
    await page.click('button:has-text("Apply to this job")');
    await page.waitForURL(/job=fix_applied/);
    await expect(page.locator(`#fix-${target.fixSlug}`).textContent()).resolves.toContain(`pinned to r${target.revision}`);

    await page.click(`#fix-${target.fixSlug} a:has-text("Write a hand-over note")`);
    await page.waitForURL(/\/notes\/new\?/);
    expect(await page.inputValue('#shopName')).toBe('Fernhollow Tape Works');
    await page.fill('#message', 'Your machine is ready to collect.');
    await page.fill('#partsReplaced', 'Drive belt');
    await page.check('input[name="includeJobDetails"]');
    await page.click('button:has-text("Create the note")');
    await page.waitForURL(/\/notes\/[A-Z0-9]{10}\?note=created$/);
    const invoiceLine = await page.inputValue('#invoice-line');
    const noteUrl = invoiceLine.replace(/^Repair notes: /, '');
    expect(noteUrl).toMatch(new RegExp(`^${base}/n/[23456789ABCDEFGHJKMNPQRSTUVWXYZ]{10}$`));
    // The QR code image loads for its owner.
    const qr = await page.locator('figure img').evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0);
    expect(qr).toBe(true);
    await context.close();

    // The customer: no session, no JavaScript.
    const customer = await browser.newContext({ javaScriptEnabled: false });
    const notePage = await customer.newPage();
    const response = await notePage.goto(noteUrl);
    expect(response?.status()).toBe(200);
    await expect(notePage.locator('h1').textContent()).resolves.toContain('What was wrong with your machine');
    const text = (await notePage.locator('main').textContent()) ?? '';
    expect(text).toContain('Fernhollow Tape Works');
    expect(text).toContain(`“${target.title}”, revision r${target.revision}`);
    expect(text).toContain('Customer says it stopped working');
    expect(text).not.toContain('Counter ticket 5150');
    expect(await notePage.locator(`a[href="/fixes/${target.fixSlug}/r/${target.revision}"]`).count()).toBe(1);
    expect(await notePage.locator('#owner-cautions').isVisible()).toBe(true);
    expect(await notePage.locator('.handover-cautions li.caution').count()).toBeGreaterThan(0);
    expect(text).toMatch(/do not open the case|Never look into the disc tray opening/);
    expect(scriptsBesideRegistration(await notePage.content())).toEqual([]);
    expect(await notePage.locator('meta[name="robots"]').getAttribute('content')).toBe('noindex');
    expect(pdfPages(await notePage.pdf({ format: 'A4' }))).toBe(1);

    // The pinned permalink opens the exact revision.
    await notePage.click(`a[href="/fixes/${target.fixSlug}/r/${target.revision}"]`);
    await expect(notePage.locator('#fix-title').textContent()).resolves.toBe(target.title);
    await customer.close();
    expect(jobUrl).toMatch(/\/jobs\/\d+$/);
  });

  it('prints a long note, every caution and the job details included, on one A4 sheet', async () => {
    const knex = testDb();
    let code = '';
    try {
      const world = await makeWorld(knex);
      const shop = await makeMember(knex, { shopName: 'Longfield Audio & Video Repair Workshop' });
      const fix = await makeFix(knex, {
        authorId: (await makeMember(knex)).id,
        machineIds: [world.machines[0]!.id],
        revisions: 2,
        cautions: cautionKinds.map((kind) => ({ kind })),
      });
      const job = await createJobSheet(
        shop.id,
        jobSheetCreateSchema.parse({
          customerRef: 'Ticket 9',
          machine: world.machines[0]!.slug,
          serialNumber: 'SN-0099-2231',
          reportedSymptom: 'Plays for a few seconds, then stops and ejects the cassette. Sometimes the clock goes blank as well.',
          findings:
            'Drive belt stretched and glazed; idler tyre hardened; a dry joint on the capstan motor plug. Cleaned the tape path and heads.',
          outcome: 'Plays, records and rewinds again; tested for two hours.',
        }),
      );
      const created = await createHandoverNote(
        { id: shop.id, shopName: 'Longfield Audio & Video Repair Workshop' },
        handoverNoteInputSchema.parse({
          fix: fix.slug,
          revision: 1,
          jobSheetId: job.ok ? job.value : null,
          includeJobDetails: true,
          message: 'Thank you for bringing your recorder in. '.repeat(8),
          partsReplaced: ['Drive belt', 'Idler tyre', 'Capstan motor plug (resoldered)', 'Pinch roller', 'Mode switch'],
          warranty: 'Six months on parts and labour from the date of collection.',
        }),
      );
      code = created.ok ? created.code : '';
    } finally {
      await knex.destroy();
    }
    const customer = await browser.newContext({ javaScriptEnabled: false });
    const page = await customer.newPage();
    await page.goto(`${base}/n/${code}`);
    expect(await page.locator('.handover-cautions li.caution').count()).toBe(6);
    expect(pdfPages(await page.pdf({ format: 'A4' }))).toBe(1);
    await customer.close();
  });

  it('sorts and filters the job sheet list in place once its script runs', async () => {
    const knex = testDb();
    let email = '';
    try {
      const member = await makeMember(knex);
      email = member.email;
      for (const customerRef of ['Beta bench 2', 'Alpha bench 1', 'Gamma bench 3'])
        await createJobSheet(member.id, jobSheetCreateSchema.parse({ customerRef }));
    } finally {
      await knex.destroy();
    }
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${base}/sign-in?next=/jobs`);
    await page.fill('#pw-email', email);
    await page.fill('#pw-password', PASSWORD);
    await page.click('form[action="/sign-in"] button[type="submit"] >> nth=0');
    await page.waitForURL(`${base}/jobs`);
    const refs = () => page.locator('tbody tr td:first-child').allTextContents();
    await page.waitForSelector('#job-quick-filter');
    await page.click('th button:has-text("Customer reference")');
    expect(await refs()).toEqual(['Alpha bench 1', 'Beta bench 2', 'Gamma bench 3']);
    await page.click('th button:has-text("Customer reference")');
    expect(await refs()).toEqual(['Gamma bench 3', 'Beta bench 2', 'Alpha bench 1']);
    await page.fill('#job-quick-filter', 'beta');
    expect(await refs()).toEqual(['Beta bench 2']);
    await context.close();
  });
});
