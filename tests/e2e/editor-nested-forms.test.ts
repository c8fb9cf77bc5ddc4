// No page nests a <form> inside another: every page route, as anonymous, member, moderator and admin, in the HTML the
// server sends (where the browser would silently drop the inner form) and, for pages with islands, in Chromium's DOM.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { routeAccess } from '@/server/auth/route-access';
import { launchBrowser } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { signUnsubscribe } from '@/lib/notifications/unsubscribe-token';
import { createUser, postForm, signIn, uniqueClientIp } from '../support/sign-in';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;

type Persona = 'anonymous' | 'member' | 'moderator' | 'admin';
const personas: Persona[] = ['anonymous', 'member', 'moderator', 'admin'];
const cookies: Partial<Record<Persona, string>> = {};
/** A value for every route parameter, taken from the demo world or made below. */
const samples: Record<string, string> = {};

/** Routes that are not pages a person opens: JSON endpoints, files, images, crawlers' files and the framework's own routes. */
const notPages = (pattern: string) =>
  /^\/(api|media|_image|_server-islands|_actions|sitemaps)(\/|$)/.test(pattern) || /^\/(robots\.txt|sitemap\.xml)$/.test(pattern);

/** Where a form opens while another is still open, in HTML as sent (scripts, styles and comments left out). */
function nestedForms(html: string): string[] {
  const text = html.replace(/<!--[\s\S]*?-->/g, '').replace(/<(script|style|template)\b[\s\S]*?<\/\1\s*>/gi, '');
  const found: string[] = [];
  let depth = 0;
  for (const tag of text.matchAll(/<(\/?)form\b[^>]*>/gi)) {
    if (tag[1]) depth = Math.max(0, depth - 1);
    else if (depth++ > 0) found.push(tag[0].slice(0, 120));
  }
  return found;
}

async function api(persona: Persona, method: string, path: string, body?: unknown): Promise<Record<string, unknown>> {
  const response = await fetch(`${base}${path}`, {
    method,
    headers: { cookie: cookies[persona] ?? '', origin: base, 'content-type': 'application/json', accept: 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const data = (await response.json()) as Record<string, unknown>;
  if (!response.ok) throw new Error(`${method} ${path} answered ${response.status}: ${JSON.stringify(data).slice(0, 300)}`);
  return data;
}

/** Digs the first value named `key` out of a JSON answer, however it is wrapped. */
function find(data: unknown, key: string): unknown {
  if (!data || typeof data !== 'object') return undefined;
  if (key in data) return (data as Record<string, unknown>)[key];
  for (const value of Object.values(data)) {
    const hit = find(value, key);
    if (hit !== undefined) return hit;
  }
  return undefined;
}

beforeAll(async () => {
  browser = await launchBrowser();
  const users: Partial<Record<Persona, { email: string; password: string; id: number }>> = {};
  for (const persona of personas) {
    if (persona === 'anonymous') continue;
    users[persona] = await createUser(knex, { role: persona, tag: `e2e-nested-${persona}` });
    cookies[persona] = await signIn(base, users[persona]!.email, users[persona]!.password);
  }
  const fix = await knex('fixes as f')
    .join('revisions as r', 'r.id', 'f.current_revision_id')
    .whereNull('f.deleted_at')
    .whereNull('f.hidden_at')
    .orderBy('f.id')
    .first('f.slug', 'r.number');
  const machine = await knex('machines').whereNull('deleted_at').orderBy('id').first('id', 'slug');
  const maker = await knex('makers').orderBy('id').first('slug');
  const chassis = await knex('chassis_families').whereNull('deleted_at').orderBy('id').first('slug');
  Object.assign(samples, { slug: fix.slug, number: String(fix.number), key: 'no/such/file.jpg' });

  // The member's own records, so their pages show forms rather than "not found".
  const job = await api('member', 'POST', '/api/v1/job-sheets', { customerRef: 'Bench 4, walk-in', reportedSymptom: 'No rewind' });
  const note = await api('member', 'POST', '/api/v1/handover-notes', { fix: fix.slug, message: 'Belt replaced.' });
  const draft = await api('member', 'POST', '/api/v1/drafts', {
    values: {
      title: 'Drum will not spin up after a cold start',
      symptoms: ['Drum will not spin up'],
      errorCodes: [],
      cause: 'The drum motor supply capacitor has dried out.',
      body: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Replace the capacitor.' }] }] },
      parts: [],
      readings: [],
      cautions: [],
      difficulty: null,
      timeMinutes: null,
      editSummary: '',
      machineIds: [machine.id],
      chassisIds: [],
      photoIds: [],
    },
  });
  const draftId = find(draft, 'id') as number;
  await api('member', 'POST', `/api/v1/drafts/${draftId}/submit`, {});
  const pageSamples: Record<string, Record<string, string>> = {
    '/machines/[slug]': { slug: machine.slug },
    '/makers/[slug]': { slug: maker.slug },
    '/chassis/[slug]': { slug: chassis.slug },
    '/jobs/[id]': { id: String(find(job, 'id')) },
    '/notes/[code]': { code: String(find(note, 'code')) },
    '/n/[code]': { code: String(find(note, 'code')) },
    '/proofing/[id]': { id: String(draftId) },
    // A signed one-click unsubscribe link, as a notification mail carries (the test servers' AUTH_SECRET).
    '/unsubscribe/[token]': { token: signUnsubscribe(process.env.AUTH_SECRET!, { userId: users.member!.id, what: { digest: true } }) },
  };
  Object.assign(routeSamples, pageSamples);

  // A stored e-mail for the dev mail pages: ask for a password reset.
  await postForm(base, '/reset', { email: users.member!.email }, { ip: uniqueClientIp() });
  for (let i = 0; i < 30 && !routeSamples['/dev/mail/[id]']; i++) {
    const list = await (await fetch(`${base}/dev/mail`, { headers: { cookie: cookies.admin ?? '' } })).text();
    const id = /href="\/dev\/mail\/([^"?#/]+)"/.exec(list)?.[1];
    if (id) routeSamples['/dev/mail/[id]'] = { id: decodeURIComponent(id) };
    else await new Promise((r) => setTimeout(r, 200));
  }
}, 60_000);
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
});

/** Parameter values per route where a shared one (a fix slug) does not fit. */
const routeSamples: Record<string, Record<string, string>> = {};

function concretePath(pattern: string): string | null {
  let missing = false;
  const path = pattern.replace(/\[(?:\.\.\.)?([^\]]+)\]/g, (_, name: string) => {
    const value = routeSamples[pattern]?.[name] ?? samples[name];
    if (value === undefined) missing = true;
    return value ?? '';
  });
  return missing ? null : path;
}

