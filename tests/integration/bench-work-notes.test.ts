// Hand-over notes against the real database: pinned revision, short codes, revoking, job details by choice.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { makeFix, makeMember, makeWorld, proofNewRevision, type TestFix, type TestWorld } from './bench-work-support';
import { createHandoverNote, findPublicNote, getOwnNote, invoiceLine, listOwnNotes, revokeNote } from '@/server/bench-work/handover-notes';
import { createJobSheet, deleteJobSheet } from '@/server/bench-work/job-sheets';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';
import { jobSheetCreateSchema } from '@/lib/schemas/job-sheet';
import { HANDOVER_ALPHABET } from '@/lib/handover-code';
import { closeDb } from '@/server/core/db';

const knex = testDb();
let world: TestWorld;
let shop: { id: number };
let fix: TestFix;

beforeAll(async () => {
  world = await makeWorld(knex);
  shop = await makeMember(knex, { shopName: 'Kestrel Lane Repairs' });
  fix = await makeFix(knex, {
    authorId: (await makeMember(knex)).id,
    machineIds: [world.machines[0]!.id],
    cautions: [{ kind: 'mains' }, { kind: 'laser' }, { kind: 'mains', detail: 'twice' }],
  });
});
afterAll(async () => {
  await knex.destroy();
  await closeDb();
});

async function note(memberId: number, shopName: string | null, over: Record<string, unknown> = {}): Promise<string> {
  const result = await createHandoverNote({ id: memberId, shopName }, handoverNoteInputSchema.parse({ fix: fix.slug, ...over }));
  if (!result.ok) throw new Error(result.message);
  return result.code;
}

describe('createHandoverNote', () => {
  it('gives a 10-character code from the unambiguous alphabet, pinned to the live revision', async () => {
    const code = await note(shop.id, 'Kestrel Lane Repairs');
    expect(code).toMatch(new RegExp(`^[${HANDOVER_ALPHABET}]{10}$`));
    const row = await knex('handover_notes').where({ code }).first();
    expect(row.revision_id).toBe(fix.revisionIds.at(-1));
  });

  it('takes the account’s shop name unless the member gives another', async () => {
    const byDefault = await findPublicNote(await note(shop.id, 'Kestrel Lane Repairs'));
    expect(byDefault.state === 'found' && byDefault.note.shopName).toBe('Kestrel Lane Repairs');
    const given = await findPublicNote(await note(shop.id, 'Kestrel Lane Repairs', { shopName: 'Mobile bench, market stall 4' }));
    expect(given.state === 'found' && given.note.shopName).toBe('Mobile bench, market stall 4');
  });

  it('refuses another member’s job sheet and a revision that was never proofed, field by field', async () => {
    const other = await makeMember(knex);
    const job = await createJobSheet(other.id, jobSheetCreateSchema.parse({ customerRef: 'Not yours' }));
    const jobId = job.ok ? job.value : -1;
    const refused = await createHandoverNote(
      { id: shop.id, shopName: null },
      handoverNoteInputSchema.parse({ fix: fix.slug, jobSheetId: jobId }),
    );
    expect(refused).toMatchObject({ ok: false, code: 'bad_request', fields: { jobSheetId: ['Choose one of your own job sheets.'] } });
    const noRevision = await createHandoverNote(
      { id: shop.id, shopName: null },
      handoverNoteInputSchema.parse({ fix: fix.slug, revision: 9 }),
    );
    expect(noRevision).toMatchObject({ ok: false, fields: { revision: ['The fix has no proofed revision r9.'] } });
  });

  it('writes the one-line text for an invoice with the public address', async () => {
    expect(invoiceLine('ABCDE23456')).toMatch(/^Repair notes: https?:\/\/[^ ]+\/n\/ABCDE23456$/);
  });
});

