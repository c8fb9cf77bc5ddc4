// Public pages' validators through the built server: an anonymous repeat is answered 304 from the page's key; a
// proofing, a lock, a hide, a bench report or a catalogue edit changes the key and the text; signed-in readers
// get their own private render, never the anonymous kept one.
import { request as httpRequest, type IncomingHttpHeaders } from 'node:http';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client } from '../support/http';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { scriptsBesideRegistration } from '../support/scripts';
import { DEMO_PASSWORD, signIn, uniqueClientIp } from '../support/sign-in';
import { refreshFixSearchRow } from '@/server/search/fix-search-row';
import { call, completeValues, session } from '../fixtures/writing';
import { PASSWORD, as, makeFix, makeMember, makeWorld, proofNewRevision, type TestFix, type TestWorld } from './bench-work-support';

const site = client(INTEGRATION_PORT);
let knex: Knex;
let world: TestWorld;
let author: { id: number };
let fix: TestFix;

beforeAll(async () => {
  knex = testDb();
  world = await makeWorld(knex);
  author = await makeMember(knex);
  fix = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id], title: 'Validator fault' });
});
afterAll(() => knex.destroy());

async function get(path: string, headers: Record<string, string> = {}) {
  const res = await site.get(path, { headers });
  return { status: res.status, headers: res.headers, text: await res.text() };
}

/** The ETag of a first anonymous read, and the answer to repeating it with If-None-Match. */
async function revalidate(path: string) {
  const first = await get(path);
  const tag = first.headers.get('etag');
  const again = tag ? await get(path, { 'If-None-Match': tag }) : null;
  return { first, tag, again };
}

/**
 * A page read anonymously (kept, 304 on repeat), then by a member sending the anonymous ETag: they get a private
 * render of their own, never the kept one.
 */
async function signedInAfterAnonymous(path: string, name: string) {
  const anonymous = await revalidate(path);
  expect(anonymous.again?.status).toBe(304);
  expect(anonymous.first.text).not.toContain('Sign out');
  const reader = await makeMember(knex, { name });
  const cookie = await signIn(site.base, reader.email, PASSWORD, uniqueClientIp());
  const mine = await get(path, { cookie, 'If-None-Match': anonymous.tag! });
  expect(mine.status).toBe(200);
  expect(mine.headers.get('cache-control')).toBe('private, no-store');
  expect(mine.headers.get('etag')).toBeNull();
  expect(mine.text).toContain('Sign out');
  return { anonymous, mine };
}

