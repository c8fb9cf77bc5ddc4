// Bench reports against the real database: one per member, fix and machine; revisions weighed; score refreshed.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { makeFix, makeMember, makeWorld, type TestFix, type TestWorld } from './bench-work-support';
import { eligibleMachines, listOwnBenchReports, saveBenchReport } from '@/server/bench-work/bench-reports';
import { benchCountsByRevision, benchScoresFor } from '@/server/bench-work/bench-scores';
import { benchReportInputSchema } from '@/lib/schemas/bench-report';
import { wilsonLowerBound } from '@/lib/bench/bench-score';
import { closeDb } from '@/server/core/db';

const knex = testDb();
let world: TestWorld;
let author: { id: number };
let fix: TestFix;

beforeAll(async () => {
  world = await makeWorld(knex);
  author = await makeMember(knex);
  // Two proofed revisions: r1 is older, r2 is live. The fix names one machine; the other is in its family.
  fix = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id], revisions: 2 });
});
afterAll(async () => {
  await knex.destroy();
  await closeDb();
});

const report = (over: Record<string, unknown>) =>
  benchReportInputSchema.parse({ fix: fix.slug, machine: world.machines[0]!.slug, outcome: 'fixed', ...over });

async function saved(memberId: number, over: Record<string, unknown>) {
  const result = await saveBenchReport(memberId, report(over));
  if (!result.ok) throw new Error(result.message);
  return result.report;
}

describe('saveBenchReport', () => {
  it('records a report on the live revision and changes it on a second save instead of adding one', async () => {
    const member = await makeMember(knex);
    const first = await saved(member.id, { outcome: 'partly', note: 'Better, still slow.' });
    expect(first.created).toBe(true);
    expect(first.revisionNumber).toBe(2);
    const second = await saved(member.id, { outcome: 'came_back', heldDays: 40 });
    expect(second.created).toBe(false);
    expect(second.id).toBe(first.id);
    const rows = await knex('bench_reports').where({ member_id: member.id });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ outcome: 'came_back', held_days: 40, revision_id: fix.revisionIds[1] });
  });

  it('keeps a separate report per machine', async () => {
    const member = await makeMember(knex);
    await saved(member.id, {});
    await saved(member.id, { machine: world.machines[1]!.slug });
    expect(await knex('bench_reports').where({ member_id: member.id }).count('* as n').first()).toEqual({ n: '2' });
  });

  it('accepts a machine of the fix’s chassis family and refuses one outside it with a field message', async () => {
    const member = await makeMember(knex);
    expect((await eligibleMachines(fix.id)).map((m) => m.slug).sort()).toEqual(world.machines.map((m) => m.slug).sort());
    const refused = await saveBenchReport(member.id, report({ machine: world.outsider.slug }));
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.fields?.machine?.[0]).toMatch(/applies to/);
  });

  it('refuses a revision number that was never proofed and an unknown fix', async () => {
    const member = await makeMember(knex);
    const wrongRevision = await saveBenchReport(member.id, report({ revision: 7 }));
    expect(wrongRevision).toMatchObject({ ok: false, code: 'bad_request', fields: { revision: ['The fix has no proofed revision r7.'] } });
    const unknown = await saveBenchReport(member.id, report({ fix: 'no-such-fix-at-all' }));
    expect(unknown).toMatchObject({ ok: false, code: 'not_found' });
  });
});

