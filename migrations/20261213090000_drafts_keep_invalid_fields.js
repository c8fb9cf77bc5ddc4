// Drafts keep everything typed: a field that fails its check is held as typed (and submission waits for it), and a
// draft given up before it had a title or a symptom can still be withdrawn.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.alterTable('revisions', (t) => {
    /** Fields held as typed by dotted path ("timeMinutes", "parts.2.quantity"): { typed, message }. */
    t.jsonb('held_fields').notNullable().defaultTo('{}');
    t.check(`jsonb_typeof(held_fields) = 'object'`, [], 'revisions_held_fields_check');
    // Only work in progress holds fields: nothing goes to the desk with a field still to fix.
    t.check(`state IN ('draft', 'withdrawn') OR held_fields = '{}'::jsonb`, [], 'revisions_held_only_drafts_check');
  });
  await knex.raw('ALTER TABLE revisions DROP CONSTRAINT revisions_symptoms_check');
  await knex.raw(`ALTER TABLE revisions ADD CONSTRAINT revisions_symptoms_check
    CHECK (state IN ('draft', 'withdrawn') OR (cardinality(symptoms) >= 1 AND length(btrim(title)) > 0))`);
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('ALTER TABLE revisions DROP CONSTRAINT revisions_symptoms_check');
  // Drafts withdrawn before they had a title stay; the older rule applies to rows written from now on.
  await knex.raw(`ALTER TABLE revisions ADD CONSTRAINT revisions_symptoms_check
    CHECK (state = 'draft' OR (cardinality(symptoms) >= 1 AND length(btrim(title)) > 0)) NOT VALID`);
  await knex.schema.alterTable('revisions', (t) => {
    t.dropChecks(['revisions_held_fields_check', 'revisions_held_only_drafts_check']);
    t.dropColumn('held_fields');
  });
}
