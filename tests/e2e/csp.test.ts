// The Content-Security-Policy in Chromium: the main pages, as each kind of person, with the search box, the account
// check, a bench tool and the remedy editor in use, raise no CSP violation and no console error; pages carry no
// 'unsafe-inline' and list a hash for each inline script they hold; other answers carry the strict policy.
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { testDb } from '../support/db';
import { E2E_PORT } from '../support/test-env';
import { createUser, type TestUser } from '../support/sign-in';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;
let fixSlug = '';
const people: Record<'member' | 'moderator' | 'admin', TestUser | null> = { member: null, moderator: null, admin: null };

beforeAll(async () => {
  browser = await launchBrowser();
  const fix = await knex('fixes').whereNotNull('current_revision_id').first<{ slug: string }>('slug');
  fixSlug = fix!.slug;
  for (const role of ['member', 'moderator', 'admin'] as const) people[role] = await createUser(knex, { role, tag: `csp-${role}` });
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

function directive(policy: string, name: string): string {
  return (
    policy
      .split(';')
      .map((part) => part.trim())
      .find((part) => part.startsWith(`${name} `)) ?? ''
  );
}

/** Every CSP violation and console error on the context's pages, described. */
function watch(context: BrowserContext): string[] {
  const problems: string[] = [];
  void context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (event) =>
      console.error(`CSP violation: ${event.violatedDirective} blocked ${event.blockedURI || 'inline'} ${event.sample}`),
    );
  });
  context.on('page', (page) => {
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(`${page.url()}: ${message.text()}`);
    });
    page.on('pageerror', (error) => problems.push(`${page.url()}: ${error.message}`));
  });
  return problems;
}

async function visit(page: Page, path: string): Promise<void> {
  const response = await page.goto(`${base}${path}`, { waitUntil: 'networkidle' });
  expect(response?.status(), path).toBeLessThan(400);
}

describe('the policy as sent', () => {
  it('lets no inline script or style run without its hash, and lists a hash for each inline script on the page', async () => {
    for (const path of ['/search?q=belt', `/fixes/${fixSlug}`, '/tools/value-decoder', '/sign-up']) {
      const response = await fetch(`${base}${path}`);
      const policy = response.headers.get('content-security-policy') ?? '';
      expect(policy, path).not.toContain('unsafe-inline');
      expect(policy, path).not.toContain('unsafe-eval');
      for (const name of ['default-src', 'object-src', 'base-uri', 'frame-ancestors', 'form-action', 'worker-src', 'manifest-src'])
        expect(directive(policy, name), `${path} ${name}`).not.toBe('');
      const scripts = directive(policy, 'script-src');
      const html = await response.text();
      // Data blocks (JSON-LD) never run, so the policy does not govern them (HTML: a script of a non-JavaScript type).
      for (const [, body] of html.matchAll(/<script\b(?![^>]*\bsrc=)(?![^>]*type="application\/ld\+json")[^>]*>([\s\S]*?)<\/script>/g)) {
        const hash = `'sha256-${createHash('sha256').update(body!).digest('base64')}'`;
        expect(scripts, `${path}: an inline script without its hash`).toContain(hash);
      }
    }
  });

  it('gives answers that are not pages (JSON, a redirect, a 404, a refused cross-site post) the strict policy and the other headers', async () => {
    const answers = [
      await fetch(`${base}/api/v1/search?q=belt`),
      await fetch(`${base}/write`, { redirect: 'manual' }),
      await fetch(`${base}/no-such-page-here`),
      await fetch(`${base}/sign-in`, {
        method: 'POST',
        headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'http://elsewhere.example' },
        body: 'intent=password',
      }),
    ];
    expect(answers.map((a) => a.status)).toEqual([200, 302, 404, 403]);
    for (const answer of answers) {
      const policy = answer.headers.get('content-security-policy') ?? '';
      expect(directive(policy, 'script-src'), `${answer.url} ${answer.status}`).toMatch(/^script-src 'self'/);
      expect(policy).not.toContain('unsafe-inline');
      expect(answer.headers.get('x-content-type-options'), `${answer.status}`).toBe('nosniff');
      expect(answer.headers.get('x-frame-options'), `${answer.status}`).toBe('DENY');
    }
  });
});

