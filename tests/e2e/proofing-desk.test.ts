// In Chromium: a moderator filters the desk and returns a revision by keyboard with one note; the author amends it with
// the note in view above the form; the resubmission shows what changed since the returned one.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, signIn } from '../support/sign-in';
import { call, completeValues, someMachineId } from '../fixtures/writing';

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

/** Fails the test on anything the page logs as an error or throws. */
function watchErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(message.text());
  });
  return errors;
}

describe('the proofing desk in a browser', () => {
  it('returns by keyboard with one note, keeps the note in view while amending, and compares the answer with it', async () => {
    const author = await createUser(knex, { tag: 'e2e-desk-author' });
    const moderator = await createUser(knex, { role: 'moderator', tag: 'e2e-desk-mod' });
    const authorCookie = await signIn(base, author.email, author.password);
    const machineId = await someMachineId(knex, 9);
    const values = completeValues(machineId, { editSummary: 'First write-up, from three decks on my bench.' });
    const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: authorCookie });
    const id: number = created.body.revision.id;
    expect((await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: authorCookie })).status).toBe(200);

    const desk = await signedInContext(browser, base, moderator.email, moderator.password);
    const deskPage = await desk.newPage();
    const deskErrors = watchErrors(deskPage);
    // The filter is a plain form: choosing the author and pressing Enter on "Show" narrows the queue.
    await deskPage.goto(`${base}/proofing`);
    await deskPage.selectOption('select[name="author"]', String(author.id));
    await deskPage.focus('form[action="/proofing"] button[type="submit"]');
    await Promise.all([
      deskPage.waitForURL((url) => url.searchParams.get('author') === String(author.id)),
      deskPage.keyboard.press('Enter'),
    ]);
    expect(await deskPage.locator('[data-desk-revision]').count()).toBe(1);
    await expect(deskPage.locator('[data-desk-summary]').textContent()).resolves.toContain('First write-up, from three decks on my bench.');

    await deskPage.getByRole('link', { name: new RegExp(values.title) }).click();
    await expect(deskPage.locator('[data-edit-summary]').textContent()).resolves.toContain('First write-up, from three decks on my bench.');
    expect(await deskPage.locator('textarea[name="note"]').count()).toBe(1);
    // Return without a note: refused on the page, with an example.
    await deskPage.getByRole('button', { name: 'Return it with this note' }).click();
    await expect(deskPage.locator('[role="alert"]').textContent()).resolves.toContain('for example');
    // That refusal is a 400, which Chromium logs; it was asked for, so it is not counted.
    expect(deskErrors.splice(0)).toEqual([expect.stringContaining('status of 400')]);
    // Now by keyboard: the note, then Tab to the Return button, then Enter.
    const note = 'Give the polarity of C512 and the reading at TP12 after the swap.';
    await deskPage.focus('#decision-note');
    await deskPage.keyboard.type(note);
    await deskPage.keyboard.press('Tab');
    await deskPage.keyboard.press('Tab');
    await expect(deskPage.evaluate(() => document.activeElement?.textContent?.trim())).resolves.toBe('Return it with this note');
    await Promise.all([deskPage.waitForURL(`${base}/proofing?returned=1`), deskPage.keyboard.press('Enter')]);
    await expect(deskPage.locator('[role="status"]').textContent()).resolves.toContain('Returned to its author');

    // The author amends it: the note is above the form, in the editor they work in.
    const writer = await signedInContext(browser, base, author.email, author.password);
    const writerPage = await writer.newPage();
    const writerErrors = watchErrors(writerPage);
    const amended = await call(base, `/api/v1/revisions/${id}/amend`, { body: {}, cookie: authorCookie });
    await writerPage.goto(`${base}${amended.body.editorPath}`);
    const notice = writerPage.locator('form p', { hasText: 'with this note' });
    await expect(notice.textContent()).resolves.toContain(note);
    const noticeBox = await notice.boundingBox();
    const titleBox = await writerPage.locator('#field-title').boundingBox();
    expect(noticeBox!.y).toBeLessThan(titleBox!.y);
    await writer.close();

    const draftId: number = amended.body.revision.id;
    const answer = {
      ...amended.body.revision.values,
      cause: `${amended.body.revision.values.cause} Fit it with the stripe towards R510; TP12 then reads 12.1 V.`,
      editSummary: 'Gave the polarity and the TP12 reading.',
    };
    expect((await call(base, `/api/v1/drafts/${draftId}/submit`, { body: { values: answer }, cookie: authorCookie })).status).toBe(200);
    await deskPage.goto(`${base}/proofing/${draftId}`);
    await expect(deskPage.locator('[data-answers]').textContent()).resolves.toContain(note);
    await deskPage.getByRole('link', { name: /See what changed since r\d+/ }).click();
    await expect(deskPage.locator('#changes-since').textContent()).resolves.toMatch(/Changes since the returned r\d+/);
    await expect(deskPage.locator('#changes-since + div [data-changed-sections]').getAttribute('data-changed-sections')).resolves.toBe(
      'Cause',
    );
    // On a phone the desk and the revision page do not scroll sideways; their tables scroll in their own boxes.
    await deskPage.setViewportSize({ width: 360, height: 800 });
    for (const path of ['/proofing', `/proofing/${draftId}`]) {
      await deskPage.goto(`${base}${path}`);
      const overflow = await deskPage.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow, path).toBe(0);
    }
    await desk.close();
    expect(deskErrors).toEqual([]);
    expect(writerErrors).toEqual([]);
  });
});
