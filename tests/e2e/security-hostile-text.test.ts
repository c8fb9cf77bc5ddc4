// Hostile text, rendered: 200 payloads through every text field a member, editor or moderator fills, then every page
// that shows them opened in Chromium: no dialog, no injected element, and each accepted text shown exactly as typed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext } from 'playwright-core';
import { launchBrowser, signedInContext } from '../support/browser';
import { E2E_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, postForm, signIn, type TestUser } from '../support/sign-in';
import { call, completeValues, someMachineId } from '../fixtures/writing';
import { phoneJpeg } from '../fixtures/photo-files';
import { hostilePayloads, hostileUrls, INJECTED, malformedBodyNodes, tagged } from '../fixtures/hostile-text';
import { describeOverflow, horizontalOverflow } from '../support/overflow';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let browser: Browser;

// eslint-disable-next-line no-control-regex -- single-line fields refuse control characters by design
const oneLine = (p: string) => !/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/.test(p);
const all = hostilePayloads.map((_, i) => i);
const singleLine = all.filter((i) => oneLine(hostilePayloads[i]!));

/** Tagged payloads joined until `limit` characters, starting at `from` in `pool` (wrapping round). */
function pack(pool: number[], from: number, limit: number, separator = '\n'): { text: string; used: number[] } {
  const used: number[] = [];
  let text = '';
  for (let k = 0; k < pool.length; k++) {
    const i = pool[(from + k) % pool.length]!;
    const next = text === '' ? tagged(i) : `${text}${separator}${tagged(i)}`;
    if (next.length > limit) break;
    text = next;
    used.push(i);
  }
  return { text, used };
}

/** One payload that fits `limit` characters once tagged, the n-th such in `pool`. */
function single(pool: number[], n: number, limit: number): { text: string; used: number[] } {
  const fits = pool.filter((i) => tagged(i).length <= limit);
  const i = fits[n % fits.length]!;
  return { text: tagged(i), used: [i] };
}

interface Expectation {
  /** Where the text went in, for failure messages. */
  field: string;
  used: number[];
}

const expected = new Map<string, Expectation[]>();
function expectOn(pages: string[], field: string, used: number[]) {
  for (const page of pages) expected.set(page, [...(expected.get(page) ?? []), { field, used }]);
}

let author: TestUser, moderator: TestUser, editor: TestUser, reporter: TestUser;
let authorCookie: string, moderatorCookie: string, editorCookie: string, reporterCookie: string;
let slug = '';
let revisionId = 0;
let jobId = 0;
let noteCode = '';
let title0: number[] = [];
let cause0: number[] = [];
const refusals: string[] = [];

async function setName(cookie: string, who: string, n: number, withShop: boolean): Promise<number[]> {
  const name = single(singleLine, n, 80);
  const shop = single(singleLine, n + 1, 120);
  const answer = await call(base, '/api/v1/account', {
    method: 'PATCH',
    cookie,
    body: withShop ? { name: name.text, shopName: shop.text } : { name: name.text },
  });
  if (answer.status !== 200) throw new Error(`${who}'s name: ${answer.status} ${JSON.stringify(answer.body)}`);
  return withShop ? [...name.used, ...shop.used] : name.used;
}