describe('validators on public pages', () => {
  it('answers a repeated anonymous fix page with 304 and no body', async () => {
    const { first, tag, again } = await revalidate(`/fixes/${fix.slug}`);
    expect(first.status).toBe(200);
    expect(tag).toMatch(/^W\/"[^"]+"$/);
    expect(first.headers.get('cache-control')).toContain('public');
    expect(again?.status).toBe(304);
    expect(again?.text).toBe('');
    expect(again?.headers.get('etag')).toBe(tag);
  });

  it.each(['/', '/machines', '/makers', '/help', '/help/working-safely', '/sitemap.xml'])('validates %s as well', async (path) => {
    const { first, tag, again } = await revalidate(path);
    expect(first.status).toBe(200);
    expect(tag).toMatch(/^W\//);
    expect(again?.status).toBe(304);
  });

  it('validates machine, chassis, maker pages and revision permalinks', async () => {
    for (const path of [
      `/machines/${world.machines[0]!.slug}`,
      `/chassis/${world.chassisSlug}`,
      `/makers/${world.makerSlug}`,
      `/fixes/${fix.slug}/r/1`,
    ]) {
      const { tag, again } = await revalidate(path);
      expect(tag, path).toMatch(/^W\//);
      expect(again?.status, path).toBe(304);
    }
  });

  it('answers 200 with the new text after a proofing, and the old ETag no longer matches', async () => {
    const path = `/fixes/${fix.slug}`;
    const { tag } = await revalidate(path);
    await proofNewRevision(knex, fix, author.id);
    const after = await get(path, { 'If-None-Match': tag! });
    expect(after.status).toBe(200);
    expect(after.text).toContain(`Rewritten fault r${fix.revisionIds.length}`);
    expect(after.headers.get('etag')).not.toBe(tag);
    // The new text is what is kept now.
    expect((await get(path)).text).toContain(`Rewritten fault r${fix.revisionIds.length}`);
  });

  it('changes the key when a moderator locks the fix, and shows the lock', async () => {
    const path = `/fixes/${fix.slug}`;
    const { tag } = await revalidate(path);
    const moderator = as(site.base, await signIn(site.base, 'moderator@example.test', DEMO_PASSWORD, uniqueClientIp()));
    expect((await moderator.post(`/api/v1/proofing/fixes/${fix.slug}`, { action: 'lock' })).status).toBe(200);
    const after = await get(path, { 'If-None-Match': tag! });
    expect(after.status).toBe(200);
    expect(after.text).toContain('Locked against edits by a moderator');
    expect((await moderator.post(`/api/v1/proofing/fixes/${fix.slug}`, { action: 'unlock' })).status).toBe(200);
    expect((await get(path, { 'If-None-Match': after.headers.get('etag')! })).status).toBe(200);
  });

  it('stops answering a hidden fix from validators or the kept render', async () => {
    const hidden = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[1]!.id] });
    const path = `/fixes/${hidden.slug}`;
    const { tag, again } = await revalidate(path);
    expect(again?.status).toBe(304);
    const moderator = as(site.base, await signIn(site.base, 'moderator@example.test', DEMO_PASSWORD, uniqueClientIp()));
    expect((await moderator.post(`/api/v1/proofing/fixes/${hidden.slug}`, { action: 'hide' })).status).toBe(200);
    expect((await get(path, { 'If-None-Match': tag! })).status).toBe(404);
    expect((await get(path)).status).toBe(404);
  });

  it('changes the key with a bench report, and the page shows it', async () => {
    const path = `/fixes/${fix.slug}`;
    const { tag, first } = await revalidate(path);
    expect(first.text).not.toContain('A bench report for the validators');
    const reporter = await makeMember(knex);
    const member = as(site.base, await signIn(site.base, reporter.email, PASSWORD, uniqueClientIp()));
    const sent = await member.post('/api/v1/bench-reports', {
      fix: fix.slug,
      machine: world.machines[0]!.slug,
      outcome: 'fixed',
      note: 'A bench report for the validators',
    });
    expect(sent.status).toBeLessThan(300);
    const after = await get(path, { 'If-None-Match': tag! });
    expect(after.status).toBe(200);
    expect(after.text).toContain('A bench report for the validators');
  });

  it('keeps every key while a member starts and saves a draft, and changes them when it goes live', async () => {
    // Drafts are never shown, so writers saving all day must not empty every kept page (nor queue on the counter).
    const paths = ['/machines', `/fixes/${fix.slug}`, `/machines/${world.machines[0]!.slug}`, '/search?q=tray+will+not+close'];
    const tags: string[] = [];
    for (const path of paths) {
      const { tag, again } = await revalidate(path);
      expect(again?.status, path).toBe(304);
      tags.push(tag!);
    }
    const writer = await session(knex, site.base, 'member', 'validator-drafts');
    const values = completeValues(world.machines[0]!.id);
    const created = await call(site.base, '/api/v1/drafts', { body: { values }, cookie: writer.cookie });
    expect(created.status).toBe(201);
    const id: number = created.body.revision.id;
    const saved = await call(site.base, `/api/v1/drafts/${id}`, {
      method: 'PUT',
      body: { values: { ...values, cause: 'Saved again while the writer typed.' } },
      cookie: writer.cookie,
    });
    expect(saved.status).toBeLessThan(300);
    for (const [i, path] of paths.entries()) expect((await get(path, { 'If-None-Match': tags[i]! })).status, path).toBe(304);

    const moderator = await session(knex, site.base, 'moderator', 'validator-drafts-proofer');
    expect((await call(site.base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: writer.cookie })).status).toBe(200);
    const proofed = await call(site.base, `/api/v1/proofing/${id}/proof`, { body: {}, cookie: moderator.cookie });
    expect(proofed.status).toBe(200);
    const machinePage = await get(`/machines/${world.machines[0]!.slug}`, { 'If-None-Match': tags[2]! });
    expect(machinePage.status).toBe(200);
    expect(machinePage.text).toContain(`href="/fixes/${proofed.body.slug}"`);
  });

  it('changes the key of fix and machine pages with a catalogue edit', async () => {
    const machine = world.machines[0]!;
    const fixPage = await revalidate(`/fixes/${fix.slug}`);
    const machinePage = await revalidate(`/machines/${machine.slug}`);
    const renamed = `TM-RENAMED-${Date.now().toString(36)}`.toUpperCase();
    await knex('machines').where({ id: machine.id }).update({ model_number: renamed });
    for (const [path, tag] of [
      [`/fixes/${fix.slug}`, fixPage.tag],
      [`/machines/${machine.slug}`, machinePage.tag],
    ] as const) {
      const after = await get(path, { 'If-None-Match': tag! });
      expect(after.status, path).toBe(200);
      expect(after.text, path).toContain(renamed);
    }
  });
});

