// In Chromium, every control of the remedy toolbar and every insert panel, by mouse and by keyboard (Enter included):
// the page never navigates away, no form sits inside another, and the remedy changes exactly as asked.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Locator, Page } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, signIn, type TestUser } from '../support/sign-in';

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

/** A writing page under watch: any document load after the first, or any page error, fails `stayed`. */
async function openWriting(user: TestUser, path = '/write'): Promise<{ page: Page; remedy: Locator; stayed: () => Promise<void> }> {
  const context = await signedInContext(browser, base, user.email, user.password);
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  let loads = 0;
  page.on('load', () => loads++);
  await page.goto(`${base}${path}`);
  const remedy = page.getByRole('textbox', { name: /Remedy/ });
  await remedy.waitFor();
  // A marker on the window: any navigation (a form submitted as GET included) gives a fresh window without it.
  await page.evaluate(() => ((window as unknown as { stayMarker: string }).stayMarker = 'still here'));
  const stayed = async () => {
    await page.waitForTimeout(150);
    expect(loads, 'the writing page loaded again').toBe(1);
    expect(await page.evaluate(() => (window as unknown as { stayMarker?: string }).stayMarker)).toBe('still here');
    expect(new URL(page.url()).pathname).toBe('/write');
    expect(await page.evaluate(() => document.querySelectorAll('form form').length), 'a form inside a form').toBe(0);
    expect(problems).toEqual([]);
  };
  return { page, remedy, stayed };
}

const focusedLabel = (page: Page) => page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? '');

/**
 * Waits until focus stops moving (Tiptap's own focus command still moves it once more, a frame later), so the
 * keyboard walk through the toolbar starts from where focus rests.
 */
async function focusSettled(page: Page): Promise<void> {
  let last = await focusedLabel(page);
  for (let i = 0; i < 20; i++) {
    await page.waitForTimeout(50);
    const now = await focusedLabel(page);
    if (now === last) return;
    last = now;
  }
}

/** From the remedy, Alt+F10 to the toolbar, then arrow keys to the named button (the toolbar is one tab stop). */
async function toToolbarButton(page: Page, label: string): Promise<void> {
  await focusSettled(page);
  const inToolbar = () => page.evaluate(() => document.activeElement?.closest('[role="toolbar"]') !== null);
  if (!(await inToolbar())) await page.keyboard.press('Alt+F10');
  expect(await inToolbar(), 'Alt+F10 reached the toolbar').toBe(true);
  for (let i = 0; i < 30 && (await focusedLabel(page)) !== label; i++) await page.keyboard.press('ArrowRight');
  expect(await focusedLabel(page)).toBe(label);
}

async function byKeyboard(page: Page, label: string, key: 'Enter' | ' ' = 'Enter'): Promise<void> {
  await toToolbarButton(page, label);
  await page.keyboard.press(key === ' ' ? 'Space' : key);
}

async function byMouse(page: Page, label: string): Promise<void> {
  await page.getByRole('toolbar', { name: 'Remedy formatting' }).getByRole('button', { name: label, exact: true }).click();
}

const pressed = (page: Page, label: string) =>
  page.getByRole('toolbar', { name: 'Remedy formatting' }).getByRole('button', { name: label, exact: true }).getAttribute('aria-pressed');

/** Selects the last `words` words before the caret. */
async function selectWordsBack(page: Page, words: number): Promise<void> {
  for (let i = 0; i < words; i++) await page.keyboard.press('Control+Shift+ArrowLeft');
}

