// A moderator at the proofing desk: reads a new fix with its author's summary, returns it with a note, then checks
// the resubmission against the returned revision and proofs it live. An empty return is refused beside the note,
// with JavaScript on and off.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { testDb } from '../support/db';
import { createUser, type TestUser } from '../support/sign-in';
import { call, completeValues, session, someMachineId, type Session } from '../fixtures/writing';
import { Journey, base, sees } from './support/journey';

const knex = testDb();
let browser: Browser;
let author: Session;
let moderator: TestUser;

beforeAll(async () => {
  browser = await launchBrowser();
  author = await session(knex, base, 'member', 'journey-author');
  moderator = await createUser(knex, { role: 'moderator', tag: 'journey-moderator' });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

const firstCause = 'The capstan motor driver’s supply capacitor has dried out and its ripple rises as it warms.';
const amendedCause = 'C512, the 470 µF 16 V supply capacitor of the capstan driver, has dried out; ripple rises as it warms.';
const returnNote = 'Name the capacitor by its board reference and give its voltage rating in the cause.';

/** The author's side, as the writing page would send it. */
async function authorCall(path: string, body: unknown, method = 'POST'): Promise<any> {
  const answer = await call(base, path, { body, method, cookie: author.cookie });
  if (answer.status >= 300) throw new Error(`${method} ${path} answered ${answer.status}: ${JSON.stringify(answer.body)}`);
  return answer.body;
}

describe('a moderator', () => {
  it('returns a new fix with a note, compares the resubmission with the returned revision and proofs it', async () => {
    const values = completeValues(await someMachineId(knex, 9), { cause: firstCause, editSummary: 'First write-up of the capstan stall.' });
    const draft = await authorCall('/api/v1/drafts', { values });
    await authorCall(`/api/v1/drafts/${draft.revision.id}/submit`, {});

    const journey = new Journey(browser);
    const page = await journey.page({ as: moderator });

    await journey.step('opens the proofing desk from the header and finds the new fix with its summary', async () => {
      await journey.goto(page, '/');
      await journey.navigates(page, /\/proofing$/, () => page.getByRole('banner').getByRole('link', { name: 'Proofing desk' }).click());
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toMatch(/Proofing desk/);
      const row = page.getByRole('row').filter({ hasText: values.title });
      await sees(row);
      await expect(row.textContent()).resolves.toContain('First write-up of the capstan stall.');
    });

    await journey.step('reads the submitted revision: new fix, its author, its summary, its remedy', async () => {
      await journey.navigates(page, /\/proofing\/\d+$/, () => page.getByRole('link', { name: values.title }).click());
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toContain(values.title);
      await sees(page.getByText('A new fix: it has never been live.'));
      await sees(page.getByText(author.name));
      await sees(page.getByText('First write-up of the capstan stall.'));
      await sees(page.getByRole('heading', { name: 'The remedy as readers will see it' }));
    });

    const noScript = await journey.page({ as: moderator, javaScriptEnabled: false });
    await journey.step('with JavaScript off, tries to return it without a note and is told why beside the note field', async () => {
      await journey.goto(noScript, page.url().replace(base, ''));
      await journey.navigates(noScript, /\/proofing\/\d+\?_action=proofingDecision$/, () =>
        noScript.getByRole('button', { name: 'Return it with this note' }).click(),
      );
      await sees(noScript.locator('#decision-note-error').getByText(/Say what the author should change/));
      await expect(noScript.getByLabel('Note to the author').getAttribute('aria-invalid')).resolves.toBe('true');
      await noScript.screenshot({ path: '/tmp/journeys-moderator-decision-no-script.png', fullPage: true });
    });

    await journey.step(
      'with JavaScript on, the same empty return comes back on the same page with the message beside the note',
      async () => {
        await journey.navigates(page, /\/proofing\/\d+\?_action=proofingDecision$/, () =>
          page.getByRole('button', { name: 'Return it with this note' }).click(),
        );
        await sees(page.locator('#decision-note-error').getByText(/Say what the author should change/));
      },
    );

    await journey.step('returns it, giving the note in one place', async () => {
      await expect(page.getByLabel('Note to the author').count()).resolves.toBe(1);
      await page.getByLabel('Note to the author').fill(returnNote);
      await journey.navigates(page, /\/proofing\?returned=1$/, () =>
        page.getByRole('button', { name: 'Return it with this note' }).click(),
      );
      await expect(page.getByRole('status').first().textContent()).resolves.toMatch(/returned/i);
      await expect(page.getByRole('link', { name: values.title }).count()).resolves.toBe(0);
    });

    // The author amends the returned revision and submits it again.
    const amended = await authorCall(`/api/v1/revisions/${draft.revision.id}/amend`, {});
    await authorCall(
      `/api/v1/drafts/${amended.revision.id}`,
      { values: { ...values, cause: amendedCause, editSummary: 'Named C512 and its rating, as asked.' } },
      'PUT',
    );
    await authorCall(`/api/v1/drafts/${amended.revision.id}/submit`, {});

    await journey.step('finds the resubmission and compares it with the revision it returned', async () => {
      await journey.reload(page);
      await journey.navigates(page, /\/proofing\/\d+$/, () => page.getByRole('link', { name: values.title }).click());
      const main = page.getByRole('main');
      // What was asked, what the author says they did, and what changed since the returned revision.
      await sees(main.getByText(returnNote));
      await sees(main.getByText('Named C512 and its rating, as asked.'));
      await sees(main.getByRole('heading', { name: /returned r1/i }));
      // The cause as changed since the returned r1: the old wording struck, the board reference added.
      const cause = main.locator('section[aria-labelledby="since-cause"]');
      await expect(cause.locator('del').allInnerTexts()).resolves.toContainEqual(expect.stringContaining('The capstan motor driver’s'));
      await expect(cause.locator('ins').allInnerTexts()).resolves.toContainEqual(expect.stringContaining('C512, the 470 µF 16 V'));
    });

    await journey.step('proofs it and sees the fix live', async () => {
      await journey.navigates(page, /\/proofing\?proofed=1$/, () => page.getByRole('button', { name: 'Proof: make it live' }).click());
      await expect(page.getByRole('status').first().textContent()).resolves.toMatch(/live|proofed/i);
      const fix = await knex('fixes as f')
        .join('revisions as r', 'r.id', 'f.current_revision_id')
        .where('r.id', amended.revision.id)
        .first('f.slug');
      await journey.goto(page, `/fixes/${fix.slug}`);
      await expect(page.getByRole('heading', { level: 1 }).textContent()).resolves.toBe(values.title);
      await sees(page.getByText(amendedCause));
    });

    await journey.close();
  });
});
