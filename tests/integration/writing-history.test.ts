// A fix's history and compare pages list every revision past draft to those who may see it; moderators lock and hide any fix there.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { postForm } from '../support/sign-in';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let author: Session;
let otherMember: Session;
let editor: Session;
let moderator: Session;
let machineId: number;
let slug: string;
/** Revision numbers by what happened to them. */
const r = { first: 0, returned: 0, withdrawn: 0, live: 0, waiting: 0, discarded: 0, draft: 0 };
let waitingId = 0;

type Viewer = 'anonymous' | 'otherMember' | 'editor' | 'author' | 'moderator';
const cookieOf = (viewer: Viewer): string | undefined =>
  ({ anonymous: undefined, otherMember: otherMember.cookie, editor: editor.cookie, author: author.cookie, moderator: moderator.cookie })[
    viewer
  ];
const page = (path: string, viewer: Viewer) => {
  const cookie = cookieOf(viewer);
  return fetch(`${base}${path}`, { headers: cookie ? { cookie } : {}, redirect: 'manual' });
};

/** A new revision of the live fix by the author, submitted; returns its id and number. */
async function submitEdit(overrides: Parameters<typeof completeValues>[1]): Promise<{ id: number; number: number }> {
  const draft = await call(base, '/api/v1/drafts', {
    body: { fixSlug: slug, values: completeValues(machineId, overrides) },
    cookie: author.cookie,
  });
  expect(draft.status, JSON.stringify(draft.body)).toBe(201);
  const submitted = await call(base, `/api/v1/drafts/${draft.body.revision.id}/submit`, { body: {}, cookie: author.cookie });
  expect(submitted.status, JSON.stringify(submitted.body)).toBe(200);
  return { id: draft.body.revision.id, number: draft.body.revision.number };
}

beforeAll(async () => {
  author = await session(knex, base, 'member', 'history-author');
  otherMember = await session(knex, base, 'member', 'history-other');
  editor = await session(knex, base, 'editor', 'history-editor');
  moderator = await session(knex, base, 'moderator', 'history-mod');
  machineId = await someMachineId(knex, 7);
  ({ slug } = await publishFix(base, author, moderator, completeValues(machineId)));
  r.first = 1;

  const returned = await submitEdit({ editSummary: 'Adds a second capacitor' });
  const back = await call(base, `/api/v1/proofing/${returned.id}/return`, {
    body: { note: 'Say which voltage rating the second capacitor needs.' },
    cookie: moderator.cookie,
  });
  expect(back.status).toBe(200);
  r.returned = returned.number;

  const withdrawn = await submitEdit({ editSummary: 'Second try, taken back' });
  expect((await call(base, `/api/v1/revisions/${withdrawn.id}/withdraw`, { body: {}, cookie: author.cookie })).status).toBe(200);
  r.withdrawn = withdrawn.number;

  const proofed = await submitEdit({ editSummary: 'Names the rating of C512' });
  const live = await call(base, `/api/v1/proofing/${proofed.id}/proof`, {
    body: { note: 'Clear and complete, thank you.' },
    cookie: moderator.cookie,
  });
  expect(live.status).toBe(200);
  r.live = proofed.number;

  const waiting = await submitEdit({
    parts: [
      { ref: 'C512', kind: 'capacitor', value: '470uF', rating: '25V 105C', quantity: 1, notes: '' },
      { ref: 'C513', kind: 'capacitor', value: '100uF', rating: '16V 105C', quantity: 1, notes: '' },
    ],
    editSummary: 'Higher rating for C512, and C513 too',
  });
  r.waiting = waiting.number;
  waitingId = waiting.id;

  // A draft thrown away before it was ever submitted is kept as "withdrawn"; it stays as private as any draft.
  const discarded = await call(base, '/api/v1/drafts', {
    body: { fixSlug: slug, values: completeValues(machineId) },
    cookie: author.cookie,
  });
  expect(
    (await call(base, `/api/v1/drafts/${discarded.body.revision.id}`, { method: 'DELETE', cookie: author.cookie })).status,
  ).toBeLessThan(300);
  r.discarded = discarded.body.revision.number;
  const draft = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: completeValues(machineId) }, cookie: author.cookie });
  expect(draft.status).toBe(201);
  r.draft = draft.body.revision.number;
});
afterAll(() => knex.destroy());

