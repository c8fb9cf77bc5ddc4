// A repair shop owner connects their own invoicing program: reads the API guides, creates a token and copies it, the
// program books a job in, loses a race with the browser (412) and pulls the invoice lines; the owner then revokes it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { Journey, base, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let owner: TestUser;

beforeAll(async () => {
  browser = await launchBrowser();
  owner = await createUser(knex, { tag: 'journey-shop-owner' });
  await knex('users').where({ id: owner.id }).update({ shop_name: 'Corrigan Tape Works' });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

/** What the shop's program sends: plain HTTP with the token, as curl would. */
function program(token: string, path: string, init: { method?: string; body?: unknown; ifMatch?: string } = {}): Promise<Response> {
  const headers: Record<string, string> = { authorization: `Bearer ${token}`, 'content-type': 'application/json' };
  if (init.ifMatch) headers['if-match'] = init.ifMatch;
  return fetch(`${base}${path}`, { method: init.method ?? 'GET', headers, ...(init.body ? { body: JSON.stringify(init.body) } : {}) });
}

describe('a shop owner', () => {
  it('connects the shop program with a token, sees it work and stop once revoked', async () => {
    const journey = new Journey(browser);
    const context = await journey.context({ as: owner });
    await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: base });
    const page = await context.newPage();
    let token = '';
    let sheetId = 0;

    await journey.step('reads how authentication, rate limits, errors and paging work', async () => {
      await journey.goto(page, '/api');
      for (const guide of ['Authentication', 'Rate limits', 'Errors and versions', 'Paging'])
        await sees(page.getByRole('heading', { name: guide }));
      await sees(page.getByText('/api/v1/job-sheets/{id}').first());
    });

    await journey.step('goes from the account page to the tokens and forgets to tick a scope', async () => {
      await journey.goto(page, '/account');
      await journey.navigates(page, /\/account\/api-tokens$/, () => page.getByRole('link', { name: 'Manage API tokens' }).click());
      await page.getByLabel('Name').fill('Front desk invoicing');
      await page.getByRole('checkbox', { name: /Job sheets and hand-over notes/ }).uncheck();
      await journey.navigates(page, /\/account\/api-tokens$/, () => page.getByLabel('Name').press('Enter'));
      await sees(page.getByText('Tick at least one scope'));
      expect(await page.getByLabel('Name').inputValue()).toBe('Front desk invoicing');
    });

    await journey.step('creates the token by keyboard and copies it', async () => {
      await page.getByRole('checkbox', { name: /Job sheets and hand-over notes/ }).check();
      await page.getByRole('button', { name: 'Create token' }).focus();
      await journey.navigates(page, /notice=created/, () => page.keyboard.press('Enter'));
      await sees(page.getByText('it is shown only this once'));
      await page.getByRole('button', { name: 'Copy' }).click();
      await sees(page.getByText('Copied. Paste it into your program now.'));
      token = (await page.evaluate('navigator.clipboard.readText()')) as string;
      expect(token).toMatch(/^blt_/);
    });

    await journey.step('coming back later, the token is no longer shown', async () => {
      await journey.reload(page);
      expect(await page.locator('[data-token]').count()).toBe(0);
      await sees(page.getByText('last used never'));
    });

    await journey.step('the program books a job in and reads its invoice lines', async () => {
      const created = await program(token, '/api/v1/job-sheets', {
        method: 'POST',
        body: { customerRef: 'CTW-0451', reportedSymptom: 'Counter stops, tape keeps running', labourMinutes: 75 },
      });
      expect(created.status).toBe(201);
      sheetId = (await created.json()).jobSheet.id;
      const lines = await (await program(token, `/api/v1/job-sheets/${sheetId}/invoice-lines.csv`)).text();
      expect(lines).toContain('labour,Labour,1.25,h,');
    });

    await journey.step(
      'edits the job in the browser while the program holds an old copy; the program is told, nothing is lost',
      async () => {
        await journey.goto(page, `/jobs/${sheetId}`);
        await page.getByLabel('Findings').fill('Counter belt slipped off its pulley');
        await journey.navigates(page, new RegExp(`/jobs/${sheetId}`), () =>
          page.getByRole('button', { name: 'Save the job sheet' }).click(),
        );
        const stale = await program(token, `/api/v1/job-sheets/${sheetId}`, {
          method: 'PATCH',
          ifMatch: '"v1"',
          body: { findings: 'From the program' },
        });
        expect(stale.status).toBe(412);
        const body = await stale.json();
        expect(body.current.findings).toBe('Counter belt slipped off its pulley');
        await journey.reload(page);
        expect(await page.getByLabel('Findings').inputValue()).toBe('Counter belt slipped off its pulley');
      },
    );

    await journey.step('sees when the token was last used, revokes it, and the program is refused', async () => {
      await journey.goto(page, '/account/api-tokens');
      await sees(page.getByText(/last used \d/));
      await journey.navigates(page, /notice=revoked/, () => page.getByRole('button', { name: 'Revoke Front desk invoicing' }).click());
      await sees(page.getByText('The token is revoked'));
      const refused = await program(token, '/api/v1/job-sheets');
      expect(refused.status).toBe(401);
    });

    await journey.close();
  });
});