describe('compressed for a slow connection', () => {
  /** One answer read raw (node:http does not decompress), as a phone on a workshop connection receives it. */
  function raw(path: string, acceptEncoding: string) {
    return new Promise<{ status: number; headers: IncomingHttpHeaders; bytes: Buffer }>((done, fail) => {
      httpRequest(`${site.base}${path}`, { headers: { 'accept-encoding': acceptEncoding } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done({ status: res.statusCode ?? 0, headers: res.headers, bytes: Buffer.concat(chunks) }));
      })
        .on('error', fail)
        .end();
    });
  }

  it('sends the fix page and its stylesheet in Brotli, a third of their size or less, decoding to the same bytes', async () => {
    const path = `/fixes/${fix.slug}`;
    const plain = await raw(path, 'identity');
    const br = await raw(path, 'gzip, deflate, br');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers.vary).toContain('Accept-Encoding');
    expect(br.headers.etag).toBe(plain.headers.etag);
    expect(br.bytes.byteLength).toBeLessThan(plain.bytes.byteLength / 3);
    expect(brotliDecompressSync(br.bytes).equals(plain.bytes)).toBe(true);

    const sheet = /href="(\/_astro\/[^"]+\.css)"/.exec(plain.bytes.toString())?.[1];
    expect(sheet).toBeDefined();
    const sheetPlain = await raw(sheet!, 'identity');
    const sheetBr = await raw(sheet!, 'br');
    expect(sheetBr.headers['content-encoding']).toBe('br');
    expect(sheetBr.headers['cache-control']).toContain('immutable');
    expect(sheetBr.headers['x-content-type-options']).toBe('nosniff');
    expect(sheetBr.bytes.byteLength).toBeLessThan(sheetPlain.bytes.byteLength / 4);
    expect(brotliDecompressSync(sheetBr.bytes).equals(sheetPlain.bytes)).toBe(true);
  });

  it('gzips a search page rendered for each request, and leaves it whole for a reader who asks for none', async () => {
    // A search that finds nothing is rendered every time (it is counted), so this is compressed on the way out.
    const path = `/search?q=vexqoz+${Date.now().toString(36).replace(/[0-9]/g, '')}`;
    const gz = await raw(path, 'gzip');
    const plain = await raw(path, '');
    expect(gz.status).toBe(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(gz.headers['cache-control']).toBe('no-cache');
    expect(gunzipSync(gz.bytes).toString()).toContain('<title>Search: vexqoz');
    expect(gunzipSync(gz.bytes).byteLength).toBe(plain.bytes.byteLength);
    expect(gz.bytes.byteLength).toBeLessThan(plain.bytes.byteLength / 2);
  });
});

