// A change counter for search results, so an anonymous search page can be kept and validated like the other public
// pages. Results are read from the search tables, not from the ones the "fixes" counter watches: the search row, the
// words and codes a query is corrected and matched against, and the word families it widens through. Each of them
// raises "search" in the same transaction as its change, so a kept result can never outlive the rows it came from.
const searchTables = ['fix_search', 'search_words', 'search_lexemes', 'search_codes', 'word_families'];
const scopesBefore = ['catalogue', 'fixes', 'bench', 'photos', 'people'];

/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.raw('ALTER TABLE page_versions DROP CONSTRAINT page_versions_scope_check');
  await knex.raw(
    `ALTER TABLE page_versions ADD CONSTRAINT page_versions_scope_check CHECK (scope IN (${[...scopesBefore, 'search'].map((s) => `'${s}'`).join(', ')}))`,
  );
  await knex('page_versions').insert({ scope: 'search' });
  for (const table of searchTables) {
    await knex.raw(
      `CREATE TRIGGER ${table}_search_version AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON ${table}
         FOR EACH STATEMENT EXECUTE FUNCTION bump_page_version('search')`,
    );
  }
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  for (const table of searchTables) await knex.raw(`DROP TRIGGER ${table}_search_version ON ${table}`);
  await knex('page_versions').where({ scope: 'search' }).delete();
  await knex.raw('ALTER TABLE page_versions DROP CONSTRAINT page_versions_scope_check');
  await knex.raw(
    `ALTER TABLE page_versions ADD CONSTRAINT page_versions_scope_check CHECK (scope IN (${scopesBefore.map((s) => `'${s}'`).join(', ')}))`,
  );
}
