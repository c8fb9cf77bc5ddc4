// Search: the title-and-symptoms vector inside the bench-order index, so a walk best-score-first reads no table rows.
/*
  Broad and middling queries are answered by walking fixes best bench score first and testing each one's
  title and symptoms. Read from the table, each fix tested costs a random page; carried in the index beside
  its key, some forty fixes share a page. Rows with very long symptoms (a btree entry holds at most some
  2.7 kB) leave the copy empty and are tested from the table.
*/
const SUMMARY = `coalesce(title, '') || ' ' || coalesce(symptoms, '')`;
/** Text of at most this many bytes gives a vector that always fits a btree entry. */
const INLINE_TEXT_BYTES = 600;

/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.raw(`
    ALTER TABLE fix_search ADD COLUMN doc_a_inline tsvector GENERATED ALWAYS AS (
      CASE WHEN octet_length(${SUMMARY}) <= ${INLINE_TEXT_BYTES} THEN to_tsvector('english', benchlore_unaccent(${SUMMARY})) END
    ) STORED`);
  await knex.raw('DROP INDEX IF EXISTS fix_search_bench_order_idx');
  await knex.raw('CREATE INDEX fix_search_bench_walk_idx ON fix_search (bench_score DESC NULLS LAST, fix_id) INCLUDE (doc_a_inline)');
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('DROP INDEX IF EXISTS fix_search_bench_walk_idx');
  await knex.raw('CREATE INDEX fix_search_bench_order_idx ON fix_search (bench_score DESC NULLS LAST, fix_id)');
  await knex.raw('ALTER TABLE fix_search DROP COLUMN doc_a_inline');
}