describe('the remedy toolbar', () => {
  it('names every button starting from the text it shows, so a voice-control user can say what they see', async () => {
    const user = await createUser(knex, { tag: 'e2e-toolbar-names' });
    const { page } = await openWriting(user);
    const buttons = await page
      .getByRole('toolbar', { name: 'Remedy formatting' })
      .getByRole('button')
      .evaluateAll((all) => all.map((b) => ({ shown: (b as HTMLElement).innerText, name: b.getAttribute('aria-label') ?? '' })));
    expect(buttons.length).toBeGreaterThan(10);
    // Letters and digits only: "• List" is shown as "List", "</>" shows no word to say.
    const words = (text: string) => text.toLowerCase().replace(/[^a-z0-9]/g, '');
    for (const { shown, name } of buttons) expect(words(name).includes(words(shown)), `${shown} → ${name}`).toBe(true);
    const h2 = buttons.find((b) => b.shown.trim() === 'H2');
    expect(words(h2!.name).startsWith('h2')).toBe(true);
  });

  it('applies and removes every mark and block by mouse and by keyboard without leaving the page', async () => {
    const user = await createUser(knex, { tag: 'e2e-toolbar-marks' });
    const { page, remedy, stayed } = await openWriting(user);
    // Enter in a one-line field of the fix form does not send the revision to the desk.
    await page.getByLabel('Title', { exact: true }).fill('Idler slips on rewind');
    await page.getByLabel('Title', { exact: true }).press('Enter');
    await expect(page.getByText(/not ready to submit/).count()).resolves.toBe(0);
    await stayed();
    await remedy.click();
    await page.keyboard.type('Loosen the idler screw');
    await selectWordsBack(page, 1);

    const marks: [string, string][] = [
      ['Bold', 'strong'],
      ['Italic', 'em'],
      ['Code or value', 'code'],
    ];
    for (const [label, tag] of marks) {
      await byMouse(page, label);
      await expect(remedy.locator(tag).allTextContents(), `${label} by mouse`).resolves.toEqual(['screw']);
      expect(await pressed(page, label)).toBe('true');
      await stayed();
      await byKeyboard(page, label);
      await expect(remedy.locator(tag).count(), `${label} off by keyboard`).resolves.toBe(0);
      expect(await pressed(page, label)).toBe('false');
      await stayed();
    }

    const blocks: [string, string][] = [
      ['H2 heading', 'h2'],
      ['H3 subheading', 'h3'],
      ['Bulleted list', 'ul li'],
      ['1. Steps, numbered', 'ol li'],
    ];
    for (const [label, selector] of blocks) {
      await byKeyboard(page, label, label === 'H2 heading' ? ' ' : 'Enter');
      await expect(remedy.locator(selector).textContent(), `${label} by keyboard`).resolves.toBe('Loosen the idler screw');
      await stayed();
      await byMouse(page, label);
      await expect(remedy.locator(selector).count(), `${label} off by mouse`).resolves.toBe(0);
      await stayed();
    }
    // Back to a plain paragraph (the editor keeps an empty one after a block it has turned into something else).
    await expect(remedy.locator('p').first().textContent()).resolves.toBe('Loosen the idler screw');
    await expect(remedy.locator('h2, h3, ul, ol, strong, em, code').count()).resolves.toBe(0);
  });

  it('builds, changes and deletes a table, and undoes and redoes, by mouse and by keyboard', async () => {
    const user = await createUser(knex, { tag: 'e2e-toolbar-table' });
    const { page, remedy, stayed } = await openWriting(user);
    await remedy.click();
    await page.keyboard.type('Readings before the repair:');
    const rows = () => remedy.locator('tr').count();
    const cols = () => remedy.locator('tr').first().locator('th, td').count();

    await byMouse(page, 'Insert table');
    expect([await rows(), await cols()]).toEqual([3, 3]);
    await stayed();
    const steps: [string, 'mouse' | 'keyboard', number, number][] = [
      ['Add table row below', 'mouse', 4, 3],
      ['Add table row below', 'keyboard', 5, 3],
      ['Delete table row', 'mouse', 4, 3],
      ['Delete table row', 'keyboard', 3, 3],
      ['Add table column to the right', 'mouse', 3, 4],
      ['Add table column to the right', 'keyboard', 3, 5],
      ['Delete table column', 'mouse', 3, 4],
      ['Delete table column', 'keyboard', 3, 3],
    ];
    for (const [label, how, r, c] of steps) {
      await (how === 'mouse' ? byMouse(page, label) : byKeyboard(page, label));
      expect([await rows(), await cols()], `${label} by ${how}`).toEqual([r, c]);
      await stayed();
    }
    await byKeyboard(page, 'Delete table');
    expect(await rows()).toBe(0);
    await byMouse(page, 'Undo');
    expect(await rows()).toBe(3);
    await byMouse(page, 'Delete table');
    expect(await rows()).toBe(0);
    await byKeyboard(page, 'Undo');
    expect(await rows()).toBe(3);
    await byKeyboard(page, 'Redo');
    expect(await rows()).toBe(0);
    await byMouse(page, 'Undo');
    await byMouse(page, 'Redo');
    expect(await rows()).toBe(0);
    await byKeyboard(page, 'Insert table');
    expect(await rows()).toBe(3);
    await stayed();
  });
});

