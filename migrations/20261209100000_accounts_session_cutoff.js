// Accounts: a per-user cut-off that ends every session issued before it (password change, "sign out everywhere").
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.alterTable('users', (t) => {
    /** Session tokens issued before this moment are refused by the middleware. */
    t.timestamp('sessions_valid_after', { useTz: true });
  });
  // Finding a member's live tokens when issuing a new one, and clearing them when the account goes.
  await knex.raw('CREATE INDEX user_tokens_user_purpose_idx ON user_tokens (user_id, purpose) WHERE used_at IS NULL');
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.raw('DROP INDEX IF EXISTS user_tokens_user_purpose_idx');
  await knex.schema.alterTable('users', (t) => {
    t.dropColumn('sessions_valid_after');
  });
}