describe('the search page for anonymous readers', () => {
  // Words no demo fix holds, unique to this run, so every result below comes from the fixes made here.
  const word = `quillet${[...Date.now().toString(36)].filter((c) => /[a-z]/.test(c)).join('')}`;

  it('answers a repeated search with 304, and a newly proofed fix that matches changes the key and the results', async () => {
    const first = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id], title: `Spindle ${word} drift` });
    await refreshFixSearchRow(knex, first.id);
    const path = `/search?q=${word}+drift`;
    const { first: page, tag, again } = await revalidate(path);
    expect(page.status).toBe(200);
    expect(page.text).toContain(`href="/fixes/${first.slug}"`);
    expect(page.headers.get('cache-control')).toContain('public');
    expect(tag).toMatch(/^W\//);
    expect(again?.status).toBe(304);

    const second = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[1]!.id], title: `Reel ${word} drift` });
    await refreshFixSearchRow(knex, second.id);
    const after = await get(path, { 'If-None-Match': tag! });
    expect(after.status).toBe(200);
    expect(after.text).toContain(`href="/fixes/${second.slug}"`);
    expect(after.headers.get('etag')).not.toBe(tag);
    // The kept render is the new one.
    expect((await get(path)).text).toContain(`href="/fixes/${second.slug}"`);
  });

  it('reads a word family added after the search was kept: the word is no longer left out', async () => {
    const synonym = `bramblewick${word.slice(-4)}`;
    const path = `/search?q=${synonym}+drift`;
    const fixes = await knex('fixes as f')
      .join('revisions as r', 'r.id', 'f.current_revision_id')
      .where('r.title', `Spindle ${word} drift`)
      .first('f.slug');
    const before = await revalidate(path);
    // No fix uses the word yet, so the search leaves it out and finds the fix by the rest.
    expect(before.first.text).toContain(`Left out (no fix uses it): ${synonym}.`);
    expect(before.first.text).toContain(`href="/fixes/${fixes.slug}"`);
    expect(before.again?.status).toBe(304);
    const [family] = await knex('word_families')
      .insert({ name: `Validator family ${word}`, terms: [word, synonym], created_by: author.id })
      .returning('id');
    try {
      const after = await get(path, { 'If-None-Match': before.tag! });
      expect(after.status).toBe(200);
      expect(after.headers.get('etag')).not.toBe(before.tag);
      expect(after.text).not.toContain('Left out (no fix uses it)');
      expect(after.text).toContain(`href="/fixes/${fixes.slug}"`);
    } finally {
      await knex('word_families').where({ id: family.id }).delete();
    }
  });

  it('never keeps a search that found nothing: no ETag, no-cache, and each one is counted as a miss', async () => {
    const nothing = `vexqoz${word.slice(-5)}`;
    const path = `/search?q=${encodeURIComponent(nothing)}`;
    const first = await get(path);
    expect(first.status).toBe(200);
    expect(first.text).toContain('No fix matches this search');
    expect(first.headers.get('etag')).toBeNull();
    expect(first.headers.get('cache-control')).toBe('no-cache');
    await get(path);
    await get(path);
    const miss = await knex('search_misses').where('query_text', nothing).first('count');
    expect(miss?.count).toBe(3);
  });

  it('keeps the search API the box asks while typing, and a proofed fix that matches changes its answer', async () => {
    const path = `/api/v1/search?q=${word}`;
    const { first, tag, again } = await revalidate(path);
    expect(first.status).toBe(200);
    expect(first.headers.get('content-type')).toContain('application/json');
    expect(tag).toMatch(/^W\//);
    expect(again?.status).toBe(304);
    const slugs = (text: string) => (JSON.parse(text) as { hits: { slug: string }[] }).hits.map((h) => h.slug);
    const third = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id], title: `Capstan ${word} wow` });
    expect(slugs(first.text)).not.toContain(third.slug);
    await refreshFixSearchRow(knex, third.id);
    const after = await get(path, { 'If-None-Match': tag! });
    expect(after.status).toBe(200);
    expect(slugs(after.text)).toContain(third.slug);
  });

  it('renders for a signed-in reader, never from the anonymous kept search', async () => {
    await signedInAfterAnonymous(`/search?q=${word}+drift`, 'Search Validator Reader');
  });
});

