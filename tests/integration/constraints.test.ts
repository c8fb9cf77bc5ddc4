// The database itself refuses data that breaks the rules, whatever code wrote it.
import { afterAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';

const knex = testDb();
afterAll(() => knex.destroy());

/** Runs a statement in a transaction that is always rolled back, and returns the error it raised. */
async function violation(run: (trx: typeof knex) => Promise<unknown>): Promise<string> {
  try {
    await knex.transaction(async (trx) => {
      await run(trx as unknown as typeof knex);
      throw new Error('no violation');
    });
  } catch (error) {
    return (error as { constraint?: string; message: string }).constraint ?? (error as Error).message;
  }
  return 'no violation';
}

describe('schema constraints', () => {
  it('refuses a role that does not exist', async () => {
    expect(await violation((t) => t('users').insert({ email: 'x@example.test', role: 'overlord' }))).toBe('users_role_check');
  });

  it('refuses a submitted revision without a symptom', async () => {
    const fix = await knex('fixes').first('id', 'created_by');
    expect(
      await violation((t) =>
        t('revisions').insert({
          fix_id: fix.id,
          number: 999,
          author_id: fix.created_by,
          title: 'T',
          body: '{"type":"doc","content":[]}',
          state: 'submitted',
          symptoms: [],
        }),
      ),
    ).toBe('revisions_symptoms_check');
  });

  it('refuses a proofed revision proofed by its own author', async () => {
    const fix = await knex('fixes').first('id', 'created_by');
    expect(
      await violation((t) =>
        t('revisions').insert({
          fix_id: fix.id,
          number: 998,
          author_id: fix.created_by,
          proofer_id: fix.created_by,
          proofed_at: new Date(),
          title: 'T',
          body: '{"type":"doc","content":[]}',
          state: 'proofed',
          symptoms: ['x'],
        }),
      ),
    ).toBe('revisions_own_proof_check');
  });

  it('refuses a second bench report by the same member for the same fix and machine', async () => {
    const report = await knex('bench_reports').first();
    expect(
      await violation((t) =>
        t('bench_reports').insert({
          fix_id: report.fix_id,
          revision_id: report.revision_id,
          machine_id: report.machine_id,
          member_id: report.member_id,
          outcome: 'fixed',
        }),
      ),
    ).toBe('bench_reports_fix_id_member_id_machine_id_unique');
  });

  it('refuses a hand-over code with ambiguous characters', async () => {
    const report = await knex('bench_reports').first();
    expect(
      await violation((t) =>
        t('handover_notes').insert({
          code: 'ABCDEFGH10',
          fix_id: report.fix_id,
          revision_id: report.revision_id,
          member_id: report.member_id,
        }),
      ),
    ).toBe('handover_notes_code_check');
  });

  it('refuses a machine model code that is not normalised', async () => {
    const maker = await knex('makers').first('id');
    expect(
      await violation((t) =>
        t('machines').insert({
          slug: 'x-1',
          maker_id: maker.id,
          model_number: 'X-1',
          model_code: 'X-1',
          region: 'PAL',
          device_type: 'vcr',
        }),
      ),
    ).toBe('machines_model_code_check');
  });
});
