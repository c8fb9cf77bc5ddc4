// <purpose of this migration in one line>
/** @param {import('knex').Knex} knex */
export async function up(knex) {}

/** @param {import('knex').Knex} knex */
export async function down(knex) {}
