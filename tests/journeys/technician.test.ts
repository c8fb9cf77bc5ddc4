// A bench technician on a phone: finds the fix for a deck that will not rewind, orders its parts, reports back from
// the bench (one refused field, a long note), books the job in, hands the customer a note they open and print, and
// corrects the shop name on their account page with JavaScript on and off.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { Journey, PHONE_WIDTH, base, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let technician: TestUser;

beforeAll(async () => {
  browser = await launchBrowser();
  technician = await createUser(knex, { tag: 'journey-technician' });
  await knex('users').where({ id: technician.id }).update({ shop_name: 'Wrenfield Bench Repairs' });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

// About 1,600 characters: what a technician writes for the next person at the bench.
const longNote = [
  'Deck came in with no rewind and a weak fast forward; play was fine.',
  'The idler tyre was glazed and had a flat spot from standing under load for years.',
  'Cleaned the idler hub and both reel tables with isopropyl alcohol before fitting a new tyre, then checked that the idler swings freely between the reels.',
  'Back-tension on the supply reel was low as well; the felt on the brake band had hardened, so I roughened it lightly and it held.',
  'Rewind of a full E-180 tape now takes just under three minutes, fast forward the same.',
  'On an earlier deck of this family the rewind slowed again three weeks later: the idler spring had lost its tension.',
  'It is worth replacing the idler spring along with the tyre from the start.',
  'Check the reel table heights too: one of them sat half a millimetre low and rubbed on its bearing.',
  'After the spring and a shim washer under the take-up table, it rewound a full tape twelve times in a row without slowing.',
  'I would expect the same on any deck of this family that has stood unused in a loft.',
].join(' ');

describe('a bench technician', () => {
  it('finds a fix, orders its parts, reports back, books the job in and hands the customer a printed note', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: technician, width: PHONE_WIDTH });
    let fixUrl = '';
    let noteUrl = '';

    await journey.step('searches the symptom loosely from the header', async () => {
      await journey.goto(page, '/');
      const search = page.getByRole('banner').getByRole('searchbox', { name: 'Search fixes' });
      await search.fill('rewnd not working');
      await journey.navigates(page, /\/search\?/, () => search.press('Enter'));
      const first = page.locator('[data-results] > li').first();
      const title = (await first.getByRole('link').first().innerText()).trim();
      expect(title).toContain('No rewind or fast forward');
      // The snippet under the title keeps the symptom as written: "no rewind", never "rewind" alone.
      const snippet = (await first.innerText()).replace(title, '');
      expect(snippet.toLowerCase()).toContain('no rewind');
    });

    await journey.step('opens the fix and reads the cause and the parts', async () => {
      await journey.navigates(page, /\/fixes\/qm7-no-rewind-glazed-idler$/, () =>
        page
          .getByRole('link', { name: /No rewind or fast forward/ })
          .first()
          .click(),
      );
      fixUrl = page.url();
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('No rewind or fast forward');
      await sees(page.getByRole('heading', { name: 'Cause' }));
      const parts = page.getByRole('table', { name: 'Parts for this fix' });
      await sees(parts);
      expect(await parts.getByRole('row').count()).toBeGreaterThan(1);
    });

    await journey.step('adds every part to the order list', async () => {
      await journey.navigates(page, /\/order-list/, () => page.getByRole('button', { name: 'Add all parts to the order list' }).click());
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/order list/i);
      await sees(page.getByText(/idler|tyre|tire/i));
    });

    await journey.step('files a bench report with a reading the form refuses, and keeps the long note', async () => {
      await journey.goto(page, fixUrl);
      await page.getByRole('radio', { name: 'Fixed', exact: true }).check();
      await page.getByLabel('Note for other technicians').fill(longNote);
      // A reading without the value a good unit shows.
      await page.getByLabel('Reading 1: test point').fill('Rewind torque at the take-up reel');
      await page.getByLabel('Reading 1: what you measured').fill('15 g·cm');
      await journey.navigates(page, /\/fixes\/qm7-no-rewind-glazed-idler/, () =>
        page.getByRole('button', { name: 'Save the bench report' }).click(),
      );
      // The refusal is a sentence with an example; what was typed stays, and none of it travels through the address.
      await sees(page.getByRole('alert'));
      await sees(page.getByText(/expected value, e\.g\./i));
      await expect(page.getByLabel('Note for other technicians').inputValue()).resolves.toBe(longNote);
      await expect(page.getByLabel('Reading 1: test point').inputValue()).resolves.toBe('Rewind torque at the take-up reel');
      await expect(page.getByLabel('Reading 1: what you measured').inputValue()).resolves.toBe('15 g·cm');
      expect(page.url().length).toBeLessThan(300);
      expect(decodeURIComponent(page.url())).not.toContain('idler tyre was glazed');
    });

    await journey.step('gives the expected value and sees the report saved with its note and reading', async () => {
      await page.getByLabel('Reading 1: what a good unit shows').fill('40 to 60 g·cm');
      await journey.navigates(page, /\/fixes\/qm7-no-rewind-glazed-idler/, () =>
        page.getByRole('button', { name: 'Save the bench report' }).click(),
      );
      await sees(page.getByText('Your bench report is saved.'));
      // Other technicians' notes and readings are what a bench needs: both show on the fix page.
      await sees(page.getByText('worth replacing the idler spring along with the tyre'));
      await sees(page.getByText('Rewind torque at the take-up reel'));
    });

    await journey.step('books the unit in on a new job sheet from the header', async () => {
      await journey.navigates(page, /\/jobs$/, () =>
        page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Job sheets' }).click(),
      );
      await journey.navigates(page, /\/jobs\/new/, () => page.getByRole('link', { name: 'Book in a machine' }).click());
      await page.getByLabel(/Customer reference/).fill('Counter ticket 7781');
      await page
        .getByLabel(/Machine/)
        .first()
        .selectOption({ label: 'Quillmere VR-3100 (PAL)' });
      await page
        .getByLabel(/Reported symptom|What the customer/)
        .first()
        .fill('Will not rewind; plays fine.');
      await journey.navigates(page, /\/jobs\/\d+\?job=created$/, () => page.getByRole('button', { name: 'Open the job sheet' }).click());
      await sees(page.getByText('Counter ticket 7781'));
    });

    await journey.step('applies the fix to the job and sees it pinned to the live revision', async () => {
      await page.locator('#fix').selectOption('qm7-no-rewind-glazed-idler');
      await journey.navigates(page, /job=fix_applied/, () => page.getByRole('button', { name: 'Apply to this job' }).click());
      await expect(page.locator('#fix-qm7-no-rewind-glazed-idler').textContent()).resolves.toMatch(/pinned to r\d+/);
    });

    await journey.step('writes the hand-over note for the customer', async () => {
      await journey.navigates(page, /\/notes\/new\?/, () =>
        page.locator('#fix-qm7-no-rewind-glazed-idler').getByRole('link', { name: 'Write a hand-over note' }).click(),
      );
      await expect(page.getByLabel(/Shop name/).inputValue()).resolves.toBe('Wrenfield Bench Repairs');
      await page
        .getByLabel(/Message/)
        .first()
        .fill('Your recorder rewinds again. Keep it out of the loft.');
      await page
        .getByLabel(/Parts replaced/)
        .first()
        .fill('Idler tyre\nIdler spring');
      await page.getByLabel(/job details/i).check();
      await journey.navigates(page, /\/notes\/[A-Z0-9]{10}\?note=created$/, () =>
        page.getByRole('button', { name: 'Create the note' }).click(),
      );
      const line = await page.getByLabel('Line for the invoice').inputValue();
      noteUrl = line.replace(/^Repair notes: /, '');
      expect(noteUrl).toMatch(/\/n\/[A-Z0-9]{10}$/);
    });

    await journey.step('changes the shop name on the account page: an emptied name is refused beside its field, nothing lost', async () => {
      const shop = 'Wrenfield Bench Repairs and Tape Decks';
      await journey.goto(page, '/account');
      await page.getByLabel('Your name').fill('');
      await page.getByLabel('Shop name (optional)').fill(shop);
      // With JavaScript on, the server's zod check runs before sending: the message sits under the field, nothing is sent.
      await page.getByRole('button', { name: 'Save', exact: true }).click();
      await sees(page.locator('#name-error'));
      await expect(page.getByLabel('Shop name (optional)').inputValue()).resolves.toBe(shop);
      expect(page.url()).toBe(`${base}/account`);
      await page.getByLabel('Your name').fill('Tamsin Wrenfield');
      await journey.navigates(page, /\/account\?notice=profile-saved$/, () =>
        page.getByRole('button', { name: 'Save', exact: true }).click(),
      );
      await sees(page.getByText('Your name and shop name are saved.'));
    });

    const noScript = await journey.page({ as: technician, width: PHONE_WIDTH, javaScriptEnabled: false });
    await journey.step('does the same with JavaScript off: the server refuses it on the same page, as typed', async () => {
      const shop = 'Wrenfield Bench Repairs, counter by the station';
      await journey.goto(noScript, '/account');
      await noScript.getByLabel('Your name').fill('');
      await noScript.getByLabel('Shop name (optional)').fill(shop);
      await journey.navigates(noScript, /\/account\?_action=account$/, () =>
        noScript.getByRole('button', { name: 'Save', exact: true }).click(),
      );
      await sees(noScript.locator('#name-error'));
      await expect(noScript.getByLabel('Your name').getAttribute('aria-invalid')).resolves.toBe('true');
      await expect(noScript.getByLabel('Shop name (optional)').inputValue()).resolves.toBe(shop);
      expect(decodeURIComponent(noScript.url())).not.toContain('counter by the station');
      await noScript.getByLabel('Your name').fill('Tamsin Wrenfield');
      await noScript.getByLabel('Shop name (optional)').fill('Wrenfield Bench Repairs');
      await journey.navigates(noScript, /\/account\?notice=profile-saved$/, () =>
        noScript.getByRole('button', { name: 'Save', exact: true }).click(),
      );
      await sees(noScript.getByText('Your name and shop name are saved.'));
      await noScript.screenshot({ path: '/tmp/journeys-technician-account-no-script.png', fullPage: true });
    });

    const customerPage = await journey.page({ width: PHONE_WIDTH });
    await journey.step('the customer opens the note signed out and reads what was done', async () => {
      await journey.goto(customerPage, noteUrl);
      await expect(customerPage.getByRole('heading', { level: 1 }).textContent()).resolves.toContain('What was wrong with your machine');
      await sees(customerPage.getByText('Wrenfield Bench Repairs'));
      await sees(customerPage.getByText('Your recorder rewinds again.'));
      await sees(customerPage.getByText('Idler spring'));
      expect(await customerPage.getByText('Counter ticket 7781').count()).toBe(0);
    });

    await journey.step('the customer prints it: the note on paper, the site furniture left off', async () => {
      await customerPage.emulateMedia({ media: 'print' });
      await sees(customerPage.getByRole('heading', { level: 1 }));
      await sees(customerPage.getByText('Your recorder rewinds again.'));
      await expect(customerPage.getByRole('navigation', { name: 'Main' }).isVisible()).resolves.toBe(false);
      await expect(customerPage.getByRole('search').first().isVisible()).resolves.toBe(false);
      await customerPage.screenshot({ path: '/tmp/journeys-technician-print.png', fullPage: true });
      await customerPage.emulateMedia({ media: 'screen' });
    });

    await journey.close();
  });
});