describe('signed-in readers', () => {
  it('get a private answer rendered for them: no ETag, no 304, never the anonymous kept body', async () => {
    const path = `/fixes/${fix.slug}`;
    const { anonymous, mine } = await signedInAfterAnonymous(path, 'Validator Reader');
    expect(mine.text).toContain('Save the bench report');
    // And the signed-in render is never handed to the next anonymous reader.
    const next = await get(path);
    expect(next.text).not.toContain('Sign out');
    expect(next.headers.get('etag')).toBe(anonymous.tag);
  });
});

describe('found and shared', () => {
  it('names the sitemap in robots.txt and keeps private areas out', async () => {
    const robots = await get('/robots.txt');
    expect(robots.status).toBe(200);
    expect(robots.text).toMatch(/^Sitemap: http:\/\/[^\n]+\/sitemap\.xml$/m);
    for (const path of ['/api/', '/account', '/proofing', '/jobs', '/n/']) expect(robots.text).toContain(`Disallow: ${path}\n`);
    expect(robots.text).not.toMatch(/Disallow: \/fixes/);
  });

  it('lists live fixes and the catalogue in the sitemap files the index names, and not hidden fixes', async () => {
    const index = await get('/sitemap.xml');
    expect(index.headers.get('content-type')).toContain('application/xml');
    const files = [...index.text.matchAll(/<loc>[^<]*(\/sitemaps\/\d+\.xml)<\/loc>/g)].map((m) => m[1]!);
    expect(files[0]).toBe('/sitemaps/1.xml');
    const all = (await Promise.all(files.map((f) => get(f)))).map((r) => r.text).join('\n');
    expect(all).toContain(`/fixes/${fix.slug}</loc>`);
    expect(all).toContain(`/machines/${world.machines[0]!.slug}</loc>`);
    expect(all).toContain(`/chassis/${world.chassisSlug}</loc>`);
    expect(all).toContain('/help/working-safely</loc>');
    const hidden = await knex('fixes').whereNotNull('hidden_at').first('slug');
    if (hidden) expect(all).not.toContain(`/fixes/${hidden.slug}</loc>`);
    expect((await get(`/sitemaps/${files.length + 1}.xml`)).status).toBe(404);
    expect((await get('/sitemaps/0.xml')).status).toBe(404);
  });

  it('gives a fix page its canonical address, Open Graph tags and JSON-LD that names the fix', async () => {
    const shared = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[1]!.id], title: 'Shared fault' });
    const page = await get(`/fixes/${shared.slug}`);
    const canonical = /<link rel="canonical" href="([^"]+)"/.exec(page.text)?.[1];
    expect(canonical).toMatch(new RegExp(`/fixes/${shared.slug}$`));
    expect(page.text).toContain(`<meta property="og:url" content="${canonical}">`);
    expect(page.text).toContain('<meta property="og:type" content="article">');
    const title = /<h1[^>]*>([^<]+)<\/h1>/.exec(page.text)?.[1];
    expect(page.text).toContain(`<meta property="og:title" content="${title}">`);
    const blocks = [...page.text.matchAll(/<script type="application\/ld\+json">([\s\S]*?)<\/script>/g)];
    expect(blocks).toHaveLength(1);
    const data = JSON.parse(blocks[0]![1]!);
    expect(data).toMatchObject({ '@context': 'https://schema.org', '@type': 'TechArticle', headline: title, url: canonical });
    expect(data.name).toBe(title);
    expect(data.about[0].brand.name).toMatch(/^Testmark /);
    // No script that runs but the service worker's registration: the JSON-LD block is data.
    expect(scriptsBesideRegistration(page.text)).toEqual([]);
    expect(page.text.match(/<script type="application\/ld\+json">/g)).toHaveLength(1);
  });
});
