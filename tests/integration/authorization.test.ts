// Every route under src/pages has an access rule, and the built server enforces each guarded one for every kind of user.
import { readdirSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { can, type Actor } from '@/lib/permissions';
import { decideRoute, routeAccess, routeMethods, type Access, type RouteMethod } from '@/server/auth/route-access';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, signIn, uniqueClientIp } from '../support/sign-in';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const pagesDir = join(process.cwd(), 'src', 'pages');
const routeExtensions = /\.(astro|ts|js|mjs|mdx|md|html)$/;

/** Every file Astro turns into a route: anything under src/pages except names starting with "_" (and .d.ts). */
function routeFiles(dir: string = pagesDir): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
    if (entry.name.startsWith('_')) return [];
    const path = join(dir, entry.name);
    if (entry.isDirectory()) return routeFiles(path);
    return routeExtensions.test(entry.name) && !entry.name.endsWith('.d.ts') ? [path] : [];
  });
}

/** Astro's route pattern for a file: src/pages/fixes/[slug]/index.astro → /fixes/[slug]. */
function routePatternOf(file: string): string {
  const path = relative(pagesDir, file).split(sep).join('/').replace(routeExtensions, '');
  const withoutIndex = path === 'index' ? '' : path.replace(/\/index$/, '');
  return `/${withoutIndex}`;
}

/** A concrete address for a pattern: parameters get a made-up value (the guard runs before any lookup). */
function samplePath(pattern: string): string {
  return pattern.replace(/\[\.\.\.[^\]]+\]/g, 'sample/path').replace(/\[[^\]]+\]/g, 'sample-1');
}

type Persona = 'anonymous' | 'unverified' | 'member' | 'editor' | 'moderator' | 'admin' | 'suspended';
const personas: Persona[] = ['anonymous', 'unverified', 'member', 'editor', 'moderator', 'admin', 'suspended'];
const actors: Record<Persona, Actor> = {} as Record<Persona, Actor>;
const cookies: Record<Persona, string | undefined> = {} as Record<Persona, string | undefined>;
const knex = testDb();

beforeAll(async () => {
  for (const persona of personas) {
    if (persona === 'anonymous') {
      actors[persona] = null;
      cookies[persona] = undefined;
      continue;
    }
    const role = persona === 'unverified' || persona === 'suspended' ? 'member' : persona;
    const user = await createUser(knex, { role, verified: persona !== 'unverified', tag: `authz-${persona}` });
    cookies[persona] = await signIn(base, user.email, user.password);
    actors[persona] = { id: user.id, role, verified: persona !== 'unverified', suspended: persona === 'suspended' };
    // Suspended after signing in: the browser still holds a valid session cookie.
    if (persona === 'suspended')
      await knex('users').where({ id: user.id }).update({ suspended_at: new Date(), suspended_reason: 'authorization test' });
  }
});
afterAll(() => knex.destroy());

describe('route table', () => {
  it('has an entry for every file under src/pages', () => {
    const missing = routeFiles()
      .filter((file) => !routeAccess[routePatternOf(file)])
      .map(
        (file) =>
          `${relative(process.cwd(), file)} has no entry: add '${routePatternOf(file)}' to routeAccess in src/server/auth/route-access.ts`,
      );
    expect(missing, `\n${missing.join('\n')}\n`).toEqual([]);
  });

  it('lists no route that no longer has a file (injected routes aside)', () => {
    const patterns = new Set(routeFiles().map(routePatternOf));
    const stale = Object.entries(routeAccess)
      .filter(([pattern, rule]) => !rule.injected && !patterns.has(pattern))
      .map(([pattern]) => `${pattern} is in src/server/auth/route-access.ts but no file under src/pages makes it`);
    expect(stale, `\n${stale.join('\n')}\n`).toEqual([]);
  });

  it('maps file names to Astro route patterns', () => {
    expect(routePatternOf(join(pagesDir, 'index.astro'))).toBe('/');
    expect(routePatternOf(join(pagesDir, 'fixes', '[slug]', 'index.astro'))).toBe('/fixes/[slug]');
    expect(routePatternOf(join(pagesDir, 'media', '[...key].ts'))).toBe('/media/[...key]');
    expect(routePatternOf(join(pagesDir, 'help', 'privacy.mdx'))).toBe('/help/privacy');
  });
});

interface Probe {
  pattern: string;
  method: RouteMethod;
  access: Access;
}

function guardedProbes(): Probe[] {
  return Object.entries(routeAccess).flatMap(([pattern, rule]) =>
    Object.entries(rule.methods)
      .filter((entry): entry is [RouteMethod, Access] => entry[0] !== '*' && entry[1] !== 'public' && entry[1] !== 'closed')
      .map(([method, access]) => ({ pattern, method, access })),
  );
}