/** The revision numbers a history page lists, with their states. */
function listed(html: string): Record<number, string> {
  return Object.fromEntries([...html.matchAll(/data-revision="(\d+)" data-state="([a-z]+)"/g)].map((m) => [Number(m[1]), m[2]!]));
}

describe('the history page', () => {
  it('shows the public only proofed revisions, with proofer and note, and no script', async () => {
    for (const viewer of ['anonymous', 'otherMember', 'editor'] as const) {
      const response = await page(`/fixes/${slug}/history`, viewer);
      expect(response.status, viewer).toBe(200);
      const html = await response.text();
      expect(listed(html), viewer).toEqual({ [r.live]: 'proofed', [r.first]: 'proofed' });
      expect(html).toContain(`by ${moderator.name}, written by ${author.name}`);
      expect(html).toContain('Clear and complete, thank you.');
      expect(html).not.toContain('Say which voltage rating');
      expect(scriptsBesideRegistration(html)).toEqual([]);
    }
  });

  it('shows the author their own submitted, returned and withdrawn revisions, never a draft', async () => {
    const html = await (await page(`/fixes/${slug}/history`, 'author')).text();
    expect(listed(html)).toEqual({
      [r.waiting]: 'submitted',
      [r.live]: 'proofed',
      [r.withdrawn]: 'withdrawn',
      [r.returned]: 'returned',
      [r.first]: 'proofed',
    });
    expect(html).toMatch(new RegExp(`returned \\d{4}-\\d\\d-\\d\\d by ${moderator.name}, written by ${author.name}`));
    expect(html).toContain('Say which voltage rating the second capacitor needs.');
    expect(html).toContain('Withdrawn by its author.');
    expect(html).toContain('not yet proofed');
    // A revision without a permalink is read against the live one.
    expect(html).toMatch(new RegExp(`href="/fixes/${slug}/compare\\?a=${r.live}&(amp|#38);b=${r.waiting}"`));
    expect(html).not.toContain(`/fixes/${slug}/r/${r.waiting}"`);
    expect(html).not.toContain('data-moderation');
    expect(scriptsBesideRegistration(html)).toEqual([]);
  });

  it('shows a moderator every revision past draft, a link to the desk for the waiting one, and the moderation panel', async () => {
    const response = await page(`/fixes/${slug}/history`, 'moderator');
    expect(response.headers.get('cache-control')).toBe('private, no-store');
    const html = await response.text();
    expect(
      Object.keys(listed(html))
        .map(Number)
        .sort((x, y) => x - y),
    ).toEqual([r.first, r.returned, r.withdrawn, r.live, r.waiting].sort((x, y) => x - y));
    expect(html).not.toContain(`data-revision="${r.discarded}"`);
    expect(html).not.toContain(`data-revision="${r.draft}"`);
    expect(html).toContain(`href="/proofing/${waitingId}"`);
    expect(html).toContain('data-moderation');
    expect(scriptsBesideRegistration(html)).toEqual([]);
  });
});