describe('pages in Chromium under the policy', () => {
  it('raise no violation for a reader: search as you type, a bench tool, the account check', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const problems = watch(context);
    const page = await context.newPage();
    for (const path of ['/', `/fixes/${fixSlug}`, '/machines', '/makers', '/tools', '/help', '/sign-in', '/reset', '/order-list'])
      await visit(page, path);

    await visit(page, '/search');
    await page.locator('[data-live-search][data-enhanced]').waitFor({ state: 'attached' });
    await page.getByRole('combobox').pressSequentially('no rewind', { delay: 20 });
    await page.getByRole('option').first().waitFor({ state: 'visible' });
    // Escape closes the list and keeps what was typed (Chromium would empty a search field).
    await page.keyboard.press('Escape');
    await expect(page.getByRole('combobox').inputValue()).resolves.toBe('no rewind');
    await expect(page.getByRole('combobox').getAttribute('aria-expanded')).resolves.toBe('false');

    await visit(page, '/tools/bleed-down');
    await page.waitForSelector('astro-island:not([ssr])', { state: 'attached' });
    await page.getByLabel('Capacitance').pressSequentially('150uF');
    await page.getByLabel('Bleed resistor').pressSequentially('470k');
    await page.getByLabel('Starting voltage').pressSequentially('340V');

    await visit(page, '/sign-up');
    await page.fill('#email', 'not-an-address');
    await page.click('form[data-check="sign-up"] button[type="submit"]');
    await expect(page.locator('#email').getAttribute('aria-invalid')).resolves.toBe('true');
    await context.close();
    expect(problems).toEqual([]);
  });

  it('raise no violation for a member writing and formatting a fix, and on their own pages', async () => {
    const member = people.member!;
    const context = await signedInContext(browser, base, member.email, member.password);
    const problems = watch(context);
    const page = await context.newPage();
    for (const path of ['/account', '/jobs', '/jobs/new', '/notes', '/write/mine', '/order-list', `/fixes/${fixSlug}`])
      await visit(page, path);

    await visit(page, '/write');
    const remedy = page.getByRole('textbox', { name: /^Remedy/ });
    await remedy.click();
    await page.keyboard.type('Clean the idler ');
    await page.keyboard.press('Control+B');
    await page.keyboard.type('with isopropyl alcohol');
    const tool = (name: string) => page.getByRole('toolbar', { name: 'Remedy formatting' }).getByRole('button', { name, exact: true });
    await tool('1. Steps, numbered').click();
    await tool('Insert table').click();
    await page.keyboard.type('TP4');
    await expect(remedy.locator('strong').textContent()).resolves.toBe('with isopropyl alcohol');
    await expect(remedy.locator('table').count()).resolves.toBe(1);

    await visit(page, `/fixes/${fixSlug}/edit`);
    await page.getByRole('textbox', { name: /^Remedy/ }).waitFor();
    await context.close();
    expect(problems).toEqual([]);
  });

  it('raise no violation on the proofing desk and the admin pages', async () => {
    for (const [role, paths] of [
      ['moderator', ['/proofing']],
      ['admin', ['/admin/users', '/admin/word-families', '/admin/wanted-fixes']],
    ] as const) {
      const person = people[role]!;
      const context = await signedInContext(browser, base, person.email, person.password, { viewport: { width: 360, height: 800 } });
      const problems = watch(context);
      const page = await context.newPage();
      for (const path of paths) await visit(page, path);
      await context.close();
      expect(problems, role).toEqual([]);
    }
  });
});