async function ask(probe: Probe, persona: Persona, ip?: string): Promise<Response> {
  const headers: Record<string, string> = { origin: base };
  if (ip) headers['x-forwarded-for'] = ip;
  const cookie = cookies[persona];
  if (cookie) headers.cookie = cookie;
  let body: string | undefined;
  if (probe.method !== 'GET') {
    // An empty body of the kind the route takes: allowed callers get a 400, never a change.
    const jsonApi = probe.pattern.startsWith('/api/');
    headers['content-type'] = jsonApi ? 'application/json' : 'application/x-www-form-urlencoded';
    body = jsonApi ? '{}' : '';
  }
  return fetch(`${base}${samplePath(probe.pattern)}`, { method: probe.method, headers, body, redirect: 'manual' });
}

/** Every route (files and injected) × every method the guard knows, with what the table decides for it. */
function everyProbe(): { pattern: string; method: RouteMethod; decision: ReturnType<typeof decideRoute> }[] {
  return Object.keys(routeAccess).flatMap((pattern) =>
    routeMethods.map((method) => ({ pattern, method, decision: decideRoute(pattern, method) })),
  );
}

describe('the whole matrix: every route × every method × every kind of user', () => {
  const probes = everyProbe();
  const personaCount = personas.length;

  it(`covers ${Object.keys(routeAccess).length} routes × ${routeMethods.length} methods × ${personaCount} kinds of user`, () => {
    expect(new Set(probes.map((p) => p.pattern)).size).toBe(Object.keys(routeAccess).length);
    expect(probes.length).toBe(Object.keys(routeAccess).length * routeMethods.length);
  });

  for (const pattern of Object.keys(routeAccess)) {
    it(`answers ${pattern} as the table says, for each method and each kind of user`, async () => {
      const api = pattern.startsWith('/api/');
      for (const { method, decision } of probes.filter((p) => p.pattern === pattern)) {
        const access = decision.kind === 'access' ? decision.access : 'closed';
        // Guarded methods are asked of every kind of user in 'route guard' below.
        if (access !== 'public' && access !== 'closed') continue;
        for (const persona of personas) {
          // Each request from an address of its own, so the public forms' rate limits never answer instead.
          const res = await ask({ pattern, method, access }, persona, uniqueClientIp());
          const context = `${method} ${pattern} as ${persona}: ${res.status}`;
          expect(res.status, context).toBeLessThan(500);
          if (access === 'closed') {
            expect(res.status, context).toBe(405);
            expect(res.headers.get('allow'), context).toBeTruthy();
            if (api) expect((await res.json()).error.code, context).toBe('method_not_allowed');
          } else if (access === 'public') {
            expect([401, 403, 405], context).not.toContain(res.status);
            expect(res.headers.get('location') ?? '', context).not.toMatch(/^\/sign-in\?next=/);
          }
          if (!res.bodyUsed) await res.arrayBuffer();
        }
      }
    });
  }
});

describe('route guard', () => {
  const probes = guardedProbes();

  it('has guarded routes to check', () => {
    expect(probes.map((p) => `${p.method} ${p.pattern}`)).toEqual(
      expect.arrayContaining(['GET /account', 'GET /admin/users', 'GET /api/v1/account']),
    );
  });

  for (const probe of probes) {
    it(`answers ${probe.method} ${probe.pattern} (needs ${probe.access}) for each kind of user`, async () => {
      const api = probe.pattern.startsWith('/api/');
      for (const persona of personas) {
        const res = await ask(probe, persona);
        const context = `${probe.method} ${probe.pattern} as ${persona}: ${res.status}`;
        if (can(actors[persona], probe.access as Exclude<Access, 'public' | 'closed'>)) {
          expect([401, 403, 405], context).not.toContain(res.status);
          expect(res.status, context).toBeLessThan(500);
          expect(res.headers.get('location') ?? '', context).not.toMatch(/^\/sign-in/);
        } else if (persona === 'anonymous' || persona === 'suspended') {
          if (api) {
            expect(res.status, context).toBe(401);
            expect((await res.json()).error.code, context).toBe('unauthorised');
          } else {
            expect([302, 303], context).toContain(res.status);
            expect(res.headers.get('location'), context).toMatch(/^\/sign-in\?next=/);
          }
        } else {
          expect(res.status, context).toBe(403);
          if (api) expect((await res.json()).error.code, context).toBe('forbidden');
        }
        if (!res.bodyUsed) await res.arrayBuffer();
      }
    });
  }

  it('treats a suspended member’s still-valid cookie as signed out and clears it', async () => {
    const res = await fetch(`${base}/account`, { headers: { cookie: cookies.suspended! }, redirect: 'manual' });
    expect(res.status).toBe(302);
    expect(res.headers.get('location')).toBe('/sign-in?next=%2Faccount');
    expect(res.headers.getSetCookie().some((c) => c.startsWith('authjs.session-token=') && /Expires=Thu, 01 Jan 1970/.test(c))).toBe(true);
  });

  it('spells out the answers for the members page', async () => {
    const expected: Record<Persona, number> = {
      anonymous: 302,
      unverified: 403,
      member: 403,
      editor: 403,
      moderator: 200,
      admin: 200,
      suspended: 302,
    };
    for (const persona of personas) {
      const res = await ask({ pattern: '/admin/users', method: 'GET', access: 'suspend_user' }, persona);
      expect(res.status, persona).toBe(expected[persona]);
      await res.arrayBuffer();
    }
  });

  it('tells an unconfirmed member why a page is closed', async () => {
    const res = await fetch(`${base}/admin/users`, { headers: { cookie: cookies.unverified! } });
    expect(res.status).toBe(403);
    expect(await res.text()).toContain('Confirm your e-mail address first');
  });

  it('keeps the security headers and no-store on guard answers', async () => {
    for (const res of [
      await fetch(`${base}/api/v1/account`),
      await fetch(`${base}/admin/users`, { headers: { cookie: cookies.member! } }),
    ]) {
      expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
      expect(res.headers.get('x-content-type-options')).toBe('nosniff');
      expect(res.headers.get('cache-control')).toBe('private, no-store');
    }
  });

  it('answers 405 for a method a route does not take', async () => {
    const res = await fetch(`${base}/machines`, {
      method: 'POST',
      headers: { origin: base, 'content-type': 'application/x-www-form-urlencoded' },
      body: '',
    });
    expect(res.status).toBe(405);
    expect(res.headers.get('allow')).toBe('GET, HEAD');
  });
});

