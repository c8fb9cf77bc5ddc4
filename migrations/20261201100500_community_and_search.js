// Moderation and search: word families, content reports, the audit log, missed searches, the search table.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('word_families', (t) => {
    t.increments('id');
    t.text('name').notNullable().unique();
    t.specificType('terms', 'text[]').notNullable();
    t.integer('created_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('retired_at', { useTz: true });
    t.check('cardinality(terms) >= 2', [], 'word_families_terms_check');
  });

  await knex.schema.createTable('reports', (t) => {
    t.increments('id');
    t.integer('fix_id').notNullable().references('id').inTable('fixes').onDelete('CASCADE');
    t.integer('reporter_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('reason').notNullable();
    t.text('detail').notNullable().defaultTo('');
    t.text('state').notNullable().defaultTo('open');
    t.integer('resolved_by').references('id').inTable('users').onDelete('SET NULL');
    t.text('resolution_note');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('resolved_at', { useTz: true });
    t.check(`reason IN ('wrong', 'dangerous', 'spam', 'duplicate')`, [], 'reports_reason_check');
    t.check(`state IN ('open', 'resolved', 'dismissed')`, [], 'reports_state_check');
  });
  await knex.raw(`CREATE INDEX reports_open_idx ON reports (created_at) WHERE state = 'open'`);

  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id');
    t.integer('actor_id').references('id').inTable('users').onDelete('SET NULL');
    t.text('action').notNullable();
    t.text('subject_type').notNullable();
    t.text('subject_id').notNullable();
    t.jsonb('detail').notNullable().defaultTo('{}');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw('CREATE INDEX audit_log_subject_idx ON audit_log (subject_type, subject_id, created_at DESC)');

  // Searches that found nothing: the query and machine only, no personal data.
  await knex.schema.createTable('search_misses', (t) => {
    t.increments('id');
    t.text('query_norm').notNullable();
    t.text('query_text').notNullable();
    t.integer('machine_id').references('id').inTable('machines').onDelete('CASCADE');
    t.integer('count').notNullable().defaultTo(1);
    t.timestamp('first_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('last_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });
  await knex.raw('CREATE UNIQUE INDEX search_misses_unique ON search_misses (query_norm, coalesce(machine_id, 0))');

  // One row per live fix, rewritten when a revision is proofed: what the PostgreSQL provider searches.
  await knex.schema.createTable('fix_search', (t) => {
    t.integer('fix_id').primary().references('id').inTable('fixes').onDelete('CASCADE');
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.text('title').notNullable();
    t.text('symptoms').notNullable().defaultTo('');
    t.text('cause').notNullable().defaultTo('');
    t.text('remedy').notNullable().defaultTo('');
    t.text('parts').notNullable().defaultTo('');
    /** Normalised machine codes, part values and error codes, space separated ("dr4120k e21"). */
    t.text('codes').notNullable().defaultTo('');
    t.specificType('maker_ids', 'integer[]').notNullable().defaultTo('{}');
    t.specificType('machine_ids', 'integer[]').notNullable().defaultTo('{}');
    t.specificType('chassis_ids', 'integer[]').notNullable().defaultTo('{}');
    t.specificType('device_types', 'text[]').notNullable().defaultTo('{}');
    t.specificType('formats', 'text[]').notNullable().defaultTo('{}');
    t.specificType('caution_kinds', 'text[]').notNullable().defaultTo('{}');
    t.boolean('has_photos').notNullable().defaultTo(false);
    t.double('bench_score');
    t.integer('report_count').notNullable().defaultTo(0);
    t.timestamp('proofed_at', { useTz: true }).notNullable();
  });
  await knex.raw(`
    ALTER TABLE fix_search ADD COLUMN document tsvector GENERATED ALWAYS AS (
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(title, '') || ' ' || coalesce(symptoms, ''))), 'A') ||
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(cause, ''))), 'B') ||
      setweight(to_tsvector('english', benchlore_unaccent(coalesce(remedy, '') || ' ' || coalesce(parts, ''))), 'C')
    ) STORED`);
  await knex.raw('CREATE INDEX fix_search_document_idx ON fix_search USING gin (document)');
  await knex.raw('CREATE INDEX fix_search_codes_trgm ON fix_search USING gin (codes gin_trgm_ops)');
  await knex.raw('CREATE INDEX fix_search_title_trgm ON fix_search USING gin (title gin_trgm_ops)');
  await knex.raw('CREATE INDEX fix_search_machines_idx ON fix_search USING gin (machine_ids)');
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  for (const table of ['fix_search', 'search_misses', 'audit_log', 'reports', 'word_families']) {
    await knex.schema.dropTableIfExists(table);
  }
}
