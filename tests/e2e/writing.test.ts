// In Chromium: a member writes a fix with a parts list and a photo, a moderator proofs it, and a reader without
// JavaScript sees it, its photo served at the right size and without camera metadata.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, signIn } from '../support/sign-in';
import { phoneJpeg } from '../fixtures/photo-files';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;

async function signedInAs(role: 'member' | 'moderator', tag: string): Promise<BrowserContext> {
  const user = await createUser(knex, { role, tag: `e2e-writing-${tag}` });
  return signedInContext(browser, base, user.email, user.password);
}

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

describe('writing, proofing and reading a fix', () => {
  it('goes from the editor to the proofing desk to a script-free page with the photo', async () => {
    const machine = await knex('machines as m')
      .join('makers as mk', 'mk.id', 'm.maker_id')
      .orderBy('m.id')
      .offset(6)
      .first('m.id', 'm.model_number');
    const title = `Tray will not close after a cold start ${Date.now()}`;

    // The member writes.
    const writer = await signedInAs('member', 'writer');
    const page = await writer.newPage();
    await page.goto(`${base}/write`);
    await page.getByLabel('Title', { exact: true }).fill(title);
    await page.getByRole('combobox', { name: 'Add a machine or chassis family' }).fill(machine.model_number);
    await page.getByRole('option').filter({ hasText: machine.model_number }).first().click();
    await page.getByRole('textbox', { name: 'symptom 1', exact: true }).fill('Tray opens, then stops half way and reopens');
    await page.getByLabel('Cause', { exact: true }).fill('The loading belt has glazed and slips on the pulley when cold.');

    const remedy = page.getByRole('textbox', { name: /Remedy/ });
    await remedy.click();
    await page.getByRole('button', { name: '1. Steps, numbered' }).click();
    await page.keyboard.type('Unplug the recorder and remove the top cover.');
    await page.keyboard.press('Enter');
    await page.keyboard.type('Fit a new loading belt.');
    // The toolbar is one tab stop; arrow keys move along it.
    await page.getByRole('button', { name: 'Bold' }).focus();
    await page.keyboard.press('ArrowRight');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Italic');
    // The steps are in a numbered list, and the toggle says so.
    expect(await page.getByRole('button', { name: '1. Steps, numbered' }).getAttribute('aria-pressed')).toBe('true');

    await page.getByRole('button', { name: 'Add a part' }).click();
    await page.getByLabel('Kind of part 1').selectOption('belt');
    await page.getByLabel('Value of part 1').fill('flat belt 92 mm x 4 mm');
    await page.getByRole('button', { name: 'Add a part' }).click();
    await page.getByLabel('Value of part 2').fill('470uF');
    await page.getByLabel('Rating of part 2').fill('16V 105C');
    await page.getByLabel('Reference of part 2').fill('C512');
    await expect(page.locator('#part-1-check').textContent()).resolves.toMatch(/Reads as 470 µF/);

    await page.locator('input[type=file]').setInputFiles({ name: 'IMG_0101.JPG', mimeType: 'image/jpeg', buffer: await phoneJpeg() });
    await page.getByLabel(/Alt text: what the photo shows/).fill('Loading belt seated in the pulley groove');
    await page.getByRole('button', { name: 'Upload', exact: true }).click();
    const place = page.getByRole('button', { name: /Place “Loading belt seated in the pulley groove” in the remedy/ });
    await place.waitFor({ timeout: 30_000 });
    await expect(place.isEnabled()).resolves.toBe(true);
    await place.click();

    await page.locator('[data-save-state="saved"]').waitFor({ timeout: 15_000 });
    await page.getByRole('button', { name: 'Submit for proofing' }).click();
    await page.waitForURL(/\/write\/mine\?submitted=\d+/, { timeout: 15_000 });
    await writer.close();

    const revision = await knex('revisions').where({ title, state: 'submitted' }).first('id', 'parts');
    expect(revision.parts).toHaveLength(2);

    // A moderator proofs it from the desk.
    const desk = await signedInAs('moderator', 'proofer');
    const deskPage = await desk.newPage();
    await deskPage.goto(`${base}/proofing`);
    await deskPage.getByRole('link', { name: new RegExp(title) }).click();
    await deskPage.getByRole('button', { name: 'Proof: make it live' }).click();
    await deskPage.waitForURL(`${base}/proofing?proofed=1`);
    await desk.close();

    // A reader without JavaScript sees it.
    const fix = await knex('fixes').where({ current_revision_id: revision.id }).first('slug');
    const reader = await browser.newContext({ javaScriptEnabled: false, viewport: { width: 1280, height: 900 } });
    const readerPage = await reader.newPage();
    await readerPage.goto(`${base}/fixes/${fix.slug}`);
    await expect(readerPage.locator('h1').textContent()).resolves.toBe(title);
    expect(scriptsBesideRegistration(await readerPage.content())).toEqual([]);
    await expect(readerPage.locator('.parts-table tbody tr').count()).resolves.toBe(2);
    const photo = readerPage.locator('section[aria-labelledby="photos"] img');
    await photo.scrollIntoViewIfNeeded();
    await readerPage.waitForFunction(() => {
      const img = document.querySelector<HTMLImageElement>('section[aria-labelledby="photos"] img');
      return img !== null && img.complete && img.naturalWidth > 0;
    });
    const shown = await photo.evaluate((img: HTMLImageElement) => ({
      src: img.currentSrc,
      width: img.naturalWidth,
      height: img.naturalHeight,
      alt: img.alt,
    }));
    expect(shown.alt).toBe('Loading belt seated in the pulley groove');
    // 42rem at 1x is 672 px: the browser picks the 960 px WebP from the srcset (naturalWidth is density-corrected to
    // the slot, so 672), upright: portrait, 3:5 like the photo held the right way up.
    expect(shown.src).toMatch(/-960\.webp$/);
    expect([shown.width, shown.height]).toEqual([672, 1120]);
    const bytes = Buffer.from(await (await readerPage.request.get(shown.src)).body());
    const meta = await sharp(bytes).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    expect([meta.format, meta.width, meta.height]).toEqual(['webp', 960, 1600]);
    const figure = await readerPage.locator('#remedy-section figure img').getAttribute('alt');
    expect(figure).toBe('Loading belt seated in the pulley groove');
    await reader.close();
  });

  it('never claims a save that failed, warns before leaving, and offers the browser’s copy back', async () => {
    const writer = await signedInAs('member', 'offline');
    const page = await writer.newPage();
    await page.goto(`${base}/write`);
    await page.getByLabel('Title', { exact: true }).fill('Counter runs, picture freezes');
    await page.locator('[data-save-state="saved"]').waitFor({ timeout: 15_000 });
    await page.waitForURL(/\/write\?draft=\d+/);
    const draftUrl = page.url();

    // The server becomes unreachable for saves.
    await page.route('**/api/v1/drafts/**', (route) => route.abort('internetdisconnected'));
    await page.getByLabel('Cause', { exact: true }).fill('The head drum motor brake sticks when cold.');
    await page.locator('[data-save-state="failed"]').waitFor({ timeout: 15_000 });
    await expect(page.locator('[data-save-state]').textContent()).resolves.toMatch(
      /^Not saved — the server could not be reached \(offline\?\) Retrying…/,
    );
    const warned = await page.evaluate(() => {
      const event = new Event('beforeunload', { cancelable: true });
      window.dispatchEvent(event);
      return event.defaultPrevented;
    });
    expect(warned).toBe(true);
    await page.close({ runBeforeUnload: false });

    // Back online, in a new tab of the same browser: the unsaved cause comes back from local storage and is saved.
    const again = await writer.newPage();
    await again.goto(draftUrl);
    await again.getByText(/Restored changes you made in this browser/).waitFor();
    await expect(again.getByLabel('Cause', { exact: true }).inputValue()).resolves.toBe('The head drum motor brake sticks when cold.');
    await again.locator('[data-save-state="saved"]').waitFor({ timeout: 15_000 });
    const id = Number(new URL(draftUrl).searchParams.get('draft'));
    expect((await knex('revisions').where({ id }).first('cause')).cause).toBe('The head drum motor brake sticks when cold.');
    await writer.close();
  });

  it('shows both versions after a 409 and lets the writer carry their text onto the live revision', async () => {
    const author = await createUser(knex, { tag: 'e2e-writing-live-author' });
    const moderator = await createUser(knex, { role: 'moderator', tag: 'e2e-writing-live-mod' });
    const authorCookie = await signIn(base, author.email, author.password);
    const modCookie = await signIn(base, moderator.email, moderator.password);
    const machineId = (await knex('machines').orderBy('id').offset(7).first('id')).id;
    const api = async (path: string, cookie: string, body: unknown) => {
      const response = await fetch(`${base}${path}`, {
        method: 'POST',
        headers: { cookie, origin: base, 'content-type': 'application/json' },
        body: JSON.stringify(body),
      });
      return response.json();
    };
    const values = {
      title: `Eject clicks but the cassette stays in ${Date.now()}`,
      symptoms: ['Eject clicks, nothing moves'],
      errorCodes: [],
      cause: 'The cassette-up spring has slipped off its post.',
      body: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Refit the spring.' }] }] },
      parts: [],
      readings: [],
      cautions: [],
      difficulty: null,
      timeMinutes: null,
      editSummary: '',
      machineIds: [machineId],
      chassisIds: [],
      photoIds: [],
    };
    const publish = async (draftBody: unknown) => {
      const draft = await api('/api/v1/drafts', authorCookie, draftBody);
      await api(`/api/v1/drafts/${draft.revision.id}/submit`, authorCookie, {});
      return api(`/api/v1/proofing/${draft.revision.id}/proof`, modCookie, {});
    };
    const { slug } = await publish({ values });

    const writer = await signedInAs('member', 'stale');
    const page = await writer.newPage();
    await page.goto(`${base}/fixes/${slug}/edit`);
    await page.getByLabel('Cause', { exact: true }).fill('The cassette-up spring has slipped; check the post for a burr first.');
    await page.locator('[data-save-state="saved"]').waitFor({ timeout: 15_000 });
    // Meanwhile another revision of the fix goes live.
    await publish({ fixSlug: slug, values: { ...values, title: `${values.title} (tray side)` } });

    await page.getByRole('button', { name: 'Submit for proofing' }).click();
    await page.getByRole('heading', { name: 'The fix changed while you were writing' }).waitFor();
    await expect(page.getByLabel('Cause', { exact: true }).inputValue()).resolves.toMatch(/check the post for a burr/);
    await page.getByRole('button', { name: 'Use the live version of title' }).click();
    await expect(page.getByLabel('Title', { exact: true }).inputValue()).resolves.toMatch(/\(tray side\)$/);
    await page.getByRole('button', { name: /Build on r\d+ and keep my text/ }).click();
    await page.getByText(/Your draft now builds on r\d+/).waitFor();
    await page.getByRole('button', { name: 'Submit for proofing' }).click();
    await page.waitForURL(/\/write\/mine\?submitted=\d+/, { timeout: 15_000 });
    await writer.close();
  });

  it('takes a pasted picture as a photo (asking for its alt text) and keeps pasted lists and tables', async () => {
    const writer = await signedInAs('member', 'paste');
    const page = await writer.newPage();
    await page.goto(`${base}/write`);
    const remedy = page.getByRole('textbox', { name: /Remedy/ });
    await remedy.click();
    const html = readFileSync(join(process.cwd(), 'tests/fixtures/clipboard/word-processor.html'), 'utf8');
    // A colour of its own per run: an identical picture uploaded by someone else before is refused as a duplicate.
    const shade = Date.now() % 200;
    const png = (
      await sharp({ create: { width: 640, height: 400, channels: 3, background: { r: shade, g: 140, b: 60 } } })
        .png()
        .toBuffer()
    ).toString('base64');
    await remedy.evaluate(
      (element, data) => {
        const text = new DataTransfer();
        text.setData('text/html', data.html);
        text.setData('text/plain', 'fallback');
        element.dispatchEvent(new ClipboardEvent('paste', { clipboardData: text, bubbles: true, cancelable: true }));
        const bytes = Uint8Array.from(atob(data.png), (c) => c.charCodeAt(0));
        const picture = new DataTransfer();
        picture.items.add(new File([bytes], 'screenshot.png', { type: 'image/png' }));
        element.dispatchEvent(new ClipboardEvent('paste', { clipboardData: picture, bubbles: true, cancelable: true }));
      },
      { html, png },
    );
    await expect(remedy.locator('ol > li').count()).resolves.toBe(3);
    await expect(remedy.locator('table tr').count()).resolves.toBe(2);
    await expect(remedy.locator('a[href^="javascript:"]').count()).resolves.toBe(0);

    await page.getByLabel(/Alt text: what the photo shows/).fill('Green test card on the bench monitor');
    await page.getByRole('button', { name: 'Upload', exact: true }).click();
    await remedy.locator('figure img[alt="Green test card on the bench monitor"]').waitFor({ timeout: 30_000 });
    expect(await remedy.locator('figure img').getAttribute('src')).toMatch(/^\/media\/photos\/.+-480\.jpg$/);
    await writer.close();
  });
});
