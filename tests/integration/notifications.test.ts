// Following and being told, through the built server: follow forms, each kind of news, each delivery choice,
// the weekly digest, one-click unsubscribe (RFC 8058) and privacy.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { countAfterPause, mailsTo, waitForMail } from '../support/mail';
import { call, completeValues, publishFix, session, type Session } from '../fixtures/writing';
import { fanOutProofed } from '@/server/notifications/news';
import { sendWeeklyDigests } from '@/server/notifications/digest';
import { createHandoverNote } from '@/server/bench-work/handover-notes';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';
import { weekStart } from '@/lib/notifications/kinds';
import type { OutgoingMail } from '@/server/mail/send';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let author: Session;
let moderator: Session;
let follower: Session;
let quiet: Session;
let machine: { id: number; slug: string };

/** A form post as the browser sends it from our own pages. */
async function form(path: string, fields: Record<string, string>, cookie: string, origin: string | null = base): Promise<Response> {
  const headers: Record<string, string> = { 'content-type': 'application/x-www-form-urlencoded', cookie, accept: 'text/html' };
  if (origin) headers.origin = origin;
  return fetch(`${base}${path}`, { method: 'POST', headers, body: new URLSearchParams(fields), redirect: 'manual' });
}

async function follow(who: Session, kind: string, slug: string, yes = true): Promise<Response> {
  return form(
    '/following?_action=follow',
    { kind, slug, follow: yes ? 'yes' : 'no', back: `/${kind === 'machine' ? 'machines' : kind}/${slug}` },
    who.cookie,
  );
}

async function eventsOf(
  userId: number,
  kind?: string,
): Promise<{ kind: string; title: string; line: string; path: string; cause_key: string; mailed_at: Date | null }[]> {
  const query = knex('notification_events').where({ user_id: userId }).orderBy('id');
  if (kind) query.where({ kind });
  return query.select('kind', 'title', 'line', 'path', 'cause_key', 'mailed_at');
}

async function waitForEvents(userId: number, kind: string, count = 1, timeoutMs = 15_000): Promise<Awaited<ReturnType<typeof eventsOf>>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const rows = await eventsOf(userId, kind);
    if (rows.length >= count) return rows;
    if (Date.now() > deadline) throw new Error(`No ${kind} event for user ${userId} within ${timeoutMs} ms (have ${rows.length})`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}

async function setDelivery(userId: number, kind: string, delivery: string): Promise<void> {
  await knex('notification_settings').insert({ user_id: userId, kind, delivery }).onConflict(['user_id', 'kind']).merge(['delivery']);
}

beforeAll(async () => {
  author = await session(knex, base, 'member', 'news-author');
  moderator = await session(knex, base, 'moderator', 'news-mod');
  follower = await session(knex, base, 'member', 'news-follower');
  quiet = await session(knex, base, 'member', 'news-quiet');
  machine = await knex('machines').whereNull('deleted_at').orderBy('id', 'desc').first('id', 'slug');
});
afterAll(() => knex.destroy());

