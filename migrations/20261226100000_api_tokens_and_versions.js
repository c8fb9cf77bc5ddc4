// Personal API tokens (stored only as a hash) and a version number on hand-over notes (job sheets have theirs
// since 20261225100000), so a program's update never overwrites an edit made in the browser meanwhile (If-Match / ETag).
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('api_tokens', (t) => {
    t.increments('id');
    // Deleting the account deletes its tokens.
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('name').notNullable();
    t.specificType('scopes', 'text[]').notNullable();
    // The first characters after the prefix, shown beside the name so a member can tell tokens apart.
    t.text('hint').notNullable();
    t.text('token_hash').notNullable().unique();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_used_at', { useTz: true });
    t.timestamp('revoked_at', { useTz: true });
    t.check(`length(btrim(name)) BETWEEN 1 AND 60`, [], 'api_tokens_name_check');
    t.check(`cardinality(scopes) > 0 AND scopes <@ ARRAY['read', 'bench_work', 'order_list']::text[]`, [], 'api_tokens_scopes_check');
    t.check(`token_hash ~ '^[0-9a-f]{64}$'`, [], 'api_tokens_hash_check');
  });
  await knex.raw('CREATE INDEX api_tokens_user_idx ON api_tokens (user_id)');

  for (const table of ['handover_notes']) {
    await knex.schema.alterTable(table, (t) => {
      t.integer('version').notNullable().defaultTo(1);
    });
    // Every update counts, whichever code path makes it.
    await knex.raw(`
      CREATE FUNCTION ${table}_bump_version() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        NEW.version := OLD.version + 1;
        RETURN NEW;
      END $$`);
    await knex.raw(`CREATE TRIGGER ${table}_version BEFORE UPDATE ON ${table} FOR EACH ROW EXECUTE FUNCTION ${table}_bump_version()`);
  }
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  for (const table of ['handover_notes']) {
    await knex.raw(`DROP TRIGGER ${table}_version ON ${table}`);
    await knex.raw(`DROP FUNCTION ${table}_bump_version()`);
    await knex.schema.alterTable(table, (t) => {
      t.dropColumn('version');
    });
  }
  await knex.schema.dropTable('api_tokens');
}