describe('bench score from reports', () => {
  it('weighs reports on an older revision at half, counts came-back against the fix, refreshes the search row', async () => {
    const own = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[1]!.id], revisions: 2 });
    const members = await Promise.all([makeMember(knex), makeMember(knex), makeMember(knex)]);
    const input = (over: Record<string, unknown>) =>
      benchReportInputSchema.parse({ fix: own.slug, machine: world.machines[1]!.slug, outcome: 'fixed', ...over });
    await saveBenchReport(members[0]!.id, input({}));
    await saveBenchReport(members[1]!.id, input({ outcome: 'came_back', heldDays: 12 }));
    await saveBenchReport(members[2]!.id, input({ revision: 1 }));
    const view = (await benchScoresFor([own.id])).get(own.id)!;
    expect(view).toMatchObject({ counted: 3, fixed: 2, cameBack: 1, onCurrentRevision: 2, onOlderRevisions: 1 });
    // Current: 1 fixed + 1 came back; older (weight 0.5): 1 fixed → k = 1.5, n = 2.5.
    const expected = wilsonLowerBound(1.5, 2.5);
    expect(expected.ok && view.score).toBeCloseTo(expected.ok ? (expected.value ?? -1) : -1, 12);
    const search = await knex('fix_search').where({ fix_id: own.id }).first('bench_score', 'report_count');
    expect(search.report_count).toBe(3);
    expect(search.bench_score).toBeCloseTo(view.score ?? -1, 12);
  });

  it('shows the author’s own report but leaves it out of the score and the counts', async () => {
    const own = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id] });
    const result = await saveBenchReport(
      author.id,
      benchReportInputSchema.parse({ fix: own.slug, machine: world.machines[0]!.slug, outcome: 'fixed' }),
    );
    expect(result.ok && result.report.counted).toBe(false);
    const view = (await benchScoresFor([own.id])).get(own.id)!;
    expect(view).toMatchObject({ counted: 0, ownReports: 1, score: null });
    const byRevision = await benchCountsByRevision(own.id);
    expect(byRevision).toEqual([{ revisionNumber: 1, isCurrent: true, fixed: 0, partly: 0, notFixed: 0, cameBack: 0, ownReports: 1 }]);
    expect((await knex('fix_search').where({ fix_id: own.id }).first('report_count')).report_count).toBe(0);
  });
});

describe('bench_reports table', () => {
  it('refuses a report whose revision belongs to another fix', async () => {
    const other = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id] });
    const member = await makeMember(knex);
    const error = await knex('bench_reports')
      .insert({
        fix_id: fix.id,
        revision_id: other.revisionIds[0],
        machine_id: world.machines[0]!.id,
        member_id: member.id,
        outcome: 'fixed',
      })
      .then(
        () => null,
        (e: { constraint?: string }) => e.constraint,
      );
    expect(error).toBe('bench_reports_revision_of_fix_fk');
  });
});

describe('benchReportInputSchema', () => {
  it('asks for the days held when the fault came back, and only then', () => {
    const missing = benchReportInputSchema.safeParse({ fix: 'a-fix', machine: 'a-machine', outcome: 'came_back' });
    expect(missing.success).toBe(false);
    expect(missing.error?.issues[0]?.path).toEqual(['heldDays']);
    const stray = benchReportInputSchema.safeParse({ fix: 'a-fix', machine: 'a-machine', outcome: 'fixed', heldDays: 3 });
    expect(stray.error?.issues[0]?.message).toMatch(/only apply/);
  });

  it('names a bad outcome and a bad reading in plain words', () => {
    const bad = benchReportInputSchema.safeParse({
      fix: 'a-fix',
      machine: 'a-machine',
      outcome: 'maybe',
      readings: [{ testPoint: '', expected: '5 V' }],
    });
    const messages = bad.error?.issues.map((i) => `${i.path.join('.')}: ${i.message}`) ?? [];
    expect(messages).toContain('outcome: Choose an outcome: fixed, partly, not fixed or fault came back.');
    expect(messages.some((m) => m.startsWith('readings.0.testPoint: Name the test point'))).toBe(true);
  });
});

describe('listOwnBenchReports', () => {
  it('lists a member’s reports with the revision each was made on', async () => {
    const member = await makeMember(knex);
    await saved(member.id, { revision: 1, readings: [{ testPoint: 'TP4', expected: '5.0 V', measured: '4.9 V' }] });
    const [mine] = await listOwnBenchReports(member.id);
    expect(mine).toMatchObject({ fix: { slug: fix.slug }, revisionNumber: 1, onCurrentRevision: false, counted: true });
    expect(mine?.readings[0]).toMatchObject({ testPoint: 'TP4', measured: '4.9 V' });
  });
});
