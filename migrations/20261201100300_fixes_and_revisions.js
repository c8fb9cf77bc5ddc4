// Fixes and their revisions (Tiptap JSON body in jsonb, structured fields), what each applies to, photos.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('fixes', (t) => {
    t.increments('id');
    t.text('slug').notNullable().unique();
    t.integer('created_by').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('locked_at', { useTz: true });
    t.integer('locked_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('hidden_at', { useTz: true });
    t.integer('hidden_by').references('id').inTable('users').onDelete('SET NULL');
    t.timestamp('deleted_at', { useTz: true });
    t.check(`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`, [], 'fixes_slug_check');
  });

  await knex.schema.createTable('revisions', (t) => {
    t.increments('id');
    t.integer('fix_id').notNullable().references('id').inTable('fixes').onDelete('CASCADE');
    t.integer('number').notNullable();
    /** The revision this one was written on top of: the base for the stale-edit check. */
    t.integer('parent_revision_id').references('id').inTable('revisions').onDelete('SET NULL');
    t.integer('author_id').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.text('title').notNullable();
    t.jsonb('body').notNullable();
    t.specificType('symptoms', 'text[]').notNullable().defaultTo('{}');
    t.specificType('error_codes', 'text[]').notNullable().defaultTo('{}');
    t.text('cause').notNullable().defaultTo('');
    t.jsonb('parts').notNullable().defaultTo('[]');
    t.jsonb('readings').notNullable().defaultTo('[]');
    t.jsonb('cautions').notNullable().defaultTo('[]');
    t.text('difficulty');
    t.integer('time_minutes');
    t.text('edit_summary').notNullable().defaultTo('');
    t.text('state').notNullable().defaultTo('draft');
    t.integer('proofer_id').references('id').inTable('users').onDelete('SET NULL');
    t.text('proof_note');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('submitted_at', { useTz: true });
    t.timestamp('proofed_at', { useTz: true });
    t.timestamp('returned_at', { useTz: true });
    t.unique(['fix_id', 'number']);
    t.check('number >= 1', [], 'revisions_number_check');
    t.check(`state IN ('draft', 'submitted', 'proofed', 'returned', 'withdrawn')`, [], 'revisions_state_check');
    t.check(`difficulty IS NULL OR difficulty IN ('routine', 'careful', 'skilled', 'specialist')`, [], 'revisions_difficulty_check');
    t.check('time_minutes IS NULL OR time_minutes BETWEEN 1 AND 10000', [], 'revisions_time_check');
    t.check(`jsonb_typeof(body) = 'object'`, [], 'revisions_body_check');
    t.check(
      `jsonb_typeof(parts) = 'array' AND jsonb_typeof(readings) = 'array' AND jsonb_typeof(cautions) = 'array'`,
      [],
      'revisions_lists_check',
    );
    // Anything past a draft must name at least one symptom and a title.
    t.check(`state = 'draft' OR (cardinality(symptoms) >= 1 AND length(btrim(title)) > 0)`, [], 'revisions_symptoms_check');
    t.check(`state <> 'proofed' OR (proofer_id IS NOT NULL AND proofed_at IS NOT NULL)`, [], 'revisions_proofed_check');
    t.check(`proofer_id IS NULL OR proofer_id <> author_id OR state <> 'proofed'`, [], 'revisions_own_proof_check');
  });
  await knex.raw('CREATE INDEX revisions_state_idx ON revisions (state, submitted_at)');
  await knex.raw('CREATE INDEX revisions_author_idx ON revisions (author_id)');

  await knex.schema.alterTable('fixes', (t) => {
    t.integer('current_revision_id').references('id').inTable('revisions').onDelete('SET NULL');
  });

  // What a revision applies to (edited and proofed with it) ...
  await knex.schema.createTable('revision_machines', (t) => {
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.integer('machine_id').notNullable().references('id').inTable('machines').onDelete('RESTRICT');
    t.primary(['revision_id', 'machine_id']);
  });
  await knex.schema.createTable('revision_chassis', (t) => {
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.integer('chassis_family_id').notNullable().references('id').inTable('chassis_families').onDelete('RESTRICT');
    t.primary(['revision_id', 'chassis_family_id']);
  });
  // ... and what the live fix applies to, rewritten when a revision is proofed (for fast catalogue reads).
  await knex.schema.createTable('fix_machines', (t) => {
    t.integer('fix_id').notNullable().references('id').inTable('fixes').onDelete('CASCADE');
    t.integer('machine_id').notNullable().references('id').inTable('machines').onDelete('CASCADE');
    t.primary(['fix_id', 'machine_id']);
  });
  await knex.raw('CREATE INDEX fix_machines_machine_idx ON fix_machines (machine_id)');
  await knex.schema.createTable('fix_chassis', (t) => {
    t.integer('fix_id').notNullable().references('id').inTable('fixes').onDelete('CASCADE');
    t.integer('chassis_family_id').notNullable().references('id').inTable('chassis_families').onDelete('CASCADE');
    t.primary(['fix_id', 'chassis_family_id']);
  });
  await knex.raw('CREATE INDEX fix_chassis_chassis_idx ON fix_chassis (chassis_family_id)');

  await knex.schema.createTable('photos', (t) => {
    t.increments('id');
    t.integer('owner_id').notNullable().references('id').inTable('users').onDelete('RESTRICT');
    t.text('storage_key').notNullable().unique();
    t.text('mime_type').notNullable();
    t.integer('byte_size').notNullable();
    t.integer('width').notNullable();
    t.integer('height').notNullable();
    t.specificType('sha256', 'char(64)').notNullable();
    /** [{ width, format, key, bytes }] once made; empty while renditions are pending. */
    t.jsonb('renditions').notNullable().defaultTo('[]');
    t.text('alt_text').notNullable();
    t.text('caption').notNullable().defaultTo('');
    t.boolean('is_illustration').notNullable().defaultTo(false);
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('deleted_at', { useTz: true });
    t.check(`mime_type IN ('image/jpeg', 'image/png', 'image/webp', 'image/avif')`, [], 'photos_mime_check');
    t.check('byte_size > 0 AND width > 0 AND height > 0', [], 'photos_size_check');
    t.check(`length(btrim(alt_text)) > 0`, [], 'photos_alt_check');
    t.check(`sha256 ~ '^[0-9a-f]{64}$'`, [], 'photos_sha_check');
  });
  await knex.raw('CREATE UNIQUE INDEX photos_sha256_unique ON photos (sha256) WHERE deleted_at IS NULL');

  await knex.schema.createTable('revision_photos', (t) => {
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.integer('photo_id').notNullable().references('id').inTable('photos').onDelete('RESTRICT');
    t.smallint('position').notNullable().defaultTo(0);
    t.primary(['revision_id', 'photo_id']);
  });
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  for (const table of ['revision_photos', 'photos', 'fix_chassis', 'fix_machines', 'revision_chassis', 'revision_machines']) {
    await knex.schema.dropTableIfExists(table);
  }
  await knex.schema.alterTable('fixes', (t) => t.dropColumn('current_revision_id'));
  await knex.schema.dropTableIfExists('revisions');
  await knex.schema.dropTableIfExists('fixes');
}
