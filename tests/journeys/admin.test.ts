// An admin reaches every page of theirs from the header: members and roles (finds a member), word families, wanted
// fixes and the proofing desk.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { Journey, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let admin: TestUser;
let member: TestUser;

beforeAll(async () => {
  browser = await launchBrowser();
  admin = await createUser(knex, { role: 'admin', tag: 'journey-admin' });
  member = await createUser(knex, { tag: 'journey-admin-finds' });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

describe('an admin', () => {
  it('finds a member under members and roles, then opens word families, wanted fixes and the desk from the header', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: admin });
    // Staff pages sit in the header's second row, beside the main navigation.
    const nav = page.getByRole('banner');

    await journey.step('opens members and roles from the header and finds a member by e-mail', async () => {
      await journey.goto(page, '/');
      await journey.navigates(page, /\/admin\/users$/, () =>
        nav
          .getByRole('link', { name: /^(Admin|Users|Members)/ })
          .first()
          .click(),
      );
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe('Members and roles');
      await page.getByLabel('Name, e-mail or shop').fill(member.email);
      await journey.navigates(page, /\/admin\/users\?q=/, () =>
        page.getByRole('main').getByRole('button', { name: 'Search', exact: true }).click(),
      );
      await sees(page.getByText('1 member matching'));
      await sees(page.getByRole('row').filter({ hasText: member.email }));
    });

    for (const [link, path, heading] of [
      [/Word families/i, /\/admin\/word-families$/, 'Word families'],
      [/Wanted fixes/i, /\/admin\/wanted-fixes$/, 'Wanted fixes'],
      [/Proofing desk/i, /\/proofing$/, /Proofing desk/],
    ] as const) {
      await journey.step(`opens ${String(heading)} from the header`, async () => {
        await journey.navigates(page, path, () => nav.getByRole('link', { name: link }).click());
        const h1 = (await page.getByRole('heading', { level: 1 }).textContent()) ?? '';
        if (typeof heading === 'string') expect(h1).toBe(heading);
        else expect(h1).toMatch(heading);
      });
    }

    await journey.close();
  });
});
