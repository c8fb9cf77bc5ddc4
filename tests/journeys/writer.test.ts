// A member writes up a new fix: every control of the remedy editor, a photo, a walk away and back, one field typed
// wrong and put right, then submission for proofing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Locator, Page } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { phoneJpeg } from '../fixtures/photo-files';
import { Journey, base, sees } from './support/journey';
import { call, completeValues, publishFix, session } from '../fixtures/writing';

const knex = testDb();
let browser: Browser;
let writer: TestUser;

beforeAll(async () => {
  browser = await launchBrowser();
  writer = await createUser(knex, { tag: 'journey-writer' });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

const title = `Counter runs but the picture freezes after a minute ${Date.now()}`;

/** Presses a remedy toolbar button by its name. */
function tool(page: Page, name: string): Locator {
  return page.getByRole('toolbar', { name: 'Remedy formatting' }).getByRole('button', { name, exact: true });
}

/** Moves the cursor to the end of the remedy and starts a new paragraph there. */
async function newParagraph(page: Page, remedy: Locator): Promise<void> {
  await remedy.click();
  await page.keyboard.press('Control+End');
  await page.keyboard.press('Enter');
}

async function typeSelected(page: Page, text: string): Promise<void> {
  await page.keyboard.type(text);
  for (let i = 0; i < text.length; i++) await page.keyboard.press('Shift+ArrowLeft');
}

describe('a writer', () => {
  it('uses every editor control, adds a photo, leaves and comes back, puts a refused field right and submits', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: writer });
    const machine = await knex('machines').orderBy('id').offset(4).first('model_number');
    const remedy = page.getByRole('textbox', { name: /Remedy/ });

    await journey.step('opens the writing page from the header and names the fault', async () => {
      await journey.goto(page, '/');
      await journey.navigates(page, /\/write$/, () =>
        page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Write a fix' }).click(),
      );
      await page.getByLabel('Title', { exact: true }).fill(title);
      await page.getByRole('combobox', { name: 'Add a machine or chassis family' }).fill(machine.model_number);
      await page.getByRole('option').filter({ hasText: machine.model_number }).first().click();
      await page.getByRole('textbox', { name: 'symptom 1', exact: true }).fill('Picture freezes after a minute, counter keeps running');
      await page.getByLabel('Cause', { exact: true }).fill('The drum servo capacitor has dried out and the drum loses lock when warm.');
      await sees(page.getByText(machine.model_number).first());
    });

    await journey.step('formats text: bold, italic, code, heading, subheading', async () => {
      await remedy.click();
      await typeSelected(page, 'Before you start');
      await tool(page, 'H2 heading').click();
      await expect(remedy.locator('h2').textContent()).resolves.toBe('Before you start');
      await newParagraph(page, remedy);
      await typeSelected(page, 'Drum section');
      await tool(page, 'H3 subheading').click();
      await expect(remedy.locator('h3').textContent()).resolves.toBe('Drum section');
      await newParagraph(page, remedy);
      await typeSelected(page, 'dry joints');
      await tool(page, 'Bold').click();
      await expect(remedy.locator('strong').textContent()).resolves.toBe('dry joints');
      await page.keyboard.press('End');
      await page.keyboard.type(' and ');
      await typeSelected(page, 'cold');
      await tool(page, 'Italic').click();
      await expect(remedy.locator('em').textContent()).resolves.toBe('cold');
      await page.keyboard.press('End');
      await page.keyboard.type(' near ');
      await typeSelected(page, 'C512');
      await tool(page, 'Code or value').click();
      await expect(remedy.locator('code').textContent()).resolves.toBe('C512');
    });

    await journey.step('links a word through the Link panel, pressing Enter in it', async () => {
      // Out of the code mark first, as a writer toggles it off before going on in plain text.
      await page.keyboard.press('End');
      await tool(page, 'Code or value').click();
      await page.keyboard.type(' (see ');
      await typeSelected(page, 'the safety page');
      await tool(page, 'Link').click();
      const address = page.getByLabel('Address');
      await address.fill('https://example.test/working-safely');
      await address.press('Enter');
      await expect(remedy.locator('a').getAttribute('href')).resolves.toBe('https://example.test/working-safely');
      await expect(remedy.locator('a').textContent()).resolves.toBe('the safety page');
    });

    await journey.step('makes a bulleted list and numbered steps', async () => {
      await newParagraph(page, remedy);
      await tool(page, 'Bulleted list').click();
      await page.keyboard.type('Soldering iron');
      await page.keyboard.press('Enter');
      await page.keyboard.type('Desoldering braid');
      await expect(remedy.locator('ul li').allTextContents()).resolves.toEqual(['Soldering iron', 'Desoldering braid']);
      await page.keyboard.press('Enter');
      await page.keyboard.press('Enter');
      await tool(page, '1. Steps, numbered').click();
      await page.keyboard.type('Unplug the recorder and remove the top cover.');
      await page.keyboard.press('Enter');
      await page.keyboard.type('Replace C512 with a 105 °C part.');
      await expect(remedy.locator('ol li').allTextContents()).resolves.toEqual([
        'Unplug the recorder and remove the top cover.',
        'Replace C512 with a 105 °C part.',
      ]);
      await expect(tool(page, '1. Steps, numbered').getAttribute('aria-pressed')).resolves.toBe('true');
    });

    await journey.step('inserts a caution box from its panel with the mouse', async () => {
      await page.keyboard.press('Enter');
      await page.keyboard.press('Enter');
      await tool(page, 'Insert caution box').click();
      await page.getByLabel('What can hurt').selectOption('mains');
      await page.getByRole('button', { name: 'Insert caution', exact: true }).click();
      await page.keyboard.type('The inlet filter stays live while the plug is in.');
      await sees(remedy.getByText('The inlet filter stays live while the plug is in.'));
    });

    await journey.step('inserts a reading from its panel, pressing Enter', async () => {
      await newParagraph(page, remedy);
      await page.keyboard.type('Then measure: ');
      await tool(page, 'Insert reading').click();
      await page.getByLabel('Test point').fill('TP12');
      await page.getByLabel('Expected').fill('12.0 V');
      await page.getByLabel('Typical faulty reading').fill('9.5 V');
      await page.getByLabel('Typical faulty reading').press('Enter');
      await sees(remedy.getByText(/TP12/).first());
      await expect(remedy.innerText()).resolves.toContain('12.0 V');
    });

    await journey.step('inserts a table, adds and removes a row and a column, then deletes it', async () => {
      await newParagraph(page, remedy);
      await tool(page, 'Insert table').click();
      await expect(remedy.locator('table').count()).resolves.toBe(1);
      const rows = await remedy.locator('tr').count();
      await tool(page, 'Add table row below').click();
      await expect(remedy.locator('tr').count()).resolves.toBe(rows + 1);
      await tool(page, 'Delete table row').click();
      await expect(remedy.locator('tr').count()).resolves.toBe(rows);
      const columns = await remedy.locator('tr').first().locator('th, td').count();
      await tool(page, 'Add table column to the right').click();
      await expect(remedy.locator('tr').first().locator('th, td').count()).resolves.toBe(columns + 1);
      await tool(page, 'Delete table column').click();
      await expect(remedy.locator('tr').first().locator('th, td').count()).resolves.toBe(columns);
      await tool(page, 'Delete table').click();
      await expect(remedy.locator('table').count()).resolves.toBe(0);
    });

    await journey.step('undoes the deletion and redoes it', async () => {
      await tool(page, 'Undo').click();
      await expect(remedy.locator('table').count()).resolves.toBe(1);
      await tool(page, 'Redo').click();
      await expect(remedy.locator('table').count()).resolves.toBe(0);
    });

    await journey.step('uploads a photo and places it in the remedy through the picture panel', async () => {
      await page.locator('input[type=file]').setInputFiles({ name: 'IMG_0211.JPG', mimeType: 'image/jpeg', buffer: await phoneJpeg() });
      await page.getByLabel(/Alt text: what the photo shows/).fill('Drum servo capacitor with a bulging top');
      await page.getByRole('button', { name: 'Upload', exact: true }).click();
      await page
        .getByRole('button', { name: /Place “Drum servo capacitor with a bulging top” in the remedy/ })
        .waitFor({ timeout: 30_000 });
      await newParagraph(page, remedy);
      await tool(page, 'Insert picture').click();
      await page.getByRole('radio', { name: 'Drum servo capacitor with a bulging top' }).check();
      await page.getByRole('group', { name: 'Insert a picture' }).getByRole('button', { name: 'Insert picture' }).click();
      await sees(remedy.getByRole('img', { name: 'Drum servo capacitor with a bulging top' }));
    });

    await journey.step('types a negative bench time and a part of quantity 0, and the draft still saves', async () => {
      await page.getByLabel('Bench time in minutes').fill('-20');
      await page.getByRole('button', { name: 'Add a part' }).click();
      await page.getByLabel('Kind of part 1').selectOption('capacitor');
      await page.getByLabel('Value of part 1').fill('47uF');
      await page.getByLabel('Rating of part 1').fill('25V 105C');
      await page.getByLabel('Quantity of part 1').fill('0');
      await page.getByLabel('Cause', { exact: true }).fill('The drum servo capacitor C512 has dried out; the drum loses lock when warm.');
      await page.locator('[data-save-state="saved"]').waitFor({ timeout: 20_000 });
      await expect(page.locator('[data-save-state]').textContent()).resolves.toMatch(/^Saved/);
    });

    await journey.step('leaves for the home page and comes back to the draft from "my writing"', async () => {
      await page.waitForURL(/\/write\?draft=\d+/);
      await journey.goto(page, '/');
      await journey.goto(page, '/write/mine');
      const entry = page.getByRole('listitem').filter({ hasText: title });
      await sees(entry);
      await journey.navigates(page, /\/write\?draft=\d+/, () => entry.getByRole('link', { name: 'Resume writing' }).click());
      await expect(page.getByLabel('Title', { exact: true }).inputValue()).resolves.toBe(title);
      await expect(page.getByLabel('Cause', { exact: true }).inputValue()).resolves.toContain('C512 has dried out');
      await expect(remedy.locator('h2').textContent()).resolves.toBe('Before you start');
      await expect(remedy.locator('ol li').count()).resolves.toBe(2);
      await sees(remedy.getByRole('img', { name: 'Drum servo capacitor with a bulging top' }));
      // The refused values come back as typed, marked, with a sentence saying what to type instead.
      await expect(page.getByLabel('Bench time in minutes').inputValue()).resolves.toBe('-20');
      await expect(page.getByLabel('Bench time in minutes').getAttribute('aria-invalid')).resolves.toBe('true');
      await expect(page.getByLabel('Quantity of part 1').inputValue()).resolves.toBe('0');
    });

    await journey.step('is refused submission while a field is wrong, puts it right and submits', async () => {
      await page.getByRole('button', { name: 'Submit for proofing' }).click();
      await sees(page.getByRole('alert').first());
      expect(page.url()).toMatch(/\/write\?draft=\d+/);
      await page.getByLabel('Bench time in minutes').fill('40');
      await page.getByLabel('Quantity of part 1').fill('1');
      await page.getByLabel('What you changed, for the proofer').fill('First write-up of this fault.');
      await page.locator('[data-save-state="saved"]').waitFor({ timeout: 20_000 });
      await journey.navigates(page, /\/write\/mine\?submitted=\d+/, () =>
        page.getByRole('button', { name: 'Submit for proofing' }).click(),
      );
      const entry = page.getByRole('listitem').filter({ hasText: title });
      await expect(entry.innerText()).resolves.toMatch(/submitted|waiting/i);
    });

    await journey.close();
  });
});