describe('following', () => {
  it('follows and stops following from a plain form, back on the same page, and lists it privately', async () => {
    const answer = await follow(follower, 'machine', machine.slug);
    expect(answer.status).toBe(303);
    expect(answer.headers.get('location')).toBe(`/machines/${machine.slug}`);
    const page = await (await fetch(`${base}/machines/${machine.slug}`, { headers: { cookie: follower.cookie } })).text();
    expect(page).toMatch(/Stop following/);
    const list = await fetch(`${base}/following`, { headers: { cookie: follower.cookie } });
    expect(list.headers.get('cache-control')).toMatch(/no-store/);
    expect(await list.text()).toContain(`/machines/${machine.slug}`);
    // Nobody else sees it: another member's list is their own, and signed out there is no list.
    expect(await (await fetch(`${base}/following`, { headers: { cookie: quiet.cookie } })).text()).not.toContain(
      `/machines/${machine.slug}`,
    );
    expect((await fetch(`${base}/following`, { redirect: 'manual' })).status).toBe(302);
    // Following twice keeps one row.
    await follow(follower, 'machine', machine.slug);
    expect(await knex('follows').where({ user_id: follower.id, target_kind: 'machine', target_id: machine.id }).count({ n: '*' })).toEqual([
      { n: '1' },
    ]);
  });

  it('refuses to follow what is not there, with a sentence, and a cross-site post', async () => {
    const missing = await form(
      '/following?_action=follow',
      { kind: 'machine', slug: 'no-such-machine-here', follow: 'yes' },
      follower.cookie,
    );
    expect(missing.status).toBe(404);
    expect(await missing.text()).toContain('There is no machine at that address to follow.');
    const bad = await form('/following?_action=follow', { kind: 'spaceship', slug: 'x', follow: 'yes' }, follower.cookie);
    expect(bad.status).toBe(400);
    expect(await bad.text()).toContain('for example kind=machine');
    const forged = await form(
      '/following?_action=follow',
      { kind: 'machine', slug: machine.slug, follow: 'no' },
      follower.cookie,
      'http://elsewhere.example',
    );
    expect(forged.status).toBe(403);
    expect(await knex('follows').where({ user_id: follower.id, target_id: machine.id }).first('id')).toBeDefined();
  });

  it('offers to follow the machine a search names, from the results page', async () => {
    const path = `/search?q=tray&machine=${machine.slug}`;
    const signedIn = await (await fetch(`${base}${path}`, { headers: { cookie: quiet.cookie } })).text();
    expect(signedIn).toContain('action="/following?_action=follow"');
    expect(signedIn).toContain(`name="slug" value="${machine.slug}"`);
    const answer = await form(
      '/following?_action=follow',
      { kind: 'machine', slug: machine.slug, follow: 'yes', back: path },
      quiet.cookie,
    );
    expect(answer.status).toBe(303);
    expect(answer.headers.get('location')).toBe(path);
    expect(await (await fetch(`${base}${path}`, { headers: { cookie: quiet.cookie } })).text()).toMatch(/Stop following/);
    await form('/following?_action=follow', { kind: 'machine', slug: machine.slug, follow: 'no', back: path }, quiet.cookie);
    expect(await (await fetch(`${base}${path}`)).text()).toContain('Sign in to follow');
  });

  it('shows signed-out readers a sign-in link instead of the button, the same for everyone', async () => {
    const page = await (await fetch(`${base}/machines/${machine.slug}`)).text();
    expect(page).toContain('Sign in to follow');
    expect(page).not.toContain('?_action=follow');
  });
});

