// In Chromium, without JavaScript: join, confirm from the sink's mail, sign in, see the member's links; roles and suspension.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { linkIn, waitForMail } from '../support/mail';
import { DEMO_PASSWORD, STRONG_PASSWORD, createUser, uniqueEmail } from '../support/sign-in';
import { scriptsBesideRegistration } from '../support/scripts';

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

/** A browser of its own (separate cookies), with JavaScript off: every account page must work without it. */
async function freshPage(): Promise<Page> {
  const context = await browser.newContext({ javaScriptEnabled: false });
  return context.newPage();
}

async function signInWithPassword(page: Page, email: string, password: string): Promise<void> {
  await page.goto(`${base}/sign-in`);
  await page.fill('#pw-email', email);
  await page.fill('#pw-password', password);
  await Promise.all([
    page.waitForURL((url) => url.pathname !== '/sign-in'),
    page.click('form:has(input[value="password"]) button[type="submit"]'),
  ]);
}

/** The header's links: the main row and, for editors, moderators and admins, their own row. */
function nav(page: Page) {
  return page.locator('header.site-header');
}

describe('joining and signing in', () => {
  it('signs up, confirms from the e-mail, signs in and shows what a member may do', async () => {
    const email = uniqueEmail('e2e-join');
    const page = await freshPage();
    await page.goto(`${base}/`);
    await page.click('nav.site-nav >> text=Join');
    expect(new URL(page.url()).pathname).toBe('/sign-up');
    await page.fill('#name', 'Petra Vollmer-Sand');
    await page.fill('#email', email);
    await page.fill('#password', STRONG_PASSWORD);
    await page.fill('#shopName', 'Sandbank Repairs');
    await Promise.all([page.waitForURL((url) => url.pathname === '/sign-up/check-email'), page.click('button:has-text("Join")')]);
    expect(new URL(page.url()).pathname).toBe('/sign-up/check-email');
    await expect(page.locator('h1').textContent()).resolves.toContain('check your inbox');
    // Joining signs the new member in: their name is in the header before the address is confirmed.
    await expect(nav(page).locator('a[href="/account"]').textContent()).resolves.toContain('Petra Vollmer-Sand');
    await expect(page.locator('main').textContent()).resolves.toContain(email);

    const mail = await waitForMail(E2E_PORT, email, { subject: 'Confirm your e-mail address' });
    await page.goto(linkIn(mail, '/verify').href);
    await expect(page.locator('h1').textContent()).resolves.toBe('Your address is confirmed');

    await signInWithPassword(page, email, STRONG_PASSWORD);
    await expect(nav(page).locator('a[href="/account"]').textContent()).resolves.toContain('Petra Vollmer-Sand');
    expect(await nav(page).locator('a[href="/write"]').count()).toBe(1);
    expect(await nav(page).locator('a[href="/proofing"]').count()).toBe(0);
    expect(await nav(page).locator('a[href="/admin/users"]').count()).toBe(0);
    expect(await nav(page).getByRole('button', { name: 'Sign out' }).count()).toBe(1);
    // Reading pages stay script-free when signed in.
    await page.goto(`${base}/machines`);
    expect(scriptsBesideRegistration(await page.content())).toEqual([]);

    await page.click('nav.site-nav >> text=Sign out');
    expect(await nav(page).locator('text=Sign in').count()).toBe(1);
    await page.context().close();
  });

  it('shows the proofing desk to the demo moderator and not to the demo member', async () => {
    const moderatorPage = await freshPage();
    await signInWithPassword(moderatorPage, 'moderator@example.test', DEMO_PASSWORD);
    expect((await nav(moderatorPage).locator('a[href="/proofing"]').textContent())?.trim()).toBe('Proofing desk');
    await moderatorPage.context().close();

    const memberPage = await freshPage();
    await signInWithPassword(memberPage, 'member@example.test', DEMO_PASSWORD);
    expect(await nav(memberPage).locator('a[href="/account"]').count()).toBe(1);
    expect(await nav(memberPage).locator('a[href="/proofing"]').count()).toBe(0);
    await memberPage.context().close();
  });
});

describe('suspension', () => {
  it('signs a member out on their next page once a moderator suspends them on the members page', async () => {
    const member = await createUser(knex, { tag: 'e2e-suspend' });
    const memberPage = await freshPage();
    await signInWithPassword(memberPage, member.email, member.password);
    expect(await nav(memberPage).locator('a[href="/account"]').count()).toBe(1);

    const moderatorPage = await freshPage();
    await signInWithPassword(moderatorPage, 'moderator2@example.test', DEMO_PASSWORD);
    await moderatorPage.goto(`${base}/admin/users?q=${encodeURIComponent(member.email)}`);
    await moderatorPage.fill(`#reason-${member.id}`, 'Browser test suspension');
    await Promise.all([
      moderatorPage.waitForURL((url) => url.searchParams.has('notice')),
      moderatorPage.click(`form:has(input[name="userId"][value="${member.id}"]) button:has-text("Suspend")`),
    ]);
    await expect(moderatorPage.locator('[role="status"]').textContent()).resolves.toContain('suspended');

    await memberPage.reload();
    expect(await nav(memberPage).locator('text=Sign in').count()).toBe(1);
    expect(await nav(memberPage).locator('a[href="/account"]').count()).toBe(0);
    const cookies = await memberPage.context().cookies();
    expect(cookies.some((c) => c.name === 'authjs.session-token')).toBe(false);
    await memberPage.context().close();
    await moderatorPage.context().close();
  });
});

describe('checking account forms in the browser', () => {
  it('shows the server’s messages beside the fields before sending, and sends a form that passes', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    const posts: string[] = [];
    page.on('request', (request) => {
      if (request.method() === 'POST') posts.push(new URL(request.url()).pathname);
    });
    await page.goto(`${base}/sign-up`);
    await page.fill('#name', 'X');
    await page.fill('#email', 'not-an-address');
    await page.fill('#password', 'short');
    await page.click('form[data-check="sign-up"] button[type="submit"]');
    await expect(page.locator('#name-error').textContent()).resolves.toBe('Use at least 2 characters for your name.');
    await expect(page.locator('#password-error').textContent()).resolves.toBe('Use at least 10 characters.');
    await expect(page.locator('#email').getAttribute('aria-invalid')).resolves.toBe('true');
    await expect(page.evaluate(() => document.activeElement?.id)).resolves.toBe('name');
    expect(posts).toEqual([]);

    // Corrected, the form goes to the server as before, and the browser's messages are gone.
    await page.fill('#name', 'Wren Calloway');
    await page.fill('#email', uniqueEmail('browser-check'));
    await page.fill('#password', STRONG_PASSWORD);
    await Promise.all([
      page.waitForURL((url) => url.pathname === '/sign-up/check-email'),
      page.click('form[data-check="sign-up"] button[type="submit"]'),
    ]);
    expect(posts).toEqual(['/sign-up']);
    await context.close();
  });
});
