// Search: machine words in the weighted document, a title+symptoms vector, code arrays, ranking indexes, vocabularies.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  // Maker names, model numbers, chassis codes and device types: words a technician types beside the symptom.
  await knex.raw(`ALTER TABLE fix_search ADD COLUMN machines_text text NOT NULL DEFAULT ''`);
  // Chassis families the fix names itself: such a fix applies to every machine of the family.
  await knex.raw(`ALTER TABLE fix_search ADD COLUMN direct_chassis_ids integer[] NOT NULL DEFAULT '{}'`);

  // A generated column's expression cannot be altered in place: drop the document and add it again.
  await knex.raw('DROP INDEX IF EXISTS fix_search_document_idx');
  await knex.raw('ALTER TABLE fix_search DROP COLUMN document');
  await knex.raw(`
    ALTER TABLE fix_search ADD COLUMN document tsvector GENERATED ALWAYS AS (
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(title, '') || ' ' || coalesce(symptoms, ''))), 'A') ||
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(cause, '') || ' ' || coalesce(machines_text, ''))), 'B') ||
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(remedy, '') || ' ' || coalesce(parts, ''))), 'C')
    ) STORED`);
  // Title and symptoms alone: small enough to stay in the row, so "matched in the title" costs no detoasting.
  await knex.raw(`
    ALTER TABLE fix_search ADD COLUMN doc_a tsvector GENERATED ALWAYS AS (
      to_tsvector('english', benchlore_unaccent(coalesce(title, '') || ' ' || coalesce(symptoms, '')))
    ) STORED`);
  await knex.raw(`ALTER TABLE fix_search ADD COLUMN code_list text[] GENERATED ALWAYS AS (string_to_array(codes, ' ')) STORED`);

  await knex.raw('CREATE INDEX fix_search_document_idx ON fix_search USING gin (document)');
  await knex.raw('CREATE INDEX fix_search_doc_a_idx ON fix_search USING gin (doc_a)');
  await knex.raw('CREATE INDEX fix_search_code_list_idx ON fix_search USING gin (code_list)');
  await knex.raw('CREATE INDEX fix_search_chassis_idx ON fix_search USING gin (chassis_ids)');
  await knex.raw('CREATE INDEX fix_search_direct_chassis_idx ON fix_search USING gin (direct_chassis_ids)');
  await knex.raw('CREATE INDEX fix_search_makers_idx ON fix_search USING gin (maker_ids)');
  // Candidates are taken best bench score first: broad queries walk this index instead of sorting every match.
  await knex.raw('CREATE INDEX fix_search_bench_order_idx ON fix_search (bench_score DESC NULLS LAST, fix_id)');

  // Words of the live fixes as written (unstemmed), with their English stem: for "did you mean" corrections.
  await knex.schema.createTable('search_words', (t) => {
    t.text('word').primary();
    t.text('stem').notNullable();
    t.integer('ndoc').notNullable().defaultTo(0);
  });
  await knex.raw('CREATE INDEX search_words_trgm ON search_words USING gin (word gin_trgm_ops)');
  await knex.raw('CREATE INDEX search_words_stem_idx ON search_words (stem)');
  await knex.raw('CREATE INDEX search_words_shape_idx ON search_words (left(word, 1), length(word))');

  // Normalised codes (machines, chassis, error codes, part references) with their digits, for exact-digit matching.
  await knex.schema.createTable('search_codes', (t) => {
    t.text('code').primary();
    /** The runs of digits joined by dots ("dr4120k" → "4120", "lderr3" → "3"). */
    t.text('digits').notNullable();
    t.integer('ndoc').notNullable().defaultTo(0);
  });
  await knex.raw('CREATE INDEX search_codes_digits_idx ON search_codes (digits)');
  await knex.raw('CREATE INDEX search_codes_trgm ON search_codes USING gin (code gin_trgm_ops)');
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.schema.dropTableIfExists('search_codes');
  await knex.schema.dropTableIfExists('search_words');
  for (const index of [
    'fix_search_bench_order_idx',
    'fix_search_makers_idx',
    'fix_search_direct_chassis_idx',
    'fix_search_chassis_idx',
    'fix_search_code_list_idx',
    'fix_search_doc_a_idx',
    'fix_search_document_idx',
  ]) {
    await knex.raw(`DROP INDEX IF EXISTS ${index}`);
  }
  await knex.raw('ALTER TABLE fix_search DROP COLUMN code_list');
  await knex.raw('ALTER TABLE fix_search DROP COLUMN doc_a');
  await knex.raw('ALTER TABLE fix_search DROP COLUMN document');
  await knex.raw(`
    ALTER TABLE fix_search ADD COLUMN document tsvector GENERATED ALWAYS AS (
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(title, '') || ' ' || coalesce(symptoms, ''))), 'A') ||
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(cause, ''))), 'B') ||
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(remedy, '') || ' ' || coalesce(parts, ''))), 'C')
    ) STORED`);
  await knex.raw('CREATE INDEX fix_search_document_idx ON fix_search USING gin (document)');
  await knex.raw('ALTER TABLE fix_search DROP COLUMN direct_chassis_ids');
  await knex.raw('ALTER TABLE fix_search DROP COLUMN machines_text');
}