describe('news of a proofed fix', () => {
  let slug: string;
  let firstRevision: number;

  it(
    'tells a follower of the machine at once by mail (their choice), with one-click unsubscribe headers',
    { timeout: 60_000 },
    async () => {
      await setDelivery(follower.id, 'fix_proofed', 'now');
      const published = await publishFix(base, author, moderator, completeValues(machine.id));
      slug = published.slug;
      firstRevision = published.revisionId;
      const [event] = await waitForEvents(follower.id, 'fix_proofed');
      expect(event!.line).toBe('A new fix.');
      expect(event!.path).toBe(`/fixes/${slug}`);
      const mail = await waitForMail(INTEGRATION_PORT, follower.email, { subject: 'A fix goes live', timeoutMs: 30_000 });
      expect(mail.text).toContain(`/fixes/${slug}`);
      expect(mail.html).toContain(`/fixes/${slug}`);
      expect(mail.headers?.['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
      expect(mail.headers?.['list-unsubscribe']).toMatch(/^<http:\/\/[^>]+\/unsubscribe\/[^>]+>$/);
      // The author hears from the proofing desk, not from the fan-out.
      expect(await eventsOf(author.id, 'fix_proofed')).toHaveLength(0);
    },
  );

  it('says in one line what a new revision changed, and tells hand-over note writers whose note cites the old one', async () => {
    const noteWriter = await session(knex, base, 'member', 'news-notes');
    const note = await createHandoverNote({ id: noteWriter.id, shopName: 'Lowmoor Bench' }, handoverNoteInputSchema.parse({ fix: slug }));
    expect(note.ok).toBe(true);
    const live = await knex('revisions').where({ id: firstRevision }).first();
    const values = completeValues(machine.id, {
      title: live.title,
      parts: [{ ref: 'C513', kind: 'capacitor', value: '220uF', rating: '25V 105C', quantity: 2, notes: '' }],
    });
    const draft = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values }, cookie: author.cookie });
    expect(draft.status).toBe(201);
    const id = draft.body.revision.id;
    expect((await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: author.cookie })).status).toBe(200);
    expect((await call(base, `/api/v1/proofing/${id}/proof`, { body: {}, cookie: moderator.cookie })).status).toBe(200);
    const events = await waitForEvents(follower.id, 'fix_proofed', 2);
    expect(events[1]!.line).toBe('Changed: parts.');
    expect(events[1]!.title).toContain('(revision r2)');
    const [revised] = await waitForEvents(noteWriter.id, 'handover_revised');
    expect(revised!.line).toContain('decide whether to tell them');
    // Recorded once per cause: running the fan-out again adds nothing.
    const again = await fanOutProofed(id, { knex });
    expect(again.recorded).toBe(0);
  });

  it('stops the follow with a mail program’s one-click post, from another origin, without signing in', async () => {
    const mail = await waitForMail(INTEGRATION_PORT, follower.email, { subject: 'A fix goes live' });
    const url = /^<([^>]+)>$/.exec(mail.headers!['list-unsubscribe']!)![1]!;
    const path = new URL(url).pathname;
    // A link checker opening it changes nothing.
    const opened = await fetch(`${base}${path}`);
    expect(opened.status).toBe(200);
    expect(await opened.text()).toContain('Stop these e-mails');
    expect(await knex('follows').where({ user_id: follower.id, target_kind: 'machine' }).first('id')).toBeDefined();
    const oneClick = await fetch(`${base}${path}`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: 'https://mail.provider.example' },
      body: 'List-Unsubscribe=One-Click',
    });
    expect(oneClick.status).toBe(200);
    expect(await knex('follows').where({ user_id: follower.id, target_kind: 'machine' }).first('id')).toBeUndefined();
    // A tampered link is refused with a sentence and stops nothing.
    const tampered = await fetch(`${base}${path.slice(0, -3)}xyz`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: 'List-Unsubscribe=One-Click',
    });
    expect(tampered.status).toBe(404);
    expect(await tampered.text()).toContain('Copy the whole link');
  });

  it('keeps news only in the app for a member who chose that, and counts it unread in the header', async () => {
    await setDelivery(quiet.id, 'fix_proofed', 'app');
    await follow(quiet, 'machine', machine.slug);
    const { slug: second } = await publishFix(base, author, moderator, completeValues(machine.id));
    await waitForEvents(quiet.id, 'fix_proofed');
    expect(await countAfterPause(INTEGRATION_PORT, quiet.email, 800)).toBe(0);
    const page = await (await fetch(`${base}/notifications`, { headers: { cookie: quiet.cookie } })).text();
    expect(page).toContain(`/fixes/${second}`);
    expect(page).toMatch(/News\s*<span[^>]*>\s*1\s*<span class="sr-only"> unread/);
    const marked = await form('/notifications?_action=markNotificationsRead', {}, quiet.cookie);
    expect(marked.status).toBe(303);
    expect(marked.headers.get('location')).toBe('/notifications?read=1');
    expect(await knex('notification_events').where({ user_id: quiet.id }).whereNull('read_at').count({ n: '*' })).toEqual([{ n: '0' }]);
  });
});