const pagePatterns = () =>
  Object.entries(routeAccess)
    .filter(([pattern, rule]) => !notPages(pattern) && ('GET' in rule.methods || '*' in rule.methods))
    .map(([pattern]) => pattern);

describe('nestedForms', () => {
  it('finds a form opened inside another and nothing in side-by-side forms, scripts or comments', () => {
    expect(nestedForms('<form a><input><form b></form></form>')).toEqual(['<form b>']);
    expect(nestedForms('<form a></form><form b></form><!-- <form c> --><script>"<form d>"</script>')).toEqual([]);
    expect(nestedForms('<FORM method="post"><div><Form x></div></FORM>')).toEqual(['<Form x>']);
  });
});

describe('forms on every page', () => {
  it('has a sample address for every page route', () => {
    const unknown = pagePatterns().filter((pattern) => concretePath(pattern) === null);
    expect(unknown, 'add a sample value for these routes in this test').toEqual([]);
  });

  it('sends no page with a form inside a form, to anyone', async () => {
    const nested: string[] = [];
    const withIslands = new Map<string, Persona>();
    const shown = new Set<string>();
    for (const pattern of pagePatterns()) {
      const path = concretePath(pattern);
      if (!path) continue;
      for (const persona of personas) {
        const response = await fetch(`${base}${path}`, { headers: { cookie: cookies[persona] ?? '' }, redirect: 'manual' });
        if (!(response.headers.get('content-type') ?? '').includes('text/html')) continue;
        const html = await response.text();
        if (response.status < 300) shown.add(pattern);
        for (const tag of nestedForms(html)) nested.push(`${path} as ${persona}: ${tag}`);
        if (html.includes('<astro-island') && response.status < 300 && !withIslands.has(path)) withIslands.set(path, persona);
      }
    }
    expect(nested).toEqual([]);
    // Every page with parameters was really shown to someone, so a wrong sample cannot hide it behind a 404.
    const unseen = pagePatterns().filter((pattern) => pattern.includes('[') && !shown.has(pattern));
    expect(unseen, 'pages nobody was shown').toEqual([]);

    // Islands build their forms in the browser: look at the DOM once they are running.
    expect(withIslands.size, 'pages with islands').toBeGreaterThan(0);
    for (const [path, persona] of withIslands) {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
      if (cookies[persona])
        await context.addCookies(
          cookies[persona]!.split('; ').map((pair) => {
            const [name, ...value] = pair.split('=');
            return { name: name!, value: value.join('='), url: base };
          }),
        );
      const page = await context.newPage();
      await page.goto(`${base}${path}`, { waitUntil: 'networkidle' });
      const count = await page.evaluate(() => document.querySelectorAll('form form').length);
      if (count > 0) nested.push(`${path} as ${persona}, in the browser: ${count} nested`);
      // Toolbar buttons open panels of fields: open each, look, close it again.
      const tools = page.locator('[role="toolbar"] [data-toolbar-item]');
      for (let i = 0; i < (await tools.count()); i++) {
        const tool = tools.nth(i);
        if (!(await tool.isEnabled())) continue;
        const label = await tool.getAttribute('aria-label');
        await tool.click();
        const opened = await page.evaluate(() => document.querySelectorAll('form form').length);
        if (opened > 0) nested.push(`${path} as ${persona}, after pressing ${label}: ${opened} nested`);
        await page.keyboard.press('Escape');
      }
      await context.close();
    }
    expect(nested).toEqual([]);
  }, 240_000);
});