describe('a writer whose fix changed meanwhile', () => {
  it('adds a caution while someone else’s new part goes live, is shown both changes combined, takes them by keyboard and submits', async () => {
    const journey = new Journey(browser);
    const machineId = (await knex('machines').orderBy('id').offset(5).first('id')).id;
    const [first, other, moderator] = await Promise.all([
      session(knex, base, 'member', 'journey-merge-first'),
      session(knex, base, 'member', 'journey-merge-other'),
      session(knex, base, 'moderator', 'journey-merge-mod'),
    ]);
    const published = completeValues(machineId);
    const { slug } = await publishFix(base, first, moderator, published);
    const page = await journey.page({ as: writer });
    const caution = 'The regulator heatsink stays hot for minutes after switching off.';

    await journey.step('opens the live fix for editing and adds a caution about heat', async () => {
      await journey.goto(page, `/fixes/${slug}/edit`);
      await page.getByRole('button', { name: 'Add a caution' }).click();
      await page.locator('#caution-1-kind').selectOption('heat');
      await page.locator('#caution-1-detail').fill(caution);
      await page.getByLabel('What you changed, for the proofer').fill('Warn about the heatsink');
      await page.locator('[data-save-state="saved"]').waitFor({ timeout: 20_000 });
    });

    await journey.step('meanwhile another writer’s new part goes live', async () => {
      const draft = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: published }, cookie: other.cookie });
      const values = {
        ...draft.body.revision.values,
        parts: [
          ...draft.body.revision.values.parts,
          { ref: 'R301', kind: 'resistor', value: '2k2', rating: '0.25W', quantity: 1, notes: 'Bias resistor' },
        ],
        editSummary: 'Add the bias resistor',
      };
      expect((await call(base, `/api/v1/drafts/${draft.body.revision.id}/submit`, { body: { values }, cookie: other.cookie })).status).toBe(
        200,
      );
      expect((await call(base, `/api/v1/proofing/${draft.body.revision.id}/proof`, { body: {}, cookie: moderator.cookie })).status).toBe(
        200,
      );
    });

    await journey.step('submits and is shown how the new part and the caution fit together, before anything is saved', async () => {
      await page.getByRole('button', { name: 'Submit for proofing' }).click();
      const merge = page.locator('[data-merge]');
      await sees(merge.getByRole('heading', { name: 'Both changes fit together' }));
      await sees(merge.getByText('R301'));
      await sees(merge.getByText(caution));
      if (process.env.INFRA_SHOTS) {
        await merge.scrollIntoViewIfNeeded();
        await page.screenshot({ path: '/tmp/infra-merge-1280.png', fullPage: false });
        await page.setViewportSize({ width: 360, height: 800 });
        await merge.scrollIntoViewIfNeeded();
        await page.screenshot({ path: '/tmp/infra-merge-360.png', fullPage: false });
        await page.setViewportSize({ width: 1280, height: 900 });
      }
    });

    await journey.step('combines them with the keyboard, sees the new part in the form, and submits', async () => {
      await page.getByRole('button', { name: /Combine both and build on r\d+/ }).focus();
      await page.keyboard.press('Enter');
      await sees(page.getByText(/Combined: your changes on r\d+ with its own/));
      await expect(page.getByLabel('Reference of part 2', { exact: true }).inputValue()).resolves.toBe('R301');
      await page.locator('[data-save-state="saved"]').waitFor({ timeout: 20_000 });
      await journey.navigates(page, /\/write\/mine\?submitted=\d+/, () =>
        page.getByRole('button', { name: 'Submit for proofing' }).click(),
      );
    });
    const submitted = await knex('revisions as r')
      .join('fixes as f', 'f.id', 'r.fix_id')
      .where({ 'f.slug': slug, 'r.author_id': writer.id, 'r.state': 'submitted' })
      .first('r.parts', 'r.cautions');
    expect(JSON.stringify(submitted.parts)).toContain('R301');
    expect(JSON.stringify(submitted.cautions)).toContain(caution);
    await journey.close();
  }, 120_000);
});
