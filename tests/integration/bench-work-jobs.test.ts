// Job sheets against the real database: private to the owner, pinned fixes, filters, invoice lines, hard delete.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { makeFix, makeMember, makeWorld, proofNewRevision, type TestFix, type TestWorld } from './bench-work-support';
import {
  applyFixToJob,
  createJobSheet,
  deleteJobSheet,
  fixChoicesFor,
  getJobSheet,
  invoiceLinesFor,
  listJobSheets,
  removeFixFromJob,
  updateJobSheet,
} from '@/server/bench-work/job-sheets';
import { createHandoverNote } from '@/server/bench-work/handover-notes';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';
import { jobSheetCreateSchema, jobSheetPatchSchema } from '@/lib/schemas/job-sheet';
import { jobSheetListQuerySchema } from '@/lib/schemas/job-sheet-list';
import { closeDb } from '@/server/core/db';

const knex = testDb();
let world: TestWorld;
let owner: { id: number };
let fix: TestFix;
let familyFix: TestFix;

beforeAll(async () => {
  world = await makeWorld(knex);
  owner = await makeMember(knex);
  const author = await makeMember(knex);
  fix = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id], title: 'Tape stops after seconds' });
  familyFix = await makeFix(knex, { authorId: author.id, machineIds: [], chassisIds: [world.chassisId], title: 'Clock dead on power-up' });
});
afterAll(async () => {
  await knex.destroy();
  await closeDb();
});

async function job(ownerId: number, fields: Record<string, unknown>): Promise<number> {
  const created = await createJobSheet(ownerId, jobSheetCreateSchema.parse(fields));
  if (!created.ok) throw new Error(created.message);
  return created.value;
}

describe('createJobSheet and getJobSheet', () => {
  it('stores every field and reads it back for the owner only', async () => {
    const id = await job(owner.id, {
      customerRef: 'Ticket 3301',
      machine: world.machines[0]!.slug,
      serialNumber: 'A1B2C3',
      reportedSymptom: 'Stops after a few seconds',
      partsUsed: [{ kind: 'belt', value: 'belt 92 mm x 4 mm flat', quantity: 1 }],
      labourMinutes: 75,
      status: 'diagnosing',
    });
    const sheet = await getJobSheet(owner.id, id);
    expect(sheet).toMatchObject({
      customerRef: 'Ticket 3301',
      serialNumber: 'A1B2C3',
      labourMinutes: 75,
      status: 'diagnosing',
      machine: { slug: world.machines[0]!.slug },
    });
    // Parts keep the order-list line shape; a line without a source is marked as coming from this job.
    expect(sheet?.partsUsed[0]).toMatchObject({ kind: 'belt', quantity: 1, ref: '', source: 'Job sheet Ticket 3301' });
    const stranger = await makeMember(knex);
    expect(await getJobSheet(stranger.id, id)).toBeNull();
  });

  it('names the field of a machine that is not in the catalogue', async () => {
    const refused = await createJobSheet(owner.id, jobSheetCreateSchema.parse({ customerRef: 'X', machine: 'no-such-machine' }));
    expect(refused).toMatchObject({ ok: false, fields: { machine: ['Choose a machine from the catalogue, or leave it empty.'] } });
  });

  it('refuses an empty customer reference and a negative labour time with field messages', () => {
    const bad = jobSheetCreateSchema.safeParse({ customerRef: '  ', labourMinutes: -5, status: 'lost' });
    const paths = bad.error?.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['customerRef', 'labourMinutes', 'status']));
  });
});

describe('updateJobSheet', () => {
  it('changes only the fields given and answers not found for another member', async () => {
    const id = await job(owner.id, { customerRef: 'Ticket 3302', findings: 'Nothing yet' });
    expect(
      await updateJobSheet(owner.id, id, jobSheetPatchSchema.parse({ status: 'repaired', outcome: 'Plays and records again.' })),
    ).toEqual({ ok: true, value: id });
    expect(await getJobSheet(owner.id, id)).toMatchObject({
      status: 'repaired',
      outcome: 'Plays and records again.',
      findings: 'Nothing yet',
    });
    const stranger = await makeMember(knex);
    expect(await updateJobSheet(stranger.id, id, jobSheetPatchSchema.parse({ status: 'collected' }))).toMatchObject({
      ok: false,
      code: 'not_found',
    });
    expect((await getJobSheet(owner.id, id))?.status).toBe('repaired');
  });
});