describe('the remedy insert panels', () => {
  it('applies, changes and removes a link with the button and with Enter', async () => {
    const user = await createUser(knex, { tag: 'e2e-panel-link' });
    const { page, remedy, stayed } = await openWriting(user);
    await remedy.click();
    await page.keyboard.type('See the belt chart for sizes');
    await selectWordsBack(page, 4);

    await byMouse(page, 'Link');
    const panel = page.getByRole('group', { name: 'Link' });
    await panel.getByLabel('Address').fill('https://example.test/belt-chart');
    await stayed();
    await panel.getByRole('button', { name: 'Apply link' }).click();
    await expect(remedy.locator('a').getAttribute('href')).resolves.toBe('https://example.test/belt-chart');
    await expect(remedy.locator('a').textContent()).resolves.toBe('belt chart for sizes');
    await expect(panel.count()).resolves.toBe(0);
    await stayed();

    // By keyboard: the panel takes focus in its field; Enter applies.
    await byKeyboard(page, 'Link');
    expect(await page.evaluate(() => document.activeElement?.closest('[role="group"]')?.textContent)).toMatch(/^Link/);
    await page.keyboard.press('Control+A');
    await page.keyboard.type('https://example.test/belts');
    await page.keyboard.press('Enter');
    await expect(remedy.locator('a').getAttribute('href')).resolves.toBe('https://example.test/belts');
    await stayed();

    // A refused address keeps the panel open with its message; Enter again after correcting it applies.
    await byKeyboard(page, 'Link');
    await page.keyboard.press('Control+A');
    await page.keyboard.type('javascript:alert(1)');
    await page.keyboard.press('Enter');
    await expect(panel.getByRole('alert').textContent()).resolves.toMatch(/https:\/\//);
    await stayed();
    await page.keyboard.press('Escape');
    await expect(panel.count()).resolves.toBe(0);
    await expect(remedy.locator('a').getAttribute('href')).resolves.toBe('https://example.test/belts');

    // An empty address removes the link.
    await byKeyboard(page, 'Link');
    await page.keyboard.press('Control+A');
    await page.keyboard.press('Backspace');
    await page.keyboard.press('Enter');
    await expect(remedy.locator('a').count()).resolves.toBe(0);
    await expect(remedy.textContent()).resolves.toBe('See the belt chart for sizes');
    await stayed();
  });

  it('inserts and changes a reading with the button and with Enter, and refuses one without its values', async () => {
    const user = await createUser(knex, { tag: 'e2e-panel-reading' });
    const { page, remedy, stayed } = await openWriting(user);
    await remedy.click();
    await page.keyboard.type('Measure the supply.');

    await byMouse(page, 'Insert reading');
    const insertPanel = page.getByRole('group', { name: 'Insert a reading' });
    await insertPanel.getByLabel('Test point').fill('TP4');
    await insertPanel.getByLabel('Expected').fill('12 V');
    await insertPanel.getByLabel('Typical faulty reading').fill('9 V');
    await insertPanel.getByRole('button', { name: 'Insert reading' }).click();
    const readings = remedy.locator('[data-reading]');
    await expect(readings.count()).resolves.toBe(1);
    await expect(readings.first().getAttribute('data-test-point')).resolves.toBe('TP4');
    await expect(readings.first().getAttribute('data-measured')).resolves.toBe('9 V');
    await stayed();

    // Enter with the required values missing: a message, nothing inserted, the page stays.
    await remedy.click();
    await page.keyboard.press('Control+End');
    await byKeyboard(page, 'Insert reading');
    await page.keyboard.type('TP7');
    await page.keyboard.press('Enter');
    await expect(insertPanel.getByRole('alert').textContent()).resolves.toMatch(/test point and the value/);
    await expect(readings.count()).resolves.toBe(1);
    await stayed();
    await page.keyboard.press('Tab');
    await page.keyboard.type('5.0 V');
    await page.keyboard.press('Enter');
    await expect(readings.count()).resolves.toBe(2);
    await expect(readings.nth(1).getAttribute('data-test-point')).resolves.toBe('TP7');
    await expect(readings.nth(1).getAttribute('data-expected')).resolves.toBe('5.0 V');
    await stayed();

    // A selected reading opens for a change; Enter in its note field changes it.
    await readings.first().click();
    await byMouse(page, 'Insert reading');
    const changePanel = page.getByRole('group', { name: 'Change the reading' });
    await changePanel.getByLabel('Note').fill('with the tape loaded');
    await changePanel.getByLabel('Note').press('Enter');
    await expect(readings.first().getAttribute('data-note')).resolves.toBe('with the tape loaded');
    await expect(readings.count()).resolves.toBe(2);
    await stayed();
  });

  it('inserts and changes a caution box with the button and with Enter, and Escape and Cancel insert nothing', async () => {
    const user = await createUser(knex, { tag: 'e2e-panel-caution' });
    const { page, remedy, stayed } = await openWriting(user);
    await remedy.click();
    await page.keyboard.type('Discharge the main capacitor.');
    const cautions = remedy.locator('[data-caution]');

    await byMouse(page, 'Insert caution box');
    const panel = page.getByRole('group', { name: 'Insert a caution box' });
    await panel.getByLabel('What can hurt').selectOption('stored_charge');
    await panel.getByRole('button', { name: 'Insert caution' }).click();
    await expect(cautions.count()).resolves.toBe(1);
    await expect(cautions.first().getAttribute('data-caution')).resolves.toBe('stored_charge');
    await stayed();

    // The caret is in the new box, ready for its text.
    await page.keyboard.type('The primary capacitor holds its charge after unplugging.');
    await expect(cautions.first().textContent()).resolves.toMatch(/holds its charge/);

    // Keyboard: focus lands on the kind; arrow to another kind; Enter inserts.
    await remedy.getByText('Discharge the main capacitor.').click();
    await page.keyboard.press('End');
    await byKeyboard(page, 'Insert caution box');
    expect(await page.evaluate(() => document.activeElement?.tagName)).toBe('SELECT');
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('Enter');
    await expect(cautions.count()).resolves.toBe(2);
    const kinds = () => cautions.evaluateAll((boxes) => boxes.map((box) => box.getAttribute('data-caution')).sort());
    await expect(kinds()).resolves.toEqual(['stored_charge', 'stored_charge']);
    await stayed();

    // Changing the kind of the caution the caret is in.
    await cautions.first().click();
    await byKeyboard(page, 'Insert caution box');
    await page.getByRole('group', { name: 'Change the caution' }).getByLabel('What can hurt').selectOption('heat');
    await page.keyboard.press('Enter');
    await expect(kinds()).resolves.toEqual(['heat', 'stored_charge']);
    await stayed();

    // Escape and Cancel close the panel and insert nothing.
    await byKeyboard(page, 'Insert caution box');
    await page.keyboard.press('Escape');
    await expect(page.getByRole('group', { name: /caution/ }).count()).resolves.toBe(0);
    await byMouse(page, 'Insert caution box');
    await page.getByRole('button', { name: 'Cancel' }).click();
    await expect(page.getByRole('group', { name: /caution/ }).count()).resolves.toBe(0);
    await expect(cautions.count()).resolves.toBe(2);
    await stayed();
  });

  it('places a photo with the button and with Enter, and says what to do when there is none', async () => {
    const user = await createUser(knex, { tag: 'e2e-panel-picture' });
    // Without photos the panel explains and closes.
    const empty = await openWriting(user);
    await byMouse(empty.page, 'Insert picture');
    await expect(empty.page.getByRole('group', { name: 'Insert a picture' }).textContent()).resolves.toMatch(/Upload a photo/);
    await empty.page.keyboard.press('Enter');
    await expect(empty.page.getByRole('group', { name: 'Insert a picture' }).count()).resolves.toBe(0);
    await empty.stayed();
    await empty.page.context().close();

    // A draft with a photo already in use on a proofed fix (any writer may place those).
    const photo = await knex('revision_photos as rp')
      .join('revisions as r', 'r.id', 'rp.revision_id')
      .join('photos as p', 'p.id', 'rp.photo_id')
      .where('r.state', 'proofed')
      .where('p.processing_state', 'ready')
      .first('p.id', 'p.alt_text');
    expect(photo, 'the demo world has a photo on a proofed fix').toBeTruthy();
    const cookie = await signIn(base, user.email, user.password);
    const created = await fetch(`${base}/api/v1/drafts`, {
      method: 'POST',
      headers: { cookie, 'content-type': 'application/json', origin: base },
      body: JSON.stringify({
        values: {
          title: 'Picture test',
          symptoms: [],
          errorCodes: [],
          cause: '',
          body: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'The belt sits here:' }] }] },
          parts: [],
          readings: [],
          cautions: [],
          difficulty: null,
          timeMinutes: null,
          editSummary: '',
          machineIds: [],
          chassisIds: [],
          photoIds: [photo.id],
        },
      }),
    });
    expect(created.status).toBe(201);
    const draftId = ((await created.json()) as { revision: { id: number } }).revision.id;

    const { page, remedy, stayed } = await openWriting(user, `/write?draft=${draftId}`);
    await remedy.click();
    await page.keyboard.press('Control+End');
    await byMouse(page, 'Insert picture');
    await page.getByRole('group', { name: 'Insert a picture' }).getByRole('button', { name: 'Insert picture' }).click();
    const figures = remedy.locator('figure[data-figure] img');
    await expect(figures.count()).resolves.toBe(1);
    await expect(figures.first().getAttribute('alt')).resolves.toBe(photo.alt_text);
    await stayed();
    // The caret waits below the picture: typing goes there, and the next picture follows instead of replacing it.
    await page.keyboard.type('Then refit the cover.');
    await expect(remedy.locator('figure + p').textContent()).resolves.toBe('Then refit the cover.');

    await byKeyboard(page, 'Insert picture');
    expect(await page.evaluate(() => (document.activeElement as HTMLInputElement | null)?.type)).toBe('radio');
    await page.keyboard.press('Enter');
    await expect(figures.count()).resolves.toBe(2);
    await stayed();

    // What the panels inserted reaches the server: after a reload both pictures are still there.
    const storedFigures = async () =>
      JSON.stringify((await knex('revisions').where({ id: draftId }).first('body')).body).split('"figure"').length - 1;
    await expect.poll(storedFigures, { timeout: 15_000 }).toBe(2);
    await page.reload();
    await figures.nth(1).waitFor();
    await expect(figures.count()).resolves.toBe(2);
  });
});

