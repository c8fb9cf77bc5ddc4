// Change counters for the public pages' caches and validators: one number per kind of content, raised by triggers in
// the same transaction as the change, so an ETag or a kept render derived from them can never outlive the text.
//   catalogue: makers, chassis families, machines
//   fixes:     which revision is live, locks and hiding, what a revision applies to, its photos
//   bench:     bench reports (bench scores, the notes other benches left, fault statistics)
//   photos:    photo renditions, alt text and captions
//   people:    the names shown beside revisions
const scopes = {
  catalogue: ['makers', 'chassis_families', 'machines'],
  fixes: ['fixes', 'revision_machines', 'revision_chassis', 'fix_machines', 'fix_chassis', 'revision_photos'],
  bench: ['bench_reports'],
  photos: ['photos'],
};

/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('page_versions', (t) => {
    t.text('scope').primary();
    t.bigInteger('version').notNullable().defaultTo(1);
    t.check(`scope IN ('catalogue', 'fixes', 'bench', 'photos', 'people')`, [], 'page_versions_scope_check');
  });
  await knex('page_versions').insert(['catalogue', 'fixes', 'bench', 'photos', 'people'].map((scope) => ({ scope })));
  await knex.raw(`
    CREATE FUNCTION bump_page_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE page_versions SET version = version + 1 WHERE scope = TG_ARGV[0];
      RETURN NULL;
    END $$`);
  for (const [scope, tables] of Object.entries(scopes)) {
    for (const table of tables) {
      await knex.raw(
        `CREATE TRIGGER ${table}_page_version AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ${table}
           FOR EACH STATEMENT EXECUTE FUNCTION bump_page_version('${scope}')`,
      );
    }
  }
  // Only a change of the name shown (or an account's deletion) touches public pages, not every sign-in.
  await knex.raw(`CREATE TRIGGER users_page_version AFTER UPDATE OF name, deleted_at OR DELETE ON users
    FOR EACH STATEMENT EXECUTE FUNCTION bump_page_version('people')`);
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('DROP TRIGGER users_page_version ON users');
  for (const tables of Object.values(scopes)) {
    for (const table of tables) await knex.raw(`DROP TRIGGER ${table}_page_version ON ${table}`);
  }
  await knex.raw('DROP FUNCTION bump_page_version()');
  await knex.schema.dropTable('page_versions');
}