describe('applyFixToJob', () => {
  it('pins the live revision and keeps it pinned when the fix changes later', async () => {
    const id = await job(owner.id, { customerRef: 'Ticket 3303', machine: world.machines[0]!.slug });
    const changing = await makeFix(knex, { authorId: owner.id, machineIds: [world.machines[0]!.id] });
    expect((await applyFixToJob(owner.id, id, changing.slug)).ok).toBe(true);
    await proofNewRevision(knex, changing, owner.id);
    const applied = (await getJobSheet(owner.id, id))?.fixes.find((f) => f.slug === changing.slug);
    expect(applied).toMatchObject({ revisionNumber: 1, liveRevisionNumber: 2, permalink: `/fixes/${changing.slug}/r/1` });
    expect(await removeFixFromJob(owner.id, id, changing.slug)).toBe(true);
    expect((await getJobSheet(owner.id, id))?.fixes).toEqual([]);
  });

  it('offers the fixes of the machine and of its chassis family', async () => {
    const sheet = await getJobSheet(owner.id, await job(owner.id, { customerRef: 'Ticket 3304', machine: world.machines[1]!.slug }));
    const choices = (await fixChoicesFor(sheet?.machine ?? null)).map((c) => c.slug);
    expect(choices).toContain(familyFix.slug);
    expect(choices).not.toContain(fix.slug);
  });
});

describe('listJobSheets', () => {
  it('filters by status and text and sorts by customer reference', async () => {
    const member = await makeMember(knex);
    await job(member.id, { customerRef: 'Beta 2', status: 'repaired' });
    await job(member.id, { customerRef: 'Alpha 1', status: 'repaired', serialNumber: 'ZX-9' });
    await job(member.id, { customerRef: 'Gamma 3', status: 'booked_in' });
    const all = await listJobSheets(member.id, jobSheetListQuerySchema.parse({ sort: 'customer' }));
    expect(all.map((j) => j.customerRef)).toEqual(['Alpha 1', 'Beta 2', 'Gamma 3']);
    const repaired = await listJobSheets(member.id, jobSheetListQuerySchema.parse({ status: 'repaired' }));
    expect(repaired).toHaveLength(2);
    const bySerial = await listJobSheets(member.id, jobSheetListQuerySchema.parse({ q: 'zx-9' }));
    expect(bySerial.map((j) => j.customerRef)).toEqual(['Alpha 1']);
    // A LIKE wildcard typed as text matches only itself.
    expect(await listJobSheets(member.id, jobSheetListQuerySchema.parse({ q: '%' }))).toEqual([]);
  });
});

describe('invoiceLinesFor', () => {
  it('lists labour in hours, each part, the note link and the permalink of a fix without a note', async () => {
    const id = await job(owner.id, {
      customerRef: 'Ticket 3305',
      machine: world.machines[0]!.slug,
      labourMinutes: 90,
      partsUsed: [{ ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C', quantity: 2 }],
    });
    await applyFixToJob(owner.id, id, fix.slug);
    await applyFixToJob(owner.id, id, familyFix.slug);
    const created = await createHandoverNote(
      { id: owner.id, shopName: null },
      handoverNoteInputSchema.parse({ fix: fix.slug, jobSheetId: id }),
    );
    const code = created.ok ? created.code : '';
    const invoice = await invoiceLinesFor(owner.id, id);
    expect(invoice?.lines).toEqual([
      { kind: 'labour', description: 'Labour', quantity: 1.5, unit: 'h', link: '' },
      { kind: 'part', description: 'capacitor 470uF 16V 105C (C512)', quantity: 2, unit: 'pcs', link: '' },
      {
        kind: 'repair_notes',
        description: 'Repair notes: Tape stops after seconds (r1)',
        quantity: 1,
        unit: '',
        link: expect.stringMatching(new RegExp(`/n/${code}$`)),
      },
      {
        kind: 'fix',
        description: 'Repair followed: Clock dead on power-up (r1)',
        quantity: 1,
        unit: '',
        link: expect.stringMatching(new RegExp(`/fixes/${familyFix.slug}/r/1$`)),
      },
    ]);
    expect(await invoiceLinesFor((await makeMember(knex)).id, id)).toBeNull();
  });
});

describe('deleteJobSheet', () => {
  it('removes the sheet and its applied fixes for good, and only for its owner', async () => {
    const id = await job(owner.id, { customerRef: 'Ticket 3306 Mrs Example' });
    await applyFixToJob(owner.id, id, fix.slug);
    const stranger = await makeMember(knex);
    expect(await deleteJobSheet(stranger.id, id)).toBe(false);
    expect(await deleteJobSheet(owner.id, id)).toBe(true);
    expect(await knex('job_sheets').where({ id }).first()).toBeUndefined();
    expect(await knex('job_sheet_fixes').where({ job_sheet_id: id }).first()).toBeUndefined();
  });
});