describe('news for authors', () => {
  it('records a bench report and, at once by mail, a fault that came back', { timeout: 60_000 }, async () => {
    const { slug } = await publishFix(base, author, moderator, completeValues(machine.id));
    const reporter = await session(knex, base, 'member', 'news-reporter');
    const report = (outcome: string, extra: Record<string, unknown> = {}) =>
      call(base, '/api/v1/bench-reports', {
        body: { fix: slug, machine: machine.slug, outcome, note: '', ...extra },
        cookie: reporter.cookie,
      });
    expect((await report('fixed')).status).toBeLessThan(300);
    const [fixed] = await waitForEvents(author.id, 'bench_report');
    expect(fixed!.line).toContain('it fixed the fault');
    expect((await report('came_back', { heldDays: 12 })).status).toBeLessThan(300);
    const [back] = await waitForEvents(author.id, 'fault_came_back');
    expect(back!.line).toContain('came back after 12 days');
    await waitForMail(INTEGRATION_PORT, author.email, { subject: 'The fault came back', timeoutMs: 30_000 });
    // Saving the same report again is not news again.
    await report('came_back', { heldDays: 12 });
    expect(await eventsOf(author.id, 'fault_came_back')).toHaveLength(1);
  });

  it('keeps a moderator’s note on a returned revision in the author’s list', async () => {
    const values = completeValues(machine.id);
    const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: author.cookie });
    const id = created.body.revision.id;
    await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: author.cookie });
    const returned = await call(base, `/api/v1/proofing/${id}/return`, {
      body: { note: 'Give the reading at TP12 with a tape loaded.' },
      cookie: moderator.cookie,
    });
    expect(returned.status).toBe(200);
    const [reply] = await waitForEvents(author.id, 'moderator_reply');
    expect(reply!.line).toBe('Give the reading at TP12 with a tape loaded.');
    expect(reply!.path).toBe('/write/mine');
  });
});

describe('the weekly digest', () => {
  it('sends one mail per member per week with both parts, none twice, none to a member with nothing, never a hidden fix', async () => {
    const reader = await session(knex, base, 'member', 'news-digest');
    const idle = await session(knex, base, 'member', 'news-idle');
    const twoLive = await knex('fixes')
      .whereNotNull('current_revision_id')
      .whereNull('hidden_at')
      .orderBy('id')
      .limit(2)
      .select('id', 'slug');
    // A fix of this test's own, hidden by a moderator the way the desk does it, before the digest goes out.
    const { slug: hiddenSlug } = await publishFix(base, author, moderator, completeValues(machine.id));
    const hid = await call(base, `/api/v1/proofing/fixes/${hiddenSlug}`, {
      body: { action: 'hide', note: 'Digest test.' },
      cookie: moderator.cookie,
    });
    expect(hid.status).toBe(200);
    const fixes = [...twoLive, await knex('fixes').where({ slug: hiddenSlug }).first('id', 'slug')];
    const past = new Date('2026-11-17T10:00:00Z'); // a Tuesday: its week starts Monday 16 November
    await knex('notification_events').insert(
      fixes.map((f, n) => ({
        user_id: reader.id,
        kind: 'fix_proofed',
        cause_key: `digest-test:${f.id}`,
        fix_id: f.id,
        title: `Digest fix ${n}`,
        line: 'A new fix.',
        path: `/fixes/${f.slug}`,
        created_at: past,
      })),
    );
    {
      const sent: OutgoingMail[] = [];
      const figures = await sendWeeklyDigests(past, { knex, send: (m) => void sent.push(m), userIds: [reader.id, idle.id] });
      expect(figures.weekStart).toBe('2026-11-16');
      expect(sent).toHaveLength(1);
      const [digest] = sent;
      expect(digest!.to).toBe(reader.email);
      expect(digest!.text).toContain('Digest fix 0');
      expect(digest!.text).toContain('Digest fix 1');
      expect(digest!.text).not.toContain('Digest fix 2');
      expect(digest!.html).toContain(`/fixes/${fixes[0]!.slug}`);
      expect(digest!.headers?.['List-Unsubscribe-Post']).toBe('List-Unsubscribe=One-Click');
      const again = await sendWeeklyDigests(past, { knex, send: (m) => void sent.push(m), userIds: [reader.id, idle.id] });
      expect(again.members).toBe(0);
      expect(sent).toHaveLength(1);
    }
    expect(weekStart(new Date('2026-11-22T23:59:00Z')).toISOString().slice(0, 10)).toBe('2026-11-16');
  });
});

