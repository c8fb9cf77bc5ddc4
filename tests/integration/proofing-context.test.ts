// The proofing desk as a moderator and an author use it: the author's summary, the return note kept in view while
// amending, a resubmission compared with the returned revision, one note field for the decision, and a filtered,
// paged queue that works as a plain GET form.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { postForm } from '../support/sign-in';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let author: Session;
let moderator: Session;
let machineId: number;

beforeAll(async () => {
  author = await session(knex, base, 'member', 'ctx-author');
  moderator = await session(knex, base, 'moderator', 'ctx-mod');
  machineId = await someMachineId(knex, 7);
});
afterAll(() => knex.destroy());

async function page(path: string, cookie: string): Promise<{ status: number; html: string }> {
  const response = await fetch(`${base}${path}`, { headers: { cookie }, redirect: 'manual' });
  return { status: response.status, html: await response.text() };
}

async function submitNew(who: Session, overrides: Parameters<typeof completeValues>[1] = {}): Promise<number> {
  const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId, overrides) }, cookie: who.cookie });
  expect(created.status).toBe(201);
  const id: number = created.body.revision.id;
  expect((await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: who.cookie })).status).toBe(200);
  return id;
}

/** The decision form on the revision page, as a browser sends it without JavaScript. */
function decide(revisionId: number, decision: string, note: string): Promise<Response> {
  return postForm(
    base,
    `/proofing/${revisionId}?_action=proofingDecision`,
    { revision: String(revisionId), decision, note },
    { cookie: moderator.cookie },
  );
}

/** The rows of the desk's waiting table: revision ids in the order shown. */
function deskRows(html: string): number[] {
  return [...html.matchAll(/data-desk-revision="(\d+)"/g)].map((m) => Number(m[1]));
}

describe('a returned revision and its answer', () => {
  it('shows the summary, returns with one note, keeps the note above the amend form, and compares the answer with the returned one', async () => {
    const firstId = await submitNew(author, { editSummary: 'First write-up of the capstan stall.' });
    const first = await knex('revisions').where({ id: firstId }).first('number');

    // The desk and the revision page show what the author says they changed.
    const desk = await page('/proofing', moderator.cookie);
    expect(desk.html).toMatch(new RegExp(`data-desk-revision="${firstId}"[\\s\\S]*?“First write-up of the capstan stall.”`));
    const review = await page(`/proofing/${firstId}`, moderator.cookie);
    expect(review.html).toMatch(/data-edit-summary[\s\S]*?What the author says they changed[\s\S]*?First write-up of the capstan stall\./);

    // One note field serves both buttons; nothing else on the page asks for a note.
    const decisionForm = review.html.match(/<form[^>]*data-decision[\s\S]*?<\/form>/)?.[0] ?? '';
    expect(decisionForm.match(/name="note"/g)).toHaveLength(1);
    expect(decisionForm).toMatch(/name="decision" value="proof"/);
    expect(decisionForm).toMatch(/name="decision" value="return"/);
    expect(review.html.match(/<textarea[^>]*name="note"/g)).toHaveLength(1);

    // Returning without a note is refused on the page itself, with an example of a good note.
    const empty = await decide(firstId, 'return', '   ');
    expect(empty.status).toBe(400);
    const emptyHtml = await empty.text();
    expect(emptyHtml).toContain('Say what the author should change, for example');
    expect((await knex('revisions').where({ id: firstId }).first('state')).state).toBe('submitted');

    const note = 'Say which way round C512 goes, and give the reading at TP12 after the swap.';
    const returned = await decide(firstId, 'return', note);
    expect(returned.status).toBe(303);
    expect(returned.headers.get('location')).toBe('/proofing?returned=1');
    expect((await knex('revisions').where({ id: firstId }).first('state')).state).toBe('returned');

    // Amending: the editor page the author lands on carries the moderator's note for the line above the form.
    const amended = await call(base, `/api/v1/revisions/${firstId}/amend`, { body: {}, cookie: author.cookie });
    expect(amended.status).toBe(201);
    const draftId: number = amended.body.revision.id;
    const editor = await page(amended.body.editorPath, author.cookie);
    expect(editor.status).toBe(200);
    expect(editor.html).toContain(`returned r${first.number} with this note: “${note}”`);

    const values = {
      ...amended.body.revision.values,
      cause: `${amended.body.revision.values.cause} Fit it with the stripe towards R510.`,
      editSummary: 'Said which way round C512 goes.',
    };
    expect((await call(base, `/api/v1/drafts/${draftId}/submit`, { body: { values }, cookie: author.cookie })).status).toBe(200);

    // The desk says the new one answers the returned one; its page shows the note and what changed since.
    const deskAfter = await page(`/proofing?author=${author.id}`, moderator.cookie);
    expect(deskAfter.html).toMatch(new RegExp(`data-desk-revision="${draftId}"[\\s\\S]*?answers the returned r${first.number}`));
    const answer = await page(`/proofing/${draftId}`, moderator.cookie);
    expect(answer.html).toContain(`This revision answers r${first.number}`);
    expect(answer.html).toContain(note);
    expect(answer.html).toContain('Said which way round C512 goes.');
    const since = answer.html.match(/<section aria-labelledby="changes-since"[\s\S]*?<section aria-labelledby="changes"/)?.[0] ?? '';
    expect(since).toContain(`Changes since the returned r${first.number}`);
    expect(since).toMatch(/data-changed-sections="Cause"/);
    // And still against the live text (here: everything, as a new fix).
    expect(answer.html).toContain('Everything in this new fix');
  });

  it('keeps the note as typed when the decision is refused', async () => {
    const liveAuthor = await session(knex, base, 'member', 'ctx-live');
    const { slug } = await publishFix(base, liveAuthor, moderator, completeValues(machineId));
    // Two edits of one live fix: once the second goes live, the first is written on an older base.
    const older = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: completeValues(machineId) }, cookie: author.cookie });
    await call(base, `/api/v1/drafts/${older.body.revision.id}/submit`, { body: {}, cookie: author.cookie });
    const newer = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(machineId) },
      cookie: liveAuthor.cookie,
    });
    await call(base, `/api/v1/drafts/${newer.body.revision.id}/submit`, { body: {}, cookie: liveAuthor.cookie });
    expect((await decide(newer.body.revision.id, 'proof', '')).status).toBe(303);

    const note = 'Thanks: this reads well, but check it against the new live text.';
    const refused = await decide(older.body.revision.id, 'proof', note);
    expect(refused.status).toBe(409);
    const html = await refused.text();
    expect(html).toContain('The fix went live with another revision after this one was written.');
    expect(html).toMatch(/<textarea[^>]*name="note"[^>]*>Thanks: this reads well, but check it against the new live text\.<\/textarea>/);
  });
});