describe('the compare page', () => {
  const compare = (a: number, b: number, viewer: Viewer) => page(`/fixes/${slug}/compare?a=${a}&b=${b}`, viewer);

  it('compares two proofed revisions for anyone', async () => {
    for (const viewer of ['anonymous', 'otherMember', 'author', 'moderator'] as const)
      expect((await compare(r.first, r.live, viewer)).status, viewer).toBe(200);
  });

  it('answers 404 for a revision that is not proofed to anyone but its author and moderators', async () => {
    const answers: Record<Viewer, number> = { anonymous: 404, otherMember: 404, editor: 404, author: 200, moderator: 200 };
    for (const [viewer, status] of Object.entries(answers) as [Viewer, number][]) {
      for (const other of [r.waiting, r.returned, r.withdrawn]) {
        const response = await compare(r.live, other, viewer);
        expect(response.status, `${viewer} r${r.live}…r${other}`).toBe(status);
        const html = await response.text();
        if (status === 404) expect(html).not.toContain('Higher rating for C512');
      }
    }
  });

  it('answers 404 for a draft, even to its author and to moderators', async () => {
    for (const viewer of ['author', 'moderator'] as const) {
      expect((await compare(r.live, r.draft, viewer)).status, viewer).toBe(404);
      expect((await compare(r.live, r.discarded, viewer)).status, viewer).toBe(404);
    }
  });

  it('shows a waiting revision against the live one: parts cell by cell, the remedy as text, the source behind a toggle', async () => {
    const response = await compare(r.live, r.waiting, 'author');
    const html = await response.text();
    expect(html).toMatch(/data-changed-sections="[^"]*Parts/);
    expect(html).toMatch(/data-row-status="changed"[\s\S]*?\[was: <\/span>16V 105C[\s\S]*?\[now: <\/span>25V 105C/);
    expect(html).toContain('data-row-status="added"');
    expect(html).toContain('Replace C512 with a 105 °C part.');
    expect(html).toMatch(/<details[\s\S]*Source \(JSON\)[\s\S]*&quot;editSummary&quot;: &quot;Higher rating for C512, and C513 too&quot;/);
    expect(html).toContain(`r${r.waiting} (waiting)`);
    // Only the proofed one has a permalink to offer.
    expect(html).toContain(`href="/fixes/${slug}/r/${r.live}"`);
    expect(html).not.toContain(`href="/fixes/${slug}/r/${r.waiting}"`);
    expect(scriptsBesideRegistration(html)).toEqual([]);
  });

  it('offers in its lists only the revisions the reader may see', async () => {
    const options = (html: string) => [...html.matchAll(/<option value="(\d+)"/g)].map((m) => Number(m[1]));
    const anonymous = options(await (await compare(r.first, r.live, 'anonymous')).text());
    expect(new Set(anonymous)).toEqual(new Set([r.first, r.live]));
    const own = options(await (await compare(r.first, r.live, 'author')).text());
    expect(new Set(own)).toEqual(new Set([r.first, r.returned, r.withdrawn, r.live, r.waiting]));
  });

  it('keeps proofed permalinks working and gives none to other revisions', async () => {
    expect((await page(`/fixes/${slug}/r/${r.first}`, 'anonymous')).status).toBe(200);
    expect((await page(`/fixes/${slug}/r/${r.live}`, 'anonymous')).status).toBe(200);
    for (const viewer of ['anonymous', 'author', 'moderator'] as const)
      expect((await page(`/fixes/${slug}/r/${r.waiting}`, viewer)).status, viewer).toBe(404);
  });
});

describe('locking and hiding a fix without a report', () => {
  const flagRows = async () =>
    knex('audit_log')
      .where({ subject_type: 'fix', subject_id: String((await knex('fixes').where({ slug }).first('id')).id) })
      .orderBy('id')
      .select('action', 'actor_id', 'detail');

  it('has no open report to start from', async () => {
    const fix = await knex('fixes').where({ slug }).first('id', 'locked_at', 'hidden_at');
    expect(await knex('reports').where({ fix_id: fix.id, state: 'open' }).first()).toBeUndefined();
    expect(fix.locked_at).toBeNull();
    expect(fix.hidden_at).toBeNull();
  });

  it('gives only moderators the panel, and refuses the endpoint to others', async () => {
    for (const viewer of ['anonymous', 'otherMember', 'editor', 'author'] as const)
      expect(await (await page(`/fixes/${slug}/history`, viewer)).text(), viewer).not.toContain('data-moderation');
    const html = await (await page(`/fixes/${slug}/history`, 'moderator')).text();
    expect(html).toMatch(/<form method="post" action="\/fixes\/[^"]+\/history\?_action=fixFlag"[\s\S]*name="action" value="lock"/);
    expect(html).toMatch(/name="action" value="hide"/);
    expect(html).toContain('name="from" value="history"');

    expect((await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'lock', from: 'history' })).status).toBe(401);
    for (const cookie of [author.cookie, editor.cookie])
      expect((await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'lock', from: 'history' }, { cookie })).status).toBe(403);
    expect((await knex('fixes').where({ slug }).first('locked_at')).locked_at).toBeNull();
  });

  it('locks and unlocks from the history page, back to it, each step in the audit log', async () => {
    const lock = await postForm(
      base,
      `/api/v1/proofing/fixes/${slug}`,
      { action: 'lock', note: 'Edit war', from: 'history' },
      { cookie: moderator.cookie },
    );
    expect(lock.status).toBe(303);
    expect(lock.headers.get('location')).toBe(`/fixes/${slug}/history?fix=lock#moderation`);
    expect((await knex('fixes').where({ slug }).first('locked_at')).locked_at).not.toBeNull();
    const locked = await (await page(`/fixes/${slug}/history?fix=lock`, 'moderator')).text();
    expect(locked).toContain('Locked: only moderators may write new revisions');
    expect(locked).toMatch(/name="action" value="unlock"/);
    // Members may no longer start an edit of it.
    const draft = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(machineId) },
      cookie: otherMember.cookie,
    });
    expect(draft.status).toBe(403);

    // Locking twice is a conflict, told on the same page by a fixed sentence for its code (no text in the address).
    const again = await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'lock', from: 'history' }, { cookie: moderator.cookie });
    expect(again.headers.get('location')).toMatch(new RegExp(`^/fixes/${slug}/history\\?error=conflict#moderation$`));
    const told = await (await fetch(`${base}${again.headers.get('location')}`, { headers: { Cookie: moderator.cookie } })).text();
    expect(told).toContain('It was changed meanwhile, so nothing was changed now.');

    const unlock = await postForm(
      base,
      `/api/v1/proofing/fixes/${slug}`,
      { action: 'unlock', from: 'history' },
      { cookie: moderator.cookie },
    );
    expect(unlock.headers.get('location')).toBe(`/fixes/${slug}/history?fix=unlock#moderation`);
    expect((await knex('fixes').where({ slug }).first('locked_at')).locked_at).toBeNull();

    const rows = await flagRows();
    expect(rows.map((row) => row.action)).toEqual(['fix.lock', 'fix.unlock']);
    expect(rows.every((row) => row.actor_id === moderator.id)).toBe(true);
    expect(rows[0].detail).toEqual({ note: 'Edit war' });
  });

  it('hides the fix from readers while its history stays open to moderators, then shows it again', async () => {
    const hide = await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'hide', from: 'history' }, { cookie: moderator.cookie });
    expect(hide.headers.get('location')).toBe(`/fixes/${slug}/history?fix=hide#moderation`);
    for (const path of [`/fixes/${slug}`, `/fixes/${slug}/history`, `/fixes/${slug}/compare?a=${r.first}&b=${r.live}`])
      expect((await page(path, 'anonymous')).status, path).toBe(404);
    expect((await page(`/fixes/${slug}/history`, 'author')).status).toBe(404);
    const hidden = await page(`/fixes/${slug}/history`, 'moderator');
    expect(hidden.status).toBe(200);
    const html = await hidden.text();
    expect(html).toContain('data-fix-hidden');
    expect(html).toMatch(/name="action" value="unhide"/);

    const unhide = await postForm(
      base,
      `/api/v1/proofing/fixes/${slug}`,
      { action: 'unhide', from: 'history' },
      { cookie: moderator.cookie },
    );
    expect(unhide.headers.get('location')).toBe(`/fixes/${slug}/history?fix=unhide#moderation`);
    expect((await page(`/fixes/${slug}`, 'anonymous')).status).toBe(200);
    expect((await flagRows()).map((row) => row.action)).toEqual(['fix.lock', 'fix.unlock', 'fix.hide', 'fix.unhide']);
  });

  it('still sends the desk’s own forms back to the desk', async () => {
    const lock = await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'lock' }, { cookie: moderator.cookie });
    expect(lock.headers.get('location')).toBe('/proofing?fix=lock#fixes');
    const unlock = await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'unlock' }, { cookie: moderator.cookie });
    expect(unlock.headers.get('location')).toBe('/proofing?fix=unlock#fixes');
  });
});