beforeAll(async () => {
  browser = await launchBrowser();
  [author, moderator, editor, reporter] = await Promise.all([
    createUser(knex, { tag: 'hostile-author' }),
    createUser(knex, { role: 'moderator', tag: 'hostile-mod' }),
    createUser(knex, { role: 'editor', tag: 'hostile-editor' }),
    createUser(knex, { tag: 'hostile-reporter' }),
  ]);
  const signIns = (users: TestUser[]) => Promise.all(users.map((u) => signIn(base, u.email, u.password)));
  [authorCookie, moderatorCookie, editorCookie, reporterCookie] = (await signIns([author, moderator, editor, reporter])) as [
    string,
    string,
    string,
    string,
  ];

  // Names and shop names.
  const authorName = await setName(authorCookie, 'author', 3, true);
  const moderatorName = await setName(moderatorCookie, 'moderator', 7, false);
  const reporterName = await setName(reporterCookie, 'reporter', 11, false);

  // A photo with hostile alt text and caption.
  const alt = single(singleLine, 20, 300);
  const caption = pack(all, 40, 500);
  const form = new FormData();
  form.append('alt', alt.text);
  form.append('caption', caption.text);
  form.append('file', new Blob([new Uint8Array(await phoneJpeg())]), 'hostile.jpg');
  const photoAnswer = await fetch(`${base}/api/v1/photos`, { method: 'POST', headers: { cookie: authorCookie, origin: base }, body: form });
  const photo = (await photoAnswer.json()).photo;
  if (photoAnswer.status !== 202) throw new Error(`photo: ${photoAnswer.status}`);
  for (let i = 0; i < 120; i++) {
    const state = (await call(base, `/api/v1/photos/${photo.id}`, { cookie: authorCookie })).body.photo.state;
    if (state !== 'pending') break;
    await new Promise((r) => setTimeout(r, 250));
  }

  // The fix: every field holds payloads, the body holds all of them plus hostile links, images and unknown nodes.
  const machineId = await someMachineId(knex, 3);
  const title = single(singleLine, 0, 160);
  const symptoms = Array.from({ length: 20 }, (_, k) => single(singleLine, 30 + k, 200));
  const errorCodes = Array.from({ length: 20 }, (_, k) => single(singleLine, 60 + k, 40));
  const cause = pack(all, 80, 2000);
  const parts = Array.from({ length: 40 }, (_, k) => ({ notes: single(all, 100 + k, 500), ref: single(singleLine, 140 + k, 40) }));
  const readings = Array.from({ length: 30 }, (_, k) => ({ note: single(all, 5 * k, 300), testPoint: single(singleLine, 5 * k + 1, 120) }));
  const caution = pack(all, 150, 600);
  const editSummary = pack(singleLine, 170, 300, ' ');
  const linkText = hostileUrls.map((_, k) => single(singleLine, 180 + k, 200));
  const body = {
    type: 'doc',
    content: [
      ...all.map((i) => ({ type: 'paragraph', content: [{ type: 'text', text: tagged(i) }] })),
      ...hostileUrls.map((href, k) => ({
        type: 'paragraph',
        content: [{ type: 'text', text: linkText[k]!.text, marks: [{ type: 'link', attrs: { href } }] }],
      })),
      ...hostileUrls.map((src, k) => ({ type: 'image', attrs: { src, alt: `hostile image ${k}` } })),
      ...malformedBodyNodes(),
    ],
  };
  const values = completeValues(machineId, {
    title: title.text,
    symptoms: symptoms.map((s) => s.text),
    errorCodes: errorCodes.map((s) => s.text),
    cause: cause.text,
    body,
    parts: parts.map((p, k) => ({
      ref: p.ref.text,
      kind: 'capacitor',
      value: `${k + 1}uF`,
      rating: '16V',
      quantity: 1,
      notes: p.notes.text,
    })),
    readings: readings.map((r) => ({ testPoint: r.testPoint.text, expected: '5.0 V', measured: '3.1 V', note: r.note.text })),
    cautions: [{ kind: 'mains', detail: caution.text }],
    editSummary: editSummary.text,
    photoIds: [photo.id],
  });
  title0 = title.used;
  cause0 = cause.used;
  const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: authorCookie });
  if (created.status !== 201) throw new Error(`draft: ${created.status} ${JSON.stringify(created.body).slice(0, 2000)}`);
  revisionId = created.body.revision.id;
  const submitted = await call(base, `/api/v1/drafts/${revisionId}/submit`, { body: {}, cookie: authorCookie });
  if (submitted.status !== 200) throw new Error(`submit: ${submitted.status} ${JSON.stringify(submitted.body).slice(0, 2000)}`);

  const fixFields: [string, number[]][] = [
    ['title', title.used],
    ['symptoms', symptoms.flatMap((s) => s.used)],
    ['error codes', errorCodes.flatMap((s) => s.used)],
    ['cause', cause.used],
    ['body', all],
    ['link text', linkText.flatMap((l) => l.used)],
    ['part notes', parts.flatMap((p) => p.notes.used)],
    ['part refs', parts.flatMap((p) => p.ref.used)],
    ['reading notes', readings.flatMap((r) => r.note.used)],
    ['test points', readings.flatMap((r) => r.testPoint.used)],
    ['caution', caution.used],
  ];
  for (const [field, used] of fixFields) expectOn(['proofing page', 'fix page', 'revision page'], field, used);
  expectOn(['proofing page'], 'edit summary', editSummary.used);
  expectOn(['proofing page', 'fix page'], 'author name', authorName.slice(0, 1));
  expectOn(['fix page', 'proofing page'], 'photo alt text', alt.used);
  expectOn(['fix page', 'proofing page'], 'photo caption', caption.used);
  expectOn(['proofing desk', 'write/mine', 'history page'], 'title', title.used);
  expectOn(['proofing desk'], 'author name', authorName.slice(0, 1));
  expectOn(['members page'], 'names', [authorName[0]!, moderatorName[0]!, reporterName[0]!]);
  expectOn(['account page'], 'name and shop name', authorName);
});