describe('the desk queue', () => {
  it('filters by author, kind, machine and age with a plain GET form, and pages a long queue', async () => {
    const busy = await session(knex, base, 'member', 'ctx-busy');
    const otherMachine = await someMachineId(knex, 8);
    const ids: number[] = [];
    for (let i = 0; i < 50; i++) ids.push(await submitNew(busy));
    const elsewhere = await submitNew(busy, { machineIds: [otherMachine] });
    try {
      await checkQueue(busy, ids, elsewhere, otherMachine);
    } finally {
      // Taken back, so the desk of the test files that follow is not crowded by this one.
      for (const id of [...ids, elsewhere]) await call(base, `/api/v1/revisions/${id}/withdraw`, { body: {}, cookie: busy.cookie });
    }
  }, 120_000);
});

async function checkQueue(busy: Session, ids: number[], elsewhere: number, otherMachine: number): Promise<void> {
  // One has waited ten days.
  await knex('revisions')
    .where({ id: ids[0] })
    .update({ submitted_at: knex.raw(`now() - interval '10 days'`) });

  const plain = await page('/proofing', moderator.cookie);
  expect(plain.html).toMatch(/<form method="get" action="\/proofing"/);
  expect(scriptsBesideRegistration(plain.html)).toEqual([]);
  expect(plain.html).toMatch(new RegExp(`<option value="${busy.id}"[^>]*>[^<]*\\(51\\)`));

  const mine = await page(`/proofing?author=${busy.id}`, moderator.cookie);
  expect(mine.html).toContain('51 of');
  expect(deskRows(mine.html)).toHaveLength(50);
  expect(deskRows(mine.html)[0]).toBe(ids[0]);
  expect(mine.html).toMatch(/href="\/proofing\?author=\d+&(amp;|#38;)page=2"/);
  const second = await page(`/proofing?author=${busy.id}&page=2`, moderator.cookie);
  expect(deskRows(second.html)).toEqual([elsewhere]);

  const newest = await page(`/proofing?author=${busy.id}&order=newest`, moderator.cookie);
  expect(deskRows(newest.html)[0]).toBe(elsewhere);

  const onMachine = await page(`/proofing?author=${busy.id}&machine=${otherMachine}`, moderator.cookie);
  expect(deskRows(onMachine.html)).toEqual([elsewhere]);

  const old = await page(`/proofing?author=${busy.id}&waited=week`, moderator.cookie);
  expect(deskRows(old.html)).toEqual([ids[0]]);

  const edits = await page(`/proofing?author=${busy.id}&kind=edit`, moderator.cookie);
  expect(deskRows(edits.html)).toEqual([]);
  expect(edits.html).toContain('Nothing waiting matches this filter.');
  const news = await page(`/proofing?author=${busy.id}&kind=new`, moderator.cookie);
  expect(news.html).toContain('51 of');

  // A hand-edited address still shows the queue rather than failing.
  const odd = await page(`/proofing?waited=forever&kind=x&author=abc&page=-3`, moderator.cookie);
  expect(odd.status).toBe(200);
  expect(deskRows(odd.html).length).toBeGreaterThan(0);
}
