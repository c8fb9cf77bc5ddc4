// A job sheet carries a version: every change to its row counts it up, so a device that edited an older copy
// (offline, or in another tab) is told the sheet changed meanwhile instead of overwriting it unseen.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.alterTable('job_sheets', (t) => {
    t.integer('version').notNullable().defaultTo(1);
    t.check('version >= 1', [], 'job_sheets_version_check');
  });
  // In the database, so every write (the form, the API, parts taken from the order list, a fix applied) counts.
  await knex.raw(`CREATE FUNCTION job_sheets_count_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      NEW.version := OLD.version + 1;
      RETURN NEW;
    END $$`);
  await knex.raw(`CREATE TRIGGER job_sheets_version BEFORE UPDATE ON job_sheets
    FOR EACH ROW EXECUTE FUNCTION job_sheets_count_version()`);
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('DROP TRIGGER job_sheets_version ON job_sheets');
  await knex.raw('DROP FUNCTION job_sheets_count_version()');
  await knex.schema.alterTable('job_sheets', (t) => {
    t.dropChecks(['job_sheets_version_check']);
    t.dropColumn('version');
  });
}
