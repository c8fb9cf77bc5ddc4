// A technician who restores one family of decks follows it, chooses to hear about new fixes at once, finds the
// news of a new fix by mail and in the header, reads it, marks it read, and later stops following from a phone.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { completeValues, publishFix, session } from '../fixtures/writing';
import { Journey, PHONE_WIDTH, base, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let technician: TestUser;
let machine: { id: number; chassis_slug: string; chassis_name: string };

beforeAll(async () => {
  browser = await launchBrowser();
  technician = await createUser(knex, { tag: 'journey-follower' });
  machine = await knex('machines as m')
    .join('chassis_families as c', 'c.id', 'm.chassis_family_id')
    .whereNull('m.deleted_at')
    .orderBy('m.id')
    .first('m.id', 'c.slug as chassis_slug', 'c.name as chassis_name');
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

describe('a technician following a chassis family', () => {
  it('follows it, hears about a new fix by mail and in the app, reads it and stops following on a phone', async () => {
    const journey = new Journey(browser);
    const page = await journey.page({ as: technician });
    let fixSlug = '';
    let fixTitle = '';

    await journey.step('follows the chassis family from its page, by keyboard', async () => {
      await journey.goto(page, `/chassis/${machine.chassis_slug}`);
      const follow = page.getByRole('button', { name: `Follow ${machine.chassis_name}` });
      await follow.focus();
      await journey.navigates(page, new RegExp(`/chassis/${machine.chassis_slug}$`), () => page.keyboard.press('Enter'));
      await sees(page.getByRole('button', { name: `Stop following ${machine.chassis_name}` }));
    });

    await journey.step('chooses to hear about new fixes at once by e-mail', async () => {
      await journey.goto(page, '/account/notifications');
      const group = page.getByRole('group', { name: 'A fix goes live for something you follow' });
      await group.getByRole('radio', { name: 'E-mail at once' }).check();
      await journey.navigates(page, /\/account\/notifications/, () => page.getByRole('button', { name: 'Save' }).click());
      await sees(page.getByRole('status').filter({ hasText: 'Saved.' }));
      expect(await group.getByRole('radio', { name: 'E-mail at once' }).isChecked()).toBe(true);
    });

    await journey.step('a fix for a machine of the family goes live (written and proofed by others)', async () => {
      const author = await session(knex, base, 'member', 'journey-follow-author');
      const moderator = await session(knex, base, 'moderator', 'journey-follow-mod');
      const values = completeValues(machine.id);
      fixTitle = values.title;
      ({ slug: fixSlug } = await publishFix(base, author, moderator, values));
      // The job queue fans it out within a few seconds.
      const deadline = Date.now() + 15_000;
      while (!(await knex('notification_events').where({ user_id: technician.id, kind: 'fix_proofed' }).first('id'))) {
        if (Date.now() > deadline) throw new Error('no news recorded for the follower');
        await new Promise((resolve) => setTimeout(resolve, 200));
      }
    });

    await journey.step('finds the mail about it in the mail sink, with a link to the fix', async () => {
      const deadline = Date.now() + 30_000;
      for (;;) {
        await journey.goto(page, '/dev/mail');
        const mail = page.getByRole('link', { name: `A fix goes live for something you follow: ${fixTitle}` });
        if ((await mail.count()) > 0) {
          await journey.navigates(page, /\/dev\/mail\//, () => mail.first().click());
          expect(await page.content()).toContain(`/fixes/${fixSlug}`);
          break;
        }
        if (Date.now() > deadline) throw new Error('no mail about the new fix in the sink');
        await new Promise((resolve) => setTimeout(resolve, 1000));
      }
    });

    await journey.step('sees one unread in the header, opens it and marks it read', async () => {
      await journey.goto(page, '/');
      const news = page.getByRole('banner').getByRole('link', { name: /News\s*1 unread/ });
      await sees(news);
      await journey.navigates(page, /\/notifications$/, () => news.click());
      await sees(page.getByRole('link', { name: /Capstan motor stalls/ }));
      expect(await page.getByRole('list', { name: 'Your notifications' }).innerHTML()).toContain(`/fixes/${fixSlug}`);
      await journey.navigates(page, /\/notifications/, () => page.getByRole('button', { name: 'Mark all 1 as read' }).click());
      await sees(page.getByRole('status').filter({ hasText: 'Marked as read.' }));
      expect(
        await page
          .getByRole('banner')
          .getByRole('link', { name: /unread/ })
          .count(),
      ).toBe(0);
    });

    await journey.step('on a phone, stops following from the Following page', async () => {
      await page.setViewportSize({ width: PHONE_WIDTH, height: 800 });
      await journey.goto(page, '/following');
      await journey.navigates(page, /\/following/, () =>
        page.getByRole('button', { name: new RegExp(`Stop following .*${machine.chassis_name}`) }).click(),
      );
      await sees(page.getByRole('status').filter({ hasText: `You no longer follow` }));
      await sees(page.getByText('You follow nothing yet.'));
    });

    await journey.step('opens a cut-short unsubscribe link and is told what to do', async () => {
      await journey.goto(page, '/unsubscribe/12.f3.tooshort');
      await sees(page.getByRole('alert').filter({ hasText: 'Copy the whole link from the mail' }));
    });

    await journey.close();
  });
});