describe('a writer who types at once after a click', () => {
  it('loses no key to the button they clicked, even when the browser paints late', async () => {
    const user = await createUser(knex, { tag: 'e2e-type-at-once' });
    const context = await signedInContext(browser, base, user.email, user.password);
    // A busy phone or workshop PC paints late: every animation frame waits 400 ms here, so anything that hands focus
    // back to the remedy only on the next frame leaves the first keys typed after a click on the button.
    await context.addInitScript(() => {
      window.requestAnimationFrame = (callback) => window.setTimeout(() => callback(performance.now()), 400);
    });
    const page = await context.newPage();
    await page.goto(`${base}/write`);
    const remedy = page.getByRole('textbox', { name: /Remedy/ });
    await remedy.waitFor();
    await remedy.click();
    await page.keyboard.type('Unplug the recorder. ');

    await byMouse(page, 'Bold');
    await page.keyboard.type('Wait a minute');
    await expect(remedy.locator('strong').first().textContent()).resolves.toBe('Wait a minute');

    await byMouse(page, 'Insert caution box');
    await page.getByRole('group', { name: 'Insert a caution box' }).getByLabel('What can hurt').selectOption('mains');
    await page.getByRole('button', { name: 'Insert caution', exact: true }).click();
    await page.keyboard.type('The inlet filter stays live while the plug is in.');
    await expect(remedy.locator('[data-caution]').first().textContent()).resolves.toContain(
      'The inlet filter stays live while the plug is in.',
    );
    await context.close();
  });
});
