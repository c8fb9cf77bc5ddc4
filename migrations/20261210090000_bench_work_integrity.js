// Bench work integrity: a report's, note's or job's revision must belong to its fix; indexes for "my notes" and "my reports".
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  // (id, fix_id) is unique because id is; the constraint lets the tables below point at both together.
  await knex.raw('ALTER TABLE revisions ADD CONSTRAINT revisions_id_fix_unique UNIQUE (id, fix_id)');
  for (const table of ['bench_reports', 'handover_notes', 'job_sheet_fixes']) {
    await knex.raw(
      `ALTER TABLE ${table} ADD CONSTRAINT ${table}_revision_of_fix_fk
         FOREIGN KEY (revision_id, fix_id) REFERENCES revisions (id, fix_id) ON DELETE CASCADE`,
    );
  }
  await knex.raw('CREATE INDEX bench_reports_member_idx ON bench_reports (member_id, updated_at DESC)');
  await knex.raw('CREATE INDEX handover_notes_member_idx ON handover_notes (member_id, created_at DESC)');
  await knex.raw('CREATE INDEX handover_notes_job_idx ON handover_notes (job_sheet_id) WHERE job_sheet_id IS NOT NULL');
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('DROP INDEX IF EXISTS handover_notes_job_idx');
  await knex.raw('DROP INDEX IF EXISTS handover_notes_member_idx');
  await knex.raw('DROP INDEX IF EXISTS bench_reports_member_idx');
  for (const table of ['job_sheet_fixes', 'handover_notes', 'bench_reports']) {
    await knex.raw(`ALTER TABLE ${table} DROP CONSTRAINT IF EXISTS ${table}_revision_of_fix_fk`);
  }
  await knex.raw('ALTER TABLE revisions DROP CONSTRAINT IF EXISTS revisions_id_fix_unique');
}
