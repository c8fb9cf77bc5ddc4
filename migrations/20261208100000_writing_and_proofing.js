// Writing and proofing: amendments, withdrawals, a guard on revisions past draft, photo processing, report dedupe.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.alterTable('revisions', (t) => {
    /** The returned or submitted revision this one continues (an author's amendment or a moderator's). */
    t.integer('amends_revision_id').references('id').inTable('revisions').onDelete('SET NULL');
    t.timestamp('withdrawn_at', { useTz: true });
  });
  // One open draft per author per fix: the editor always resumes it rather than starting a second.
  await knex.raw(`CREATE UNIQUE INDEX revisions_one_draft_idx ON revisions (fix_id, author_id) WHERE state = 'draft'`);

  // A revision past draft is never changed in place, and moves only along draft → submitted → proofed | returned
  // (or withdrawn). Foreign keys that SET NULL (parent, amends, proofer) are left out so deletes still cascade.
  await knex.raw(`
    CREATE FUNCTION benchlore_revisions_guard() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF OLD.state <> 'draft' AND (
        NEW.fix_id, NEW.number, NEW.author_id, NEW.title, NEW.body, NEW.symptoms, NEW.error_codes, NEW.cause,
        NEW.parts, NEW.readings, NEW.cautions, NEW.difficulty, NEW.time_minutes, NEW.edit_summary
      ) IS DISTINCT FROM (
        OLD.fix_id, OLD.number, OLD.author_id, OLD.title, OLD.body, OLD.symptoms, OLD.error_codes, OLD.cause,
        OLD.parts, OLD.readings, OLD.cautions, OLD.difficulty, OLD.time_minutes, OLD.edit_summary
      ) THEN
        RAISE EXCEPTION 'revision % is %, and a revision past draft is never changed in place', OLD.id, OLD.state
          USING ERRCODE = 'check_violation', CONSTRAINT = 'revisions_frozen_check';
      END IF;
      IF NEW.state <> OLD.state AND NOT (
        (OLD.state = 'draft' AND NEW.state IN ('submitted', 'withdrawn')) OR
        (OLD.state = 'submitted' AND NEW.state IN ('proofed', 'returned', 'withdrawn'))
      ) THEN
        RAISE EXCEPTION 'revision % cannot move from % to %', OLD.id, OLD.state, NEW.state
          USING ERRCODE = 'check_violation', CONSTRAINT = 'revisions_transition_check';
      END IF;
      RETURN NEW;
    END $$`);
  await knex.raw('CREATE TRIGGER revisions_guard BEFORE UPDATE ON revisions FOR EACH ROW EXECUTE FUNCTION benchlore_revisions_guard()');

  // Renditions are made off the request path: the upload's bytes wait here (never in public storage) until then.
  await knex.schema.alterTable('photos', (t) => {
    t.text('processing_state').notNullable().defaultTo('ready');
    t.text('processing_error');
    t.smallint('processing_attempts').notNullable().defaultTo(0);
    t.check(`processing_state IN ('pending', 'ready', 'failed')`, [], 'photos_processing_state_check');
  });
  await knex.raw(`CREATE INDEX photos_pending_idx ON photos (created_at) WHERE processing_state = 'pending'`);
  await knex.schema.createTable('photo_uploads', (t) => {
    t.integer('photo_id').primary().references('id').inTable('photos').onDelete('CASCADE');
    t.binary('bytes').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
  });

  // A member reports a fix for a given reason once while that report is open.
  await knex.raw(`CREATE UNIQUE INDEX reports_one_open_idx ON reports (fix_id, reporter_id, reason) WHERE state = 'open'`);
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('DROP INDEX IF EXISTS reports_one_open_idx');
  await knex.schema.dropTableIfExists('photo_uploads');
  await knex.raw('DROP INDEX IF EXISTS photos_pending_idx');
  await knex.schema.alterTable('photos', (t) => {
    t.dropChecks(['photos_processing_state_check']);
    t.dropColumn('processing_state');
    t.dropColumn('processing_error');
    t.dropColumn('processing_attempts');
  });
  await knex.raw('DROP TRIGGER IF EXISTS revisions_guard ON revisions');
  await knex.raw('DROP FUNCTION IF EXISTS benchlore_revisions_guard()');
  await knex.raw('DROP INDEX IF EXISTS revisions_one_draft_idx');
  await knex.schema.alterTable('revisions', (t) => {
    t.dropColumn('amends_revision_id');
    t.dropColumn('withdrawn_at');
  });
}
