// Many writers on one base at once: one revision goes live, the rest are answered 409 with both versions and keep
// every word; two edits of different fields are offered as one combined revision instead of a refusal.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
const WRITERS = 20;
let writers: Session[];
let moderators: Session[];
let machineId: number;

beforeAll(async () => {
  // Signed in one after another: the race under test is the proofing, not twenty sign-ins on a busy machine.
  writers = [];
  for (let i = 0; i < WRITERS; i++) writers.push(await session(knex, base, 'member', `par-${i}`));
  moderators = [await session(knex, base, 'moderator', 'par-mod-0'), await session(knex, base, 'moderator', 'par-mod-1')];
  machineId = await someMachineId(knex, 2);
}, 60_000);
afterAll(() => knex.destroy());

describe('twenty writers on one base revision', () => {
  it('sends all twenty to the desk, takes exactly one live when all are proofed at once, answers nineteen 409 with both versions, and loses no text', async () => {
    const { slug, revisionId: r1 } = await publishFix(base, writers[0]!, moderators[0]!, completeValues(machineId));
    const causeOf = (i: number) => `Cause typed by writer ${i}: the idler tyre of deck ${i} has hardened and slips under load.`;
    const drafts = await Promise.all(
      writers.map((w, i) =>
        call(base, '/api/v1/drafts', {
          body: { fixSlug: slug, values: completeValues(machineId, { cause: causeOf(i) }) },
          cookie: w.cookie,
        }),
      ),
    );
    for (const d of drafts) expect(d.body.revision?.baseRevisionId, `${d.status} ${JSON.stringify(d.body).slice(0, 300)}`).toBe(r1);
    const ids: number[] = drafts.map((d) => d.body.revision.id);

    const submitted = await Promise.all(
      ids.map((id, i) => call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: writers[i]!.cookie })),
    );
    expect(submitted.map((s) => s.status)).toEqual(Array(WRITERS).fill(200));

    // Twenty proofs at the same moment, from two moderators: the fix row is locked, so only one can build on r1.
    const proofs = await Promise.all(
      ids.map((id, i) => call(base, `/api/v1/proofing/${id}/proof`, { body: {}, cookie: moderators[i % 2]!.cookie })),
    );
    const accepted = proofs.filter((p) => p.status === 200);
    const refused = proofs.filter((p) => p.status === 409);
    expect(proofs.map((p) => p.status).sort()).toEqual([200, ...Array(WRITERS - 1).fill(409)]);
    expect(accepted).toHaveLength(1);
    expect(refused).toHaveLength(WRITERS - 1);
    const liveId = ids[proofs.findIndex((p) => p.status === 200)]!;
    for (const [i, p] of proofs.entries()) {
      if (p.status !== 409) continue;
      expect(p.body.error.code).toBe('conflict');
      expect(p.body.yours.id).toBe(ids[i]);
      expect(p.body.yours.values.cause).toBe(causeOf(i));
      expect(p.body.live.id).toBe(liveId);
    }
    expect((await knex('fixes').where({ slug }).first('current_revision_id')).current_revision_id).toBe(liveId);

    // Every writer still reads their own text, exactly as typed.
    const reread = await Promise.all(ids.map((id, i) => call(base, `/api/v1/drafts/${id}`, { cookie: writers[i]!.cookie })));
    reread.forEach((r, i) => expect(r.body.revision.values.cause).toBe(causeOf(i)));
    expect(await knex('revisions').whereIn('id', ids).where({ state: 'submitted' }).count({ n: '*' }).first()).toEqual({
      n: String(WRITERS - 1),
    });
  }, 60_000);
});

