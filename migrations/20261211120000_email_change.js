// Accounts: changing the e-mail address. The token confirming a new address carries that address, so the
// change happens only once the new mailbox has answered.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.alterTable('user_tokens', (t) => {
    t.text('new_email');
  });
  await knex.raw('ALTER TABLE user_tokens DROP CONSTRAINT user_tokens_purpose_check');
  await knex.raw(
    `ALTER TABLE user_tokens ADD CONSTRAINT user_tokens_purpose_check CHECK (purpose IN ('verify_email', 'reset_password', 'change_email'))`,
  );
  // A change token always names its address, in the users table's own form; other tokens never do.
  await knex.raw(
    `ALTER TABLE user_tokens ADD CONSTRAINT user_tokens_new_email_check CHECK (
       (purpose = 'change_email') = (new_email IS NOT NULL) AND (new_email IS NULL OR (new_email = lower(new_email) AND new_email LIKE '%_@_%')))`,
  );
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex('user_tokens').where({ purpose: 'change_email' }).delete();
  await knex.raw('ALTER TABLE user_tokens DROP CONSTRAINT user_tokens_new_email_check');
  await knex.raw('ALTER TABLE user_tokens DROP CONSTRAINT user_tokens_purpose_check');
  await knex.raw(`ALTER TABLE user_tokens ADD CONSTRAINT user_tokens_purpose_check CHECK (purpose IN ('verify_email', 'reset_password'))`);
  await knex.schema.alterTable('user_tokens', (t) => {
    t.dropColumn('new_email');
  });
}
