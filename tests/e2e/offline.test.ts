// Offline in Chromium, with the real service worker: a visited fix and its photos come from the saved copy with its
// line (offline, or online with a network too slow to answer in time), an unvisited page shows the offline page, a
// kept fix opens with its photos and bench tools, private pages are never stored and sign-out empties the pages read
// signed in; a job sheet saved offline is sent on reconnect, and a sheet changed meanwhile shows both copies field by
// field; a bench report filed offline on a fix page waits in the same queue and is sent.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { demoWorldFixes } from '../support/demo-world';
import { makeMember, PASSWORD } from '../integration/bench-work-support';
import { createJobSheet, updateJobSheet } from '@/server/bench-work/job-sheets';
import { getOrderList } from '@/server/bench-work/order-lists';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { signIn } from '../support/sign-in';
import { closeDb } from '@/server/core/db';
import { hasRegistration, scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;

interface PhotoFix {
  slug: string;
  title: string;
  revision: number;
  machine: string;
}
/** Live fixes whose revision has photos, the one with a parts table (bench tool links) first. */
let photoFixes: PhotoFix[];

beforeAll(async () => {
  browser = await launchBrowser();
  const rows: { slug: string; title: string; number: number; machine: string }[] = await demoWorldFixes(knex)
    .whereExists(knex('revision_photos as rp').whereRaw('rp.revision_id = r.id'))
    .orderByRaw('jsonb_array_length(r.parts) DESC, f.id')
    .select('f.slug', 'r.title', 'r.number', 'm.slug as machine');
  photoFixes = rows.map((r) => ({ slug: r.slug, title: r.title, revision: r.number, machine: r.machine }));
  if (photoFixes.length < 2) throw new Error('The demo world needs two live fixes with photos for these tests.');
});
afterAll(async () => {
  await browser?.close();
  await knex.destroy();
  await closeDb();
});

/** Opens the site and waits until the service worker controls the page. */
async function installed(context: BrowserContext): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${base}/help`);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
    if (!navigator.serviceWorker.controller)
      await new Promise((resolve) => navigator.serviceWorker.addEventListener('controllerchange', resolve, { once: true }));
  });
  return page;
}

/** Every photo of the fix page shown and decoded (lazy ones scrolled into view first). */
async function photosShown(page: Page): Promise<{ count: number; broken: string[] }> {
  const images = page.locator('figure.photo img');
  const count = await images.count();
  for (let i = 0; i < count; i++) await images.nth(i).scrollIntoViewIfNeeded();
  await page.waitForFunction(() => [...document.querySelectorAll<HTMLImageElement>('figure.photo img')].every((img) => img.complete));
  const broken = await images.evaluateAll((imgs) =>
    (imgs as HTMLImageElement[]).filter((img) => img.naturalWidth === 0).map((img) => img.currentSrc),
  );
  return { count, broken };
}

/** Empties Chromium's own HTTP cache, so only the service worker's caches can answer (public pages may be kept 60 s). */
async function forgetHttpCache(page: Page): Promise<void> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('Network.clearBrowserCache');
  await cdp.detach();
}

async function cacheKeys(page: Page, name: string): Promise<string[]> {
  return page.evaluate(async (cacheName) => {
    if (!(await caches.has(cacheName))) return [];
    const cache = await caches.open(cacheName);
    return (await cache.keys()).map((r) => new URL(r.url).pathname + new URL(r.url).search);
  }, name);
}

describe('reading offline', () => {
  it('registers the worker from one bundled module script, the only script of a fix page, and serves the manifest', async () => {
    const html = await (await fetch(`${base}/fixes/${photoFixes[0]!.slug}`)).text();
    expect(hasRegistration(html)).toBe(true);
    expect(scriptsBesideRegistration(html)).toEqual([]);
    expect(html).toContain('<link rel="manifest" href="/manifest.webmanifest">');
    const manifest = (await (await fetch(`${base}/manifest.webmanifest`)).json()) as Record<string, unknown>;
    expect(manifest).toMatchObject({ name: 'Benchlore', display: 'standalone', theme_color: '#0f4c4a', background_color: '#f6f1e7' });
    for (const icon of manifest.icons as { src: string }[])
      expect((await fetch(`${base}${icon.src}`)).headers.get('content-type')).toBe('image/png');
  });

  it('serves a visited fix and its photos from the saved copy, with the line, and the offline page for an unvisited page', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await installed(context);
    const fix = photoFixes[0]!;
    await page.goto(`${base}/fixes/${fix.slug}`);
    const online = await photosShown(page);
    expect(online.count).toBeGreaterThan(0);
    expect(await page.locator('.saved-copy').count()).toBe(0);

    await forgetHttpCache(page);
    await context.setOffline(true);
    await page.reload();
    await expect(page.locator('h1').textContent()).resolves.toBe(fix.title);
    const line = await page.locator('.saved-copy').textContent();
    expect(line).toMatch(/^Saved copy from \d{1,2} [A-Z][a-z]+ \d{4} at \d{2}:\d{2}; you are offline\.$/);
    const offline = await photosShown(page);
    expect(offline).toEqual({ count: online.count, broken: [] });

    await page.goto(`${base}/machines/${fix.machine}?never-visited=1`);
    await expect(page.locator('h1').textContent()).resolves.toBe('You are offline');
    await page.screenshot({ path: '/tmp/pwa-offline-page.png' });
    await context.close();
  });

  it('says a page came from the saved copy when the network is too slow to answer, and nothing on a normal reload', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 } });
    const page = await installed(context);
    const fix = photoFixes[1]!;
    const address = `${base}/fixes/${fix.slug}`;
    await page.goto(address);
    expect(await cacheKeys(page, 'bl-pages')).toContain(`/fixes/${fix.slug}`);
    await forgetHttpCache(page);
    await page.reload();
    expect(await page.locator('.saved-copy').count()).toBe(0);

    // The network is up but slow: the page's answer is held well past the worker's 3 s timeout.
    let held = 0;
    await context.route(address, async (route) => {
      held += 1;
      await new Promise((resolve) => setTimeout(resolve, 8_000));
      await route.continue().catch(() => {});
    });
    await forgetHttpCache(page);
    await page.reload();
    await expect(page.locator('h1').textContent()).resolves.toBe(fix.title);
    const line = page.locator('.saved-copy');
    await line.waitFor();
    expect(await line.textContent()).toMatch(
      /^Saved copy from \d{1,2} [A-Z][a-z]+ \d{4} at \d{2}:\d{2}; the connection is slow, so this may be out of date\.$/,
    );
    expect(held).toBeGreaterThan(0);
    expect(await page.evaluate(() => navigator.onLine)).toBe(true);
    await page.screenshot({ path: '/tmp/pwa-slow-360.png' });

    // The connection is quick again: a reload shows the page from the network, with no line.
    await context.unroute(address);
    await forgetHttpCache(page);
    await page.reload();
    await expect(page.locator('h1').textContent()).resolves.toBe(fix.title);
    expect(await page.locator('.saved-copy').count()).toBe(0);
    await context.close();
  });

  it('keeps a fix with its photos and bench tools, opens them with no other cache, lists and drops it', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 } });
    const page = await installed(context);
    const fix = photoFixes[0]!;
    await page.goto(`${base}/fixes/${fix.slug}`);
    const toolLinks = await page
      .locator('article.fix a[href^="/tools/"]')
      .evaluateAll((links) => links.map((a) => a.getAttribute('href')!));
    await page.getByRole('button', { name: 'Keep for the bench' }).click();
    // The keeping code loads on first use: wait for what it says.
    await page.waitForFunction(() => document.querySelector('[data-keep-status]')?.textContent?.startsWith('Kept on this device'));
    const kept = await cacheKeys(page, 'bl-kept');
    expect(kept).toContain(`/fixes/${fix.slug}`);
    expect(kept.filter((k) => k.startsWith('/media/')).length).toBeGreaterThan(0);
    for (const tool of toolLinks) expect(kept).toContain(tool);

    // Only the kept copy is left: the pages and photos read while browsing are gone.
    await page.evaluate(async () => Promise.all([caches.delete('bl-pages'), caches.delete('bl-photos')]));
    await forgetHttpCache(page);
    await context.setOffline(true);
    await page.goto(`${base}/fixes/${fix.slug}`);
    await expect(page.locator('h1').textContent()).resolves.toBe(fix.title);
    expect((await photosShown(page)).broken).toEqual([]);
    if (toolLinks[0]) {
      await page.goto(`${base}${toolLinks[0]}`);
      expect(await page.locator('h1').textContent()).not.toBe('You are offline');
    }
    await page.goto(`${base}/kept`);
    const item = page.locator('[data-kept-list] li');
    await expect(item.first().textContent()).resolves.toContain(`${fix.title} r${fix.revision}, kept`);
    await page.screenshot({ path: '/tmp/pwa-kept-360.png', fullPage: true });
    await page.goto(`${base}/makers?unvisited=1`);
    await expect(page.locator('[data-kept-list] a').first().textContent()).resolves.toBe(fix.title);

    await page.goto(`${base}/kept`);
    await page.getByRole('button', { name: `Drop “${fix.title}” from this device` }).click();
    await page.waitForFunction(() => document.querySelectorAll('[data-kept-list] li').length === 0);
    expect(await cacheKeys(page, 'bl-kept')).toEqual([]);
    await forgetHttpCache(page);
    await page.goto(`${base}/fixes/${fix.slug}`);
    await expect(page.locator('h1').textContent()).resolves.toBe('You are offline');
    await context.close();
  });

  it('never stores a private page, and signing out empties the pages read signed in', async () => {
    const member = await makeMember(knex);
    const job = await createJobSheet(member.id, jobSheetCreateSchema.parse({ customerRef: 'Ticket SW-1' }));
    if (!job.ok) throw new Error(job.message);
    const context = await signedInContext(browser, base, member.email, PASSWORD);
    const page = await installed(context);
    await page.goto(`${base}/jobs/${job.value}`);
    await page.goto(`${base}/account`);
    await page.goto(`${base}/fixes/${photoFixes[1]!.slug}`);
    const stored = await cacheKeys(page, 'bl-pages');
    expect(stored).toContain(`/fixes/${photoFixes[1]!.slug}`);
    expect(stored.filter((k) => /^\/(jobs|account)/.test(k))).toEqual([]);

    await context.setOffline(true);
    await page.goto(`${base}/jobs/${job.value}`);
    await expect(page.locator('h1').textContent()).resolves.toBe('You are offline');
    await context.setOffline(false);

    await page.goto(`${base}/fixes/${photoFixes[1]!.slug}`);
    await Promise.all([page.waitForURL(`${base}/`), page.getByRole('button', { name: /sign out/i }).click()]);
    const after = await cacheKeys(page, 'bl-pages');
    expect(after).not.toContain(`/fixes/${photoFixes[1]!.slug}`);
    await context.close();
  });
});

describe('a job sheet offline', () => {
  it('keeps an edit made offline, says it waits, and sends it when the connection returns', async () => {
    const member = await makeMember(knex);
    const job = await createJobSheet(member.id, jobSheetCreateSchema.parse({ customerRef: 'Ticket SW-2', findings: 'Tray slips' }));
    if (!job.ok) throw new Error(job.message);
    const context = await signedInContext(browser, base, member.email, PASSWORD);
    const page = await installed(context);
    await page.goto(`${base}/jobs/${job.value}`);
    const before = await knex('job_sheets').where({ id: job.value }).first('version', 'findings');

    await context.setOffline(true);
    await page.fill('textarea[name="findings"]', 'Tray belt glazed; cleaned the pulley');
    await page.getByRole('button', { name: 'Save the job sheet' }).click();
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('waiting to be sent'));
    expect(await page.locator('[data-outbox]').textContent()).toContain('One change is waiting to be sent from this device');
    expect(await knex('job_sheets').where({ id: job.value }).first('version', 'findings')).toEqual(before);

    await Promise.all([page.waitForURL(/\?job=saved$/), context.setOffline(false)]);
    const after = await knex('job_sheets').where({ id: job.value }).first('version', 'findings');
    expect(after).toEqual({ version: before.version + 1, findings: 'Tray belt glazed; cleaned the pulley' });
    expect(await page.locator('[data-outbox]').isHidden()).toBe(true);
    await context.close();
  });

  it('meets a sheet changed on another device: takes the untouched field, shows both copies of the other, saves the choice', async () => {
    const member = await makeMember(knex);
    const job = await createJobSheet(
      member.id,
      jobSheetCreateSchema.parse({ customerRef: 'Ticket SW-3', findings: 'Hum', labourMinutes: 30 }),
    );
    if (!job.ok) throw new Error(job.message);
    const context = await signedInContext(browser, base, member.email, PASSWORD, { viewport: { width: 360, height: 740 } });
    const page = await installed(context);
    await page.goto(`${base}/jobs/${job.value}`);

    await context.setOffline(true);
    await page.fill('textarea[name="findings"]', 'Hum from C40, replaced');
    await page.fill('input[name="labourMinutes"]', '45');
    await page.getByRole('button', { name: 'Save the job sheet' }).click();
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('waiting to be sent'));
    // Meanwhile, on the other device: the findings change.
    const other = await updateJobSheet(member.id, job.value, { findings: 'Hum from the mains transformer' });
    expect(other.ok).toBe(true);

    await context.setOffline(false);
    const chooser = page.locator('form.conflict');
    await chooser.waitFor();
    const rows = chooser.locator('tbody tr');
    expect(await rows.count()).toBe(1);
    expect(await rows.first().textContent()).toBe('FindingsHum from C40, replacedHum from the mains transformer');
    expect(await chooser.textContent()).toContain('Fields only you changed are sent as you typed them: Labour (minutes).');
    await page.screenshot({ path: '/tmp/pwa-conflict-360.png', fullPage: true });
    await rows.first().getByRole('radio', { name: 'Hum from the mains transformer' }).check();
    await Promise.all([page.waitForURL(/\?job=saved$/), chooser.getByRole('button', { name: 'Save my choices' }).click()]);
    expect(await knex('job_sheets').where({ id: job.value }).first('findings', 'labour_minutes')).toEqual({
      findings: 'Hum from the mains transformer',
      labour_minutes: 45,
    });
    await context.close();
  });

  it('queues an order-list change made offline behind the sheet edit, refuses a delete, and sends both in order', async () => {
    const member = await makeMember(knex);
    const job = await createJobSheet(
      member.id,
      jobSheetCreateSchema.parse({
        customerRef: 'Ticket SW-5',
        partsUsed: [{ ref: 'C7', kind: 'capacitor', value: '220 µF', rating: '25 V', quantity: 1 }],
      }),
    );
    if (!job.ok) throw new Error(job.message);
    const context = await signedInContext(browser, base, member.email, PASSWORD);
    const page = await installed(context);
    await page.goto(`${base}/jobs/${job.value}`);

    await context.setOffline(true);
    await page.fill('textarea[name="findings"]', 'C7 bulged');
    await page.getByRole('button', { name: 'Save the job sheet' }).click();
    await page.getByRole('button', { name: 'Put these parts on my order list' }).click();
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('2 changes are waiting'));
    expect(await page.locator('[data-outbox]').textContent()).toContain(
      '2 changes are waiting to be sent from this device: your changes to job sheet Ticket SW-5; “Put these parts on my order list”.',
    );
    await page.getByLabel(/Delete it and the customer data/).check();
    await page.getByRole('button', { name: 'Delete the job sheet' }).click();
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('nothing was deleted'));
    expect((await getOrderList(member.id)).lines).toEqual([]);

    await Promise.all([page.waitForURL(/\?job=saved$/), context.setOffline(false)]);
    expect(await knex('job_sheets').where({ id: job.value }).first('findings')).toEqual({ findings: 'C7 bulged' });
    const lines = (await getOrderList(member.id)).lines;
    expect(lines).toHaveLength(1);
    expect(lines[0]!.label).toContain('220 µF');
    await context.close();
  });

  it('answers a stale If-Match with 412 and the sheet as it is now, and an unreadable one with 400', async () => {
    const member = await makeMember(knex);
    const job = await createJobSheet(member.id, jobSheetCreateSchema.parse({ customerRef: 'Ticket SW-4' }));
    if (!job.ok) throw new Error(job.message);
    const cookie = await signIn(base, member.email, PASSWORD);
    const patch = (ifMatch: string, findings: string) =>
      fetch(`${base}/api/v1/job-sheets/${job.value}`, {
        method: 'PATCH',
        headers: { cookie, origin: base, 'content-type': 'application/json', 'if-match': ifMatch },
        body: JSON.stringify({ findings }),
      });
    const first = await patch('"v1"', 'first');
    expect(first.status).toBe(200);
    expect(((await first.json()) as { jobSheet: { version: number } }).jobSheet.version).toBe(2);
    const stale = await patch('"v1"', 'second');
    expect(stale.status).toBe(412);
    const body = (await stale.json()) as { error: { code: string }; current: { findings: string; version: number } };
    expect(body.error.code).toBe('precondition_failed');
    expect(body.current).toMatchObject({ findings: 'first', version: 2 });
    const unreadable = await patch('2', 'third');
    expect(unreadable.status).toBe(400);
    expect(((await unreadable.json()) as { error: { message: string } }).error.message).toContain('If-Match: "v3"');
  });
});

describe('a bench report offline', () => {
  it('waits on the device with a plain line saying so, and is saved when the connection returns', async () => {
    const member = await makeMember(knex);
    const fix = photoFixes[0]!;
    const note = `Filed offline ${Date.now()}: cleaned the mode switch, held a week`;
    const context = await signedInContext(browser, base, member.email, PASSWORD, { viewport: { width: 360, height: 740 } });
    try {
      const page = await installed(context);
      await page.goto(`${base}/fixes/${fix.slug}`);
      const form = page.locator('#bench-report-form');
      await page.waitForFunction(() => document.querySelector<HTMLElement>('#bench-report-form')?.dataset.outboxReady === 'yes');

      await context.setOffline(true);
      await form.getByLabel('Partly fixed').check();
      await form.locator('textarea[name="note"]').fill(note);
      await form.getByRole('button', { name: 'Save the bench report' }).click();
      // The line under the form (the parts table has one of its own, saying the same).
      const box = page.locator('#bench-report-form + [data-outbox]');
      await page.waitForFunction(() =>
        document.querySelector('#bench-report-form + [data-outbox]')?.textContent?.includes('waiting to be sent'),
      );
      expect(await box.textContent()).toBe(
        `One change is waiting to be sent from this device: your bench report on “${fix.title}”. You are offline: they are sent, in order, when the connection comes back.`,
      );
      await page.screenshot({ path: '/tmp/pwa-bench-report-waiting-360.png', fullPage: false });
      expect(await knex('bench_reports').where({ member_id: member.id })).toEqual([]);

      await context.setOffline(false);
      await page.waitForFunction(() =>
        document.querySelector('#bench-report-form + [data-outbox]')?.textContent?.startsWith('Sent from this device'),
      );
      expect(await box.textContent()).toBe(`Sent from this device: your bench report on “${fix.title}”.`);
      expect(await box.isVisible()).toBe(true);
      const saved = await knex('bench_reports').where({ member_id: member.id }).select('outcome', 'note');
      expect(saved).toEqual([{ outcome: 'partly', note }]);
      await page.reload();
      await expect(page.locator('.bench-note', { hasText: note }).count()).resolves.toBe(1);
    } finally {
      await context.close();
      // The demo fix's bench score goes back to what other test files expect.
      await knex('bench_reports').where({ member_id: member.id }).delete();
    }
  });

  it('queues a part added to the order list from a fix page the same way, and adds it on reconnect', async () => {
    const member = await makeMember(knex);
    const fix = photoFixes[0]!;
    const context = await signedInContext(browser, base, member.email, PASSWORD, { viewport: { width: 360, height: 740 } });
    const page = await installed(context);
    await page.goto(`${base}/fixes/${fix.slug}`);
    const add = page.getByRole('button', { name: /^Add to order list/ }).first();
    const part = ((await add.textContent()) ?? '')
      .replace(/\s+/g, ' ')
      .trim()
      .replace(/^Add to order list : /, '');
    await page.waitForFunction(() =>
      [...document.querySelectorAll<HTMLElement>('form[data-offline-queue]')].every((form) => form.dataset.outboxReady === 'yes'),
    );

    await context.setOffline(true);
    await add.click();
    const line = page.locator('[data-outbox]').first();
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('waiting to be sent'));
    expect(await line.textContent()).toBe(
      `One change is waiting to be sent from this device: adding ${part} to your order list. You are offline: they are sent, in order, when the connection comes back.`,
    );
    expect(await line.isVisible()).toBe(true);
    expect((await getOrderList(member.id)).lines).toEqual([]);

    await context.setOffline(false);
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.startsWith('Sent from this device'));
    const lines = (await getOrderList(member.id)).lines;
    expect(lines).toHaveLength(1);
    // The part's reference ("C851" of "C851 1000uF") is on the one line now on the list.
    expect(lines[0]!.refs).toEqual([part.split(' ')[0]]);
    await context.close();
  });

  it('says plainly when a waiting order-list addition is refused on reconnect, and adds nothing', async () => {
    const member = await makeMember(knex);
    const fix = photoFixes[0]!;
    const context = await signedInContext(browser, base, member.email, PASSWORD);
    const page = await installed(context);
    await page.goto(`${base}/fixes/${fix.slug}`);
    await page.waitForFunction(() =>
      [...document.querySelectorAll<HTMLElement>('form[data-offline-queue]')].every((form) => form.dataset.outboxReady === 'yes'),
    );
    // The saved page names a part row the fix no longer has (as after a new revision with fewer parts).
    await page.evaluate(() => {
      const row = document.querySelector<HTMLInputElement>('form[action="/order-list/add"] input[name="row"]');
      if (row) row.value = '999';
    });

    await context.setOffline(true);
    await page
      .getByRole('button', { name: /^Add to order list/ })
      .first()
      .click();
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('waiting to be sent'));
    await context.setOffline(false);
    await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('was refused'));
    expect(await page.locator('[data-outbox]').first().textContent()).toMatch(
      /^One change is waiting to be sent from this device: adding .+ to your order list\. Adding .+ to your order list was refused: Nothing was added; open your order list to see why\. It stays waiting/,
    );
    expect((await getOrderList(member.id)).lines).toEqual([]);
    // It no longer holds the queue: left out, nothing waits and nothing was added.
    await page.getByRole('button', { name: 'Leave it out and send the rest' }).first().click();
    await page.waitForFunction(() => [...document.querySelectorAll<HTMLElement>('[data-outbox]')].every((box) => box.hidden));
    expect(await page.evaluate(() => document.querySelector('[data-outbox]')?.textContent)).toBe('');
    expect((await getOrderList(member.id)).lines).toEqual([]);
    await context.close();
  });

  it('puts a refused bench report back in its form with the note as typed, and sends what waited behind it', async () => {
    const member = await makeMember(knex);
    const fix = photoFixes[0]!;
    const note = `Typed at the bench ${Date.now()}: the mode switch was dirty`;
    const context = await signedInContext(browser, base, member.email, PASSWORD, { viewport: { width: 360, height: 740 } });
    try {
      const page = await installed(context);
      await page.goto(`${base}/fixes/${fix.slug}`);
      await page.waitForFunction(() =>
        [...document.querySelectorAll<HTMLElement>('form[data-offline-queue]')].every((form) => form.dataset.outboxReady === 'yes'),
      );
      // The saved page names a revision the fix does not have, so the server refuses the report when it arrives.
      await page.evaluate(() => {
        const revision = document.querySelector<HTMLInputElement>('#bench-report-form input[name="revision"]');
        if (revision) revision.value = '999';
      });
      await context.setOffline(true);
      const form = page.locator('#bench-report-form');
      await form.getByLabel('Partly fixed').check();
      await form.locator('textarea[name="note"]').fill(note);
      await form.getByRole('button', { name: 'Save the bench report' }).click();
      await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('One change is waiting'));
      // A part added behind it waits behind it.
      await page
        .getByRole('button', { name: /^Add to order list/ })
        .first()
        .click();
      await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.includes('2 changes are waiting'));
      await form.locator('textarea[name="note"]').fill('');

      await context.setOffline(false);
      await page.waitForFunction(() => document.querySelector('#bench-report-form + [data-outbox]')?.textContent?.includes('was refused'));
      const box = page.locator('#bench-report-form + [data-outbox]');
      expect(await box.textContent()).toContain('It stays waiting and holds up what follows it: choose below.');
      expect((await getOrderList(member.id)).lines).toEqual([]);
      await box.screenshot({ path: '/tmp/pwa-bench-report-refused-360.png' });

      await box.getByRole('button', { name: 'Put it back in the form to change it' }).click();
      await expect(form.locator('textarea[name="note"]').inputValue()).resolves.toBe(note);
      expect(await form.getByLabel('Partly fixed').isChecked()).toBe(true);
      await page.waitForFunction(() => document.querySelector('[data-outbox]')?.textContent?.startsWith('Sent from this device'));
      expect((await getOrderList(member.id)).lines).toHaveLength(1);
      expect(await knex('bench_reports').where({ member_id: member.id })).toEqual([]);
    } finally {
      await context.close();
      await knex('bench_reports').where({ member_id: member.id }).delete();
    }
  });
});