describe('findPublicNote', () => {
  it('keeps showing the pinned revision after the fix changes', async () => {
    const changing = await makeFix(knex, { authorId: (await makeMember(knex)).id, machineIds: [world.machines[0]!.id] });
    const created = await createHandoverNote(
      { id: shop.id, shopName: null },
      handoverNoteInputSchema.parse({ fix: changing.slug, partsReplaced: ['Drive belt', 'Idler tyre'] }),
    );
    const code = created.ok ? created.code : '';
    await proofNewRevision(knex, changing, shop.id);
    const found = await findPublicNote(code);
    expect(found.state).toBe('found');
    if (found.state !== 'found') return;
    expect(found.note.fix).toMatchObject({
      revisionNumber: 1,
      permalink: `/fixes/${changing.slug}/r/1`,
      hasNewerRevision: true,
      readable: true,
    });
    expect(found.note.fix.symptoms[0]).toBe('Symptom seen in r1');
    expect(found.note.partsReplaced).toEqual(['Drive belt', 'Idler tyre']);
  });

  it('lists each caution kind once', async () => {
    const found = await findPublicNote(await note(shop.id, null));
    expect(found.state === 'found' && found.note.fix.cautionKinds).toEqual(['mains', 'laser']);
  });

  it('finds nothing for a guessed or malformed code, and reads a code typed in lower case with a space', async () => {
    expect(await findPublicNote('ZZZZZ22222')).toEqual({ state: 'not_found' });
    expect(await findPublicNote('not a code')).toEqual({ state: 'not_found' });
    const code = await note(shop.id, null);
    const typed = `${code.slice(0, 5).toLowerCase()} ${code.slice(5)}`;
    expect((await findPublicNote(typed)).state).toBe('found');
  });

  it('shows job details only when the member chose to include them, and none once the job sheet is deleted', async () => {
    const job = await createJobSheet(
      shop.id,
      jobSheetCreateSchema.parse({
        customerRef: 'Invoice 5521',
        machine: world.machines[0]!.slug,
        serialNumber: 'SN-77812',
        findings: 'Belt had stretched and glazed.',
      }),
    );
    const jobId = job.ok ? job.value : -1;
    const withDetails = await note(shop.id, null, { jobSheetId: jobId, includeJobDetails: true });
    const without = await note(shop.id, null, { jobSheetId: jobId });
    const shown = await findPublicNote(withDetails);
    expect(shown.state === 'found' && shown.note.job).toMatchObject({
      serialNumber: 'SN-77812',
      findings: 'Belt had stretched and glazed.',
    });
    expect(JSON.stringify(shown)).not.toContain('Invoice 5521');
    const hidden = await findPublicNote(without);
    expect(hidden.state === 'found' && hidden.note.job).toBeNull();

    expect(await deleteJobSheet(shop.id, jobId)).toBe(true);
    const afterDelete = await findPublicNote(withDetails);
    expect(afterDelete.state).toBe('found');
    expect(afterDelete.state === 'found' && afterDelete.note.job).toBeNull();
    expect((await knex('handover_notes').where({ code: withDetails }).first('job_sheet_id')).job_sheet_id).toBeNull();
  });
});

describe('revokeNote', () => {
  it('lets only the owner revoke; a revoked code then says so', async () => {
    const code = await note(shop.id, null);
    const stranger = await makeMember(knex);
    expect(await revokeNote(stranger.id, code)).toBe('not_found');
    expect(await getOwnNote(stranger.id, code)).toBeNull();
    expect(await revokeNote(shop.id, code)).toBe('revoked');
    expect(await revokeNote(shop.id, code)).toBe('already_revoked');
    const found = await findPublicNote(code);
    expect(found.state).toBe('revoked');
    expect(JSON.stringify(found)).not.toContain('Symptom');
  });
});

describe('listOwnNotes', () => {
  it('lists only the member’s own notes, with the address and the invoice line', async () => {
    const member = await makeMember(knex);
    const code = await note(member.id, null);
    const notes = await listOwnNotes(member.id);
    expect(notes.map((n) => n.code)).toEqual([code]);
    expect(notes[0]?.invoiceLine).toBe(`Repair notes: ${notes[0]?.url}`);
  });
});
