// Two writers on one fix (409 with both versions, nothing lost) and moderators amending (never proofing their own).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let first: Session;
let second: Session;
let moderator: Session;
let otherModerator: Session;
let machineId: number;

beforeAll(async () => {
  first = await session(knex, base, 'member', 'conflict-a');
  second = await session(knex, base, 'member', 'conflict-b');
  moderator = await session(knex, base, 'moderator', 'conflict-mod');
  otherModerator = await session(knex, base, 'moderator', 'conflict-mod2');
  machineId = await someMachineId(knex, 1);
});
afterAll(() => knex.destroy());

describe('submitting against a stale base', () => {
  it('answers 409 with both versions, keeps the draft, and submits once the writer builds on the live revision', async () => {
    const { slug, revisionId: r1 } = await publishFix(base, first, moderator, completeValues(machineId));
    const mine = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(machineId, { cause: 'My longer cause, typed carefully.' }) },
      cookie: first.cookie,
    });
    const theirs = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(machineId, { cause: 'Their cause, proofed first.' }) },
      cookie: second.cookie,
    });
    expect(mine.body.revision.baseRevisionId).toBe(r1);
    await call(base, `/api/v1/drafts/${theirs.body.revision.id}/submit`, { body: {}, cookie: second.cookie });
    expect((await call(base, `/api/v1/proofing/${theirs.body.revision.id}/proof`, { body: {}, cookie: moderator.cookie })).status).toBe(
      200,
    );

    const saved = await call(base, `/api/v1/drafts/${mine.body.revision.id}`, {
      method: 'PUT',
      body: { values: mine.body.revision.values },
      cookie: first.cookie,
    });
    expect(saved.body.baseIsStale).toBe(true);
    const stale = await call(base, `/api/v1/drafts/${mine.body.revision.id}/submit`, { body: {}, cookie: first.cookie });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect(stale.body.yours.values.cause).toBe('My longer cause, typed carefully.');
    expect(stale.body.live.id).toBe(theirs.body.revision.id);
    expect(stale.body.live.values.cause).toBe('Their cause, proofed first.');
    // Both versions, but no one's e-mail address.
    expect(JSON.stringify(stale.body)).not.toContain(second.email);
    expect(await knex('revisions').where({ id: mine.body.revision.id }).first('state', 'cause')).toEqual({
      state: 'draft',
      cause: 'My longer cause, typed carefully.',
    });

    // A base may only move onto the live revision.
    const wrongBase = await call(base, `/api/v1/drafts/${mine.body.revision.id}`, {
      method: 'PUT',
      body: { values: stale.body.yours.values, baseRevisionId: r1 + 999999 },
      cookie: first.cookie,
    });
    expect(wrongBase.status).toBe(409);
    const rebased = await call(base, `/api/v1/drafts/${mine.body.revision.id}`, {
      method: 'PUT',
      body: { values: stale.body.yours.values, baseRevisionId: stale.body.live.id },
      cookie: first.cookie,
    });
    expect(rebased.status).toBe(200);
    expect(rebased.body.baseIsStale).toBe(false);
    expect((await call(base, `/api/v1/drafts/${mine.body.revision.id}/submit`, { body: {}, cookie: first.cookie })).status).toBe(200);
  });

  it('will not proof a waiting revision whose base is no longer live', async () => {
    const { slug } = await publishFix(base, first, moderator, completeValues(machineId));
    const a = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: completeValues(machineId) }, cookie: first.cookie });
    const b = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: completeValues(machineId) }, cookie: second.cookie });
    await call(base, `/api/v1/drafts/${a.body.revision.id}/submit`, { body: {}, cookie: first.cookie });
    await call(base, `/api/v1/drafts/${b.body.revision.id}/submit`, { body: {}, cookie: second.cookie });
    expect((await call(base, `/api/v1/proofing/${a.body.revision.id}/proof`, { body: {}, cookie: moderator.cookie })).status).toBe(200);
    const late = await call(base, `/api/v1/proofing/${b.body.revision.id}/proof`, { body: {}, cookie: moderator.cookie });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/Return it so the author can carry their text over/);
    const desk = await (await fetch(`${base}/proofing`, { headers: { cookie: moderator.cookie } })).text();
    expect(desk).toMatch(new RegExp(`data-desk-revision="${b.body.revision.id}"[\\s\\S]*?written on an older base`));
  });
});

describe('nobody proofs their own revision', () => {
  it('refuses a moderator proofing what they wrote, in the server and in the database', async () => {
    const own = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: moderator.cookie });
    const id = own.body.revision.id;
    await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: moderator.cookie });
    const refused = await call(base, `/api/v1/proofing/${id}/proof`, { body: {}, cookie: moderator.cookie });
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/Nobody proofs their own revision/);
    expect((await call(base, `/api/v1/proofing/${id}/return`, { body: { note: 'x' }, cookie: moderator.cookie })).status).toBe(403);
    const page = await (await fetch(`${base}/proofing/${id}`, { headers: { cookie: moderator.cookie } })).text();
    expect(page).toContain('Nobody proofs their own');
    expect(page).not.toContain(`/api/v1/proofing/${id}/proof`);
    const db = await knex('revisions')
      .where({ id })
      .update({ state: 'proofed', proofer_id: moderator.id, proofed_at: new Date() })
      .catch((e: { constraint?: string }) => e);
    expect((db as { constraint?: string }).constraint).toBe('revisions_own_proof_check');
    expect((await call(base, `/api/v1/proofing/${id}/proof`, { body: {}, cookie: otherModerator.cookie })).status).toBe(200);
  });

  it('records a moderator’s amendment as their own revision, withdraws the original with a note, and needs another moderator', async () => {
    const original = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: first.cookie });
    const originalId = original.body.revision.id;
    await call(base, `/api/v1/drafts/${originalId}/submit`, { body: {}, cookie: first.cookie });

    expect((await call(base, `/api/v1/revisions/${originalId}/amend`, { body: {}, cookie: second.cookie })).status).toBe(403);
    const amendment = await call(base, `/api/v1/revisions/${originalId}/amend`, { body: {}, cookie: moderator.cookie });
    expect(amendment.status).toBe(201);
    const amendmentId = amendment.body.revision.id;
    const values = { ...amendment.body.revision.values, title: `${amendment.body.revision.values.title} (tidied)` };
    expect((await call(base, `/api/v1/drafts/${amendmentId}/submit`, { body: { values }, cookie: moderator.cookie })).status).toBe(200);

    const was = await knex('revisions').where({ id: originalId }).first('state', 'proof_note', 'author_id');
    expect(was.state).toBe('withdrawn');
    expect(was.proof_note).toBe(`Amended by a moderator into r${amendment.body.revision.number}.`);
    expect(was.author_id).toBe(first.id);
    expect((await knex('revisions').where({ id: amendmentId }).first('author_id')).author_id).toBe(moderator.id);
    expect((await call(base, `/api/v1/proofing/${amendmentId}/proof`, { body: {}, cookie: moderator.cookie })).status).toBe(403);
    expect((await call(base, `/api/v1/proofing/${amendmentId}/proof`, { body: {}, cookie: otherModerator.cookie })).status).toBe(200);
    expect(
      await knex('audit_log')
        .where({ action: 'revision.amend', subject_id: String(originalId) })
        .count('* as n')
        .first(),
    ).toEqual({ n: '1' });
  });
});