describe('two edits of different fields', () => {
  it('offers the combined revision to the second writer, who saves it onto the live revision and submits', async () => {
    const [first, second] = [writers[1]!, writers[2]!];
    const published = completeValues(machineId);
    const { slug } = await publishFix(base, writers[0]!, moderators[0]!, published);
    // Each writer starts from the live text, as the editor does.
    const start = async (w: Session) => {
      const res = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: published }, cookie: w.cookie });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      return res.body.revision;
    };
    const a = await start(first);
    const b = await start(second);

    const extraPart = { ref: 'R301', kind: 'resistor', value: '2k2', rating: '0.25W', quantity: 1, notes: 'Bias resistor' };
    const heat = { kind: 'heat', detail: 'The regulator heatsink stays hot for minutes after switching off.' };
    const withPart = { ...a.values, parts: [...a.values.parts, extraPart], editSummary: 'Add the bias resistor' };
    const withCaution = { ...b.values, cautions: [...b.values.cautions, heat], editSummary: 'Warn about the heatsink' };
    expect((await call(base, `/api/v1/drafts/${a.id}/submit`, { body: { values: withPart }, cookie: first.cookie })).status).toBe(200);
    expect((await call(base, `/api/v1/proofing/${a.id}/proof`, { body: {}, cookie: moderators[1]!.cookie })).status).toBe(200);

    const second409 = await call(base, `/api/v1/drafts/${b.id}/submit`, { body: { values: withCaution }, cookie: second.cookie });
    expect(second409.status).toBe(409);
    expect(second409.body.error.message).toMatch(/can be combined/);
    expect(second409.body.merge).toMatchObject({ yours: ['cautions'], theirs: ['parts'], clashes: [] });
    expect(second409.body.merge.values.parts).toContainEqual(extraPart);
    expect(second409.body.merge.values.cautions).toContainEqual(heat);
    // Nothing is saved before the writer takes the merge: the draft holds their own text on the old base.
    const held = await call(base, `/api/v1/drafts/${b.id}`, { cookie: second.cookie });
    expect(held.body.revision.values.parts).not.toContainEqual(extraPart);
    expect(held.body.baseIsStale).toBe(true);

    const saved = await call(base, `/api/v1/drafts/${b.id}`, {
      method: 'PUT',
      body: { values: second409.body.merge.values, baseRevisionId: a.id },
      cookie: second.cookie,
    });
    expect(saved.status).toBe(200);
    expect((await call(base, `/api/v1/drafts/${b.id}/submit`, { body: {}, cookie: second.cookie })).status).toBe(200);
    expect((await call(base, `/api/v1/proofing/${b.id}/proof`, { body: {}, cookie: moderators[0]!.cookie })).status).toBe(200);
    const live = await call(base, `/api/v1/fixes/${slug}`);
    expect(JSON.stringify(live.body)).toContain('Bias resistor');
    expect(JSON.stringify(live.body)).toContain('regulator heatsink stays hot');
  }, 60_000);

  it('answers a clash in one field without a merge, with both versions', async () => {
    const [first, second] = [writers[3]!, writers[4]!];
    const published = completeValues(machineId);
    const { slug } = await publishFix(base, writers[0]!, moderators[0]!, published);
    const a = (await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: published }, cookie: first.cookie })).body.revision;
    const b = (await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: published }, cookie: second.cookie })).body.revision;
    const body = (cause: string, values: typeof a.values) => ({ values: { ...values, cause, editSummary: 'Cause' } });
    await call(base, `/api/v1/drafts/${a.id}/submit`, {
      body: body('A dry joint on the motor plug, found by tapping.', a.values),
      cookie: first.cookie,
    });
    await call(base, `/api/v1/proofing/${a.id}/proof`, { body: {}, cookie: moderators[1]!.cookie });
    const clash = await call(base, `/api/v1/drafts/${b.id}/submit`, {
      body: body('The driver capacitor has dried out, measured at 30 % of its value.', b.values),
      cookie: second.cookie,
    });
    expect(clash.status).toBe(409);
    expect(clash.body.merge).toMatchObject({ clashes: ['cause'], values: null });
    expect(clash.body.yours.values.cause).toBe('The driver capacitor has dried out, measured at 30 % of its value.');
    expect(clash.body.live.values.cause).toBe('A dry joint on the motor plug, found by tapping.');
  }, 60_000);
});