describe('scale and privacy', () => {
  it('fans out to 2,500 followers in batches of 1,000 without the request waiting', async () => {
    const { slug, revisionId } = await publishFix(base, author, moderator, completeValues(machine.id, {}));
    const fix = await knex('fixes').where({ slug }).first('id');
    const ids: number[] = (
      await knex.raw(
        `INSERT INTO users (name, email, role, "emailVerified") SELECT 'Fan ' || g, 'fan-' || g || '-' || ? || '@bench.example.test', 'member', now() FROM generate_series(1, 2500) g RETURNING id`,
        [Date.now()],
      )
    ).rows.map((r: { id: number }) => r.id);
    await knex('notification_settings').insert(ids.map((id) => ({ user_id: id, kind: 'fix_proofed', delivery: 'app' })));
    await knex('follows').insert(ids.map((id) => ({ user_id: id, target_kind: 'fix', target_id: fix.id })));
    const figures = await fanOutProofed(revisionId, { knex, batchSize: 1000 });
    // Other tests' members may follow the same machine or family (and the job queue may have reached them first):
    // the 2,500 fans each got exactly one event, in keyset batches of 1,000.
    expect(figures.batches).toBeGreaterThanOrEqual(3);
    const perFan = await knex('notification_events').whereIn('user_id', ids).where({ kind: 'fix_proofed' }).count({ n: '*' });
    expect(perFan).toEqual([{ n: '2500' }]);
    expect(figures.mailed).toBe(0);
    await knex('users').whereIn('id', ids).delete();
  });

  it('deletes follows and news with the account', async () => {
    const leaving = await session(knex, base, 'member', 'news-leaving');
    await follow(leaving, 'machine', machine.slug);
    await knex('notification_events').insert({
      user_id: leaving.id,
      kind: 'moderator_reply',
      cause_key: 'x',
      title: 't',
      line: '',
      path: '/write/mine',
    });
    const { anonymiseAccount } = await import('@/server/auth/delete-account');
    expect(await anonymiseAccount(leaving.id, leaving.id, knex)).toBe(true);
    expect(await knex('follows').where({ user_id: leaving.id }).first()).toBeUndefined();
    expect(await knex('notification_events').where({ user_id: leaving.id }).first()).toBeUndefined();
    expect((await mailsTo(INTEGRATION_PORT, leaving.email)).filter((m) => m.subject.includes('goes live'))).toHaveLength(0);
  });

  it('records no news for an account already gone (a fan-out that read its followers just before the deletion)', async () => {
    const gone = await session(knex, base, 'member', 'news-gone');
    const staying = await session(knex, base, 'member', 'news-staying');
    const { anonymiseAccount } = await import('@/server/auth/delete-account');
    expect(await anonymiseAccount(gone.id, gone.id, knex)).toBe(true);
    const { recordEvents } = await import('@/server/notifications/events');
    const event = { kind: 'fix_proofed' as const, causeKey: 'proofed:late', fixId: null, title: 'A fix went live', line: '', path: '/' };
    const recorded = await recordEvents(knex, [
      { ...event, userId: gone.id },
      { ...event, userId: staying.id },
    ]);
    expect(recorded.map((r) => r.userId)).toEqual([staying.id]);
    expect(await knex('notification_events').where({ user_id: gone.id }).first()).toBeUndefined();
  });
});
