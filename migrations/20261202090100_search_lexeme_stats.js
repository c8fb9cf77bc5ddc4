// Search: how many fixes hold each lexeme (anywhere, and in the title or symptoms), to choose how candidates are read.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('search_lexemes', (t) => {
    t.text('lexeme').primary();
    /** Fixes whose document holds the lexeme. */
    t.integer('ndoc').notNullable().defaultTo(0);
    /** Fixes whose title or symptoms hold it. */
    t.integer('ndoc_summary').notNullable().defaultTo(0);
  });
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.schema.dropTableIfExists('search_lexemes');
}