describe('navigation by role', () => {
  const link = (href: string, label: string) => new RegExp(`href="${href}"[^>]*>\\s*${label}\\s*<`);
  const signInLink = />\s*Sign in\s*</;
  const joinLink = link('/sign-up', 'Join');
  const signOut = />\s*Sign out\s*</;
  const write = link('/write', 'Write a fix');
  const proofing = link('/proofing', 'Proofing desk');
  const adminLink = link('/admin/users', 'Members and roles');
  const membersLink = link('/admin/users', 'Members');
  const wordFamilies = link('/admin/word-families', 'Word families');
  const wantedFixes = link('/admin/wanted-fixes', 'Wanted fixes');
  const staffNav = /<nav[^>]*aria-label="Editing and moderation"/;

  it('shows each kind of user what they may do, editors and admins their own pages, with no script on the page', async () => {
    const expectations: Record<Persona, { shows: RegExp[]; hides: RegExp[] }> = {
      anonymous: { shows: [signInLink, joinLink], hides: [write, proofing, signOut, adminLink, wordFamilies, wantedFixes, staffNav] },
      unverified: { shows: [signOut], hides: [write, proofing, adminLink, signInLink, wordFamilies, staffNav] },
      member: { shows: [write, signOut], hides: [proofing, adminLink, membersLink, signInLink, wordFamilies, wantedFixes, staffNav] },
      editor: { shows: [write, signOut, staffNav, wordFamilies, wantedFixes], hides: [proofing, adminLink, membersLink] },
      moderator: { shows: [write, proofing, membersLink, staffNav, wordFamilies, wantedFixes], hides: [adminLink] },
      admin: { shows: [write, proofing, adminLink, staffNav, wordFamilies, wantedFixes], hides: [membersLink, signInLink] },
      suspended: { shows: [signInLink, joinLink], hides: [signOut, write, staffNav] },
    };
    for (const persona of personas) {
      const cookie = cookies[persona];
      const res = await fetch(`${base}/machines`, { headers: cookie ? { cookie } : {} });
      const html = await res.text();
      for (const pattern of expectations[persona].shows) expect(html, `${persona} sees ${pattern}`).toMatch(pattern);
      for (const pattern of expectations[persona].hides) expect(html, `${persona} does not see ${pattern}`).not.toMatch(pattern);
      expect(scriptsBesideRegistration(html), persona).toEqual([]);
      const signedIn = persona !== 'anonymous' && persona !== 'suspended';
      if (signedIn) expect(res.headers.get('cache-control'), persona).toBe('private, no-store');
      else if (persona === 'anonymous') expect(res.headers.get('cache-control'), persona).toContain('public');
    }
  });

  it('leads editors, moderators and admins from the header to pages that open for them', async () => {
    for (const persona of ['editor', 'moderator', 'admin'] as const) {
      const html = await (await fetch(`${base}/machines`, { headers: { cookie: cookies[persona]! } })).text();
      const row = html.match(/<nav[^>]*aria-label="Editing and moderation"[\s\S]*?<\/nav>/)?.[0] ?? '';
      const hrefs = [...row.matchAll(/href="([^"]+)"/g)].map((m) => m[1]!);
      expect(hrefs.length, persona).toBeGreaterThanOrEqual(2);
      for (const href of hrefs) {
        const page = await fetch(`${base}${href}`, { headers: { cookie: cookies[persona]! }, redirect: 'manual' });
        expect(page.status, `${persona} opens ${href}`).toBe(200);
      }
    }
  });
});