afterAll(async () => {
  await browser?.close();
  // The hostile fix holds words with no break in them; later tests of the same server (the 360 px overflow check of
  // listing pages) must not meet it, so it is taken down once this file is done.
  // Taken down as the app does it: the fix and its search row together (other files check the two agree).
  if (slug) {
    const ids = await knex('fixes').where({ slug }).update({ deleted_at: new Date() }).returning('id');
    await knex('fix_search')
      .whereIn(
        'fix_id',
        ids.map((r: { id: number }) => r.id),
      )
      .delete();
  }
  await knex.destroy();
});

interface PageReport {
  dialogs: string[];
  injected: string[];
  missing: string[];
  /** At 360 px, the page scrolls sideways: a typed word with no break in it widened it (null when it did not). */
  overflow: string | null;
}

/** Opens a page, counts dialogs, looks for anything injected, and checks every expected payload is there as typed. */
async function inspect(context: BrowserContext, path: string, label: string, waitFor?: string): Promise<PageReport> {
  const page = await context.newPage();
  const dialogs: string[] = [];
  page.on('dialog', (dialog) => {
    dialogs.push(dialog.message());
    void dialog.dismiss();
  });
  const response = await page.goto(`${base}${path}`, { waitUntil: 'load' });
  expect(response?.status(), `${label} (${path})`).toBe(200);
  if (waitFor) await page.waitForSelector(waitFor, { timeout: 20_000 });
  await page.waitForTimeout(waitFor ? 1_000 : 300);
  const found = await page.evaluate((marker) => {
    const texts = [document.body.textContent ?? ''];
    for (const el of document.querySelectorAll('[alt], [title], [aria-label], input, textarea')) {
      texts.push(el.getAttribute('alt') ?? '', el.getAttribute('title') ?? '', el.getAttribute('aria-label') ?? '');
      if (el instanceof HTMLInputElement || el instanceof HTMLTextAreaElement) texts.push(el.value);
    }
    const injected: string[] = [];
    const describe = (el: Element) => el.outerHTML.slice(0, 160);
    for (const el of document.querySelectorAll(
      `.${marker}, [data-${marker}], iframe, object, embed, base, meta[http-equiv], marquee, isindex, keygen`,
    ))
      injected.push(describe(el));
    for (const el of document.querySelectorAll('*'))
      if ([...el.attributes].some((a) => a.name.toLowerCase().startsWith('on'))) injected.push(describe(el));
    for (const el of document.querySelectorAll('[href], [src], [action], [formaction], [srcdoc]'))
      for (const name of ['href', 'src', 'action', 'formaction', 'srcdoc'])
        if (/^\s*(javascript|vbscript|data):/i.test(el.getAttribute(name) ?? '') || (name === 'srcdoc' && el.hasAttribute(name)))
          injected.push(describe(el));
    // A JSON-LD data block never runs; its typed text is escaped JSON (checked to parse, so nothing broke out of it).
    const isDataBlock = (script: HTMLScriptElement): boolean => {
      if (script.type !== 'application/ld+json') return false;
      try {
        JSON.parse(script.textContent ?? '');
        return true;
      } catch {
        return false;
      }
    };
    for (const script of document.querySelectorAll('script'))
      if (isDataBlock(script)) continue;
      else if (/alert\(|document\.cookie/.test(script.textContent ?? '') || (script.src && !script.src.startsWith(location.origin)))
        injected.push(describe(script));
    for (const el of document.querySelectorAll('[style]'))
      if (/expression\(|javascript:|behavior:/i.test(el.getAttribute('style') ?? '')) injected.push(describe(el));
    return { text: texts.join('\n'), injected };
  }, INJECTED);
  const missing: string[] = [];
  for (const { field, used } of expected.get(label) ?? [])
    for (const i of used) if (!found.text.includes(tagged(i))) missing.push(`${field}: payload ${i} ${JSON.stringify(hostilePayloads[i])}`);
  // The same page on a phone: hostile words with no break in them (a long encoded address) wrap, not widen it.
  await page.setViewportSize({ width: 360, height: 740 });
  await page.waitForTimeout(150);
  const overflow = await horizontalOverflow(page);
  await page.close();
  return { dialogs, injected: found.injected, missing, overflow: overflow ? describeOverflow(path, overflow) : null };
}

describe('hostile text, rendered in Chromium', () => {
  const reports: Record<string, PageReport> = {};
  let anonymous: BrowserContext, authorContext: BrowserContext, moderatorContext: BrowserContext, editorContext: BrowserContext;

  beforeAll(async () => {
    anonymous = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    authorContext = await signedInContext(browser, base, author.email, author.password);
    moderatorContext = await signedInContext(browser, base, moderator.email, moderator.password);
    editorContext = await signedInContext(browser, base, editor.email, editor.password);
  });

  it(`uses at least 150 payloads (${hostilePayloads.length})`, () => {
    expect(hostilePayloads.length).toBeGreaterThanOrEqual(150);
  });

  it('shows a submitted revision on the proofing desk and its page, then proofed on the fix, revision and history pages', async () => {
    reports['proofing desk'] = await inspect(moderatorContext, '/proofing', 'proofing desk');
    reports['proofing page'] = await inspect(moderatorContext, `/proofing/${revisionId}`, 'proofing page');
    reports['write/mine'] = await inspect(authorContext, '/write/mine', 'write/mine');
    const proofed = await call(base, `/api/v1/proofing/${revisionId}/proof`, { body: {}, cookie: moderatorCookie });
    expect(proofed.status, JSON.stringify(proofed.body)).toBe(200);
    slug = proofed.body.slug;

    // Bench report notes and a report's detail, on the live fix.
    const machine = await knex('machines')
      .where({ id: await someMachineId(knex, 3) })
      .first('slug');
    for (const [k, from] of [0, 100].entries()) {
      const note = pack(all, from, 12_000);
      const answer = await call(base, '/api/v1/bench-reports', {
        body: { fix: slug, machine: machine.slug, outcome: k === 0 ? 'fixed' : 'partly', note: note.text },
        cookie: reporterCookie,
      });
      expect(answer.status, JSON.stringify(answer.body)).toBeLessThan(300);
      expectOn(['fix page'], `bench report note ${k + 1}`, note.used);
    }
    const detail = pack(all, 60, 2000);
    const report = await call(base, `/api/v1/fixes/${slug}/reports`, {
      body: { reason: 'wrong', detail: detail.text },
      cookie: reporterCookie,
    });
    expect(report.status, JSON.stringify(report.body)).toBeLessThan(300);
    expectOn(['proofing desk after report'], 'report detail', detail.used);

    reports['fix page'] = await inspect(anonymous, `/fixes/${slug}`, 'fix page');
    reports['revision page'] = await inspect(anonymous, `/fixes/${slug}/r/1`, 'revision page');
    reports['history page'] = await inspect(anonymous, `/fixes/${slug}/history`, 'history page');
    reports['proofing desk after report'] = await inspect(moderatorContext, '/proofing', 'proofing desk after report');
    reports['members page'] = await inspect(moderatorContext, '/admin/users', 'members page');
    reports['account page'] = await inspect(authorContext, '/account', 'account page');
    reports['search'] = await inspect(anonymous, `/search?q=${encodeURIComponent(hostilePayloads[0]!)}`, 'search');
    // The editor island loads the live revision into its fields and the rich-text editor.
    for (const [field, used] of [
      ['title', title0],
      ['cause', cause0],
      ['body', all],
    ] as const)
      expectOn(['editor'], field, [...used]);
    reports['editor'] = await inspect(authorContext, `/fixes/${slug}/edit`, 'editor', '.ProseMirror');
  });

  it('shows job sheets and hand-over notes to their owner and the note to the customer', async () => {
    const job = {
      customerRef: single(singleLine, 5, 120),
      serialNumber: single(singleLine, 9, 80),
      reportedSymptom: pack(all, 20, 2000),
      findings: pack(all, 90, 4000),
      outcome: pack(all, 160, 2000),
    };
    const created = await call(base, '/api/v1/job-sheets', {
      body: Object.fromEntries(Object.entries(job).map(([k, v]) => [k, v.text])),
      cookie: authorCookie,
    });
    expect(created.status, JSON.stringify(created.body).slice(0, 500)).toBe(201);
    jobId = created.body.jobSheet?.id ?? created.body.id;
    for (const [field, v] of Object.entries(job)) expectOn(['job sheet'], field, v.used);
    expectOn(['job list'], 'customer reference', job.customerRef.used);

    const message = pack(all, 130, 2000);
    const shopName = single(singleLine, 13, 120);
    const warranty = pack(singleLine, 17, 300, ' ');
    const partsReplaced = Array.from({ length: 30 }, (_, k) => single(singleLine, 110 + k, 200));
    const note = await call(base, '/api/v1/handover-notes', {
      body: {
        fix: slug,
        shopName: shopName.text,
        message: message.text,
        warranty: warranty.text,
        partsReplaced: partsReplaced.map((p) => p.text),
      },
      cookie: authorCookie,
    });
    expect(note.status, JSON.stringify(note.body).slice(0, 500)).toBe(201);
    noteCode = note.body.note?.code ?? note.body.code;
    // The owner's page shows the code, the link and the QR code; the customer's page shows what was written.
    for (const page of ['customer note']) {
      expectOn([page], 'message', message.used);
      expectOn([page], 'shop name', shopName.used);
      expectOn([page], 'warranty', warranty.used);
      expectOn(
        [page],
        'parts replaced',
        partsReplaced.flatMap((p) => p.used),
      );
    }

    reports['job sheet'] = await inspect(authorContext, `/jobs/${jobId}`, 'job sheet');
    reports['job list'] = await inspect(authorContext, '/jobs', 'job list');
    reports['own note'] = await inspect(authorContext, `/notes/${noteCode}`, 'own note');
    reports['note list'] = await inspect(authorContext, '/notes', 'note list');
    reports['customer note'] = await inspect(anonymous, `/n/${noteCode}`, 'customer note');
  });

  it('shows word families an editor typed', async () => {
    // Terms are split at commas, semicolons and new lines by design: payloads without those go in as terms.
    const termPool = singleLine.filter((i) => !/[,;]|\s{2}/.test(hostilePayloads[i]!) && tagged(i).length <= 60);
    for (let f = 0; f < 3; f++) {
      const name = single(termPool, 40 * f + 1, 60);
      const terms = Array.from({ length: 20 }, (_, k) => single(termPool, 40 * f + 2 + k, 60));
      const answer = await postForm(
        base,
        '/admin/word-families?_action=wordFamily',
        { intent: 'create', name: name.text, terms: terms.map((t) => t.text).join('\n') },
        { cookie: editorCookie },
      );
      if (answer.status !== 303) refusals.push(`word family ${f}: ${answer.status} ${(await answer.text()).slice(0, 300)}`);
      expectOn(['word families'], `family ${f} name`, name.used);
      expectOn(
        ['word families'],
        `family ${f} terms`,
        terms.flatMap((t) => t.used),
      );
    }
    expect(refusals).toEqual([]);
    reports['word families'] = await inspect(editorContext, '/admin/word-families', 'word families');
  });

  it('ran no script, injected no element, showed every accepted text exactly as typed and kept every page phone-wide', () => {
    const problems = Object.entries(reports).flatMap(([page, r]) => [
      ...r.dialogs.map((d) => `${page}: a dialog opened: ${d}`),
      ...r.injected.map((e) => `${page}: injected ${e}`),
      ...r.missing.map((m) => `${page}: not shown as typed: ${m}`),
      ...(r.overflow ? [`${page}: ${r.overflow}`] : []),
    ]);
    const checked = [...expected.values()].flat().reduce((n, e) => n + e.used.length, 0);
    console.info(
      `hostile text: ${hostilePayloads.length} payloads, ${Object.keys(reports).length} pages, ${checked} payload placements checked`,
    );
    expect(problems.slice(0, 150), problems.slice(0, 150).join('\n')).toEqual([]);
  });
});
