// Extensions and an immutable unaccent wrapper, so generated search columns may use it.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.raw('CREATE EXTENSION IF NOT EXISTS pg_trgm');
  await knex.raw('CREATE EXTENSION IF NOT EXISTS unaccent');
  // unaccent() is only STABLE (its dictionary could change); generated columns need IMMUTABLE.
  await knex.raw(`
    CREATE OR REPLACE FUNCTION benchlore_unaccent(text) RETURNS text
    LANGUAGE sql IMMUTABLE PARALLEL SAFE STRICT
    AS $$ SELECT public.unaccent('public.unaccent'::regdictionary, $1) $$`);
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('DROP FUNCTION IF EXISTS benchlore_unaccent(text)');
  // The extensions stay: other databases objects may use them, and they are harmless.
}
