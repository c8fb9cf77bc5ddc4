// Accounts: users with roles and suspension, the Auth.js tables, our own single-use tokens, rate limits.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('users', (t) => {
    t.increments('id');
    t.text('name');
    t.text('email').notNullable();
    t.timestamp('emailVerified', { useTz: true });
    t.text('image');
    t.text('shop_name');
    t.text('password_hash');
    t.text('role').notNullable().defaultTo('member');
    t.timestamp('suspended_at', { useTz: true });
    t.text('suspended_reason');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('deleted_at', { useTz: true });
    t.check(`role IN ('member', 'editor', 'moderator', 'admin')`, [], 'users_role_check');
    t.check(`email = lower(email) AND email LIKE '%_@_%'`, [], 'users_email_check');
  });
  await knex.raw('CREATE UNIQUE INDEX users_email_unique ON users (email)');

  // Auth.js tables, with the column names @auth/pg-adapter expects.
  await knex.schema.createTable('accounts', (t) => {
    t.increments('id');
    t.integer('userId').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.string('type', 255).notNullable();
    t.string('provider', 255).notNullable();
    t.string('providerAccountId', 255).notNullable();
    t.text('refresh_token');
    t.text('access_token');
    t.bigInteger('expires_at');
    t.text('id_token');
    t.text('scope');
    t.text('session_state');
    t.text('token_type');
    t.unique(['provider', 'providerAccountId']);
  });
  await knex.schema.createTable('sessions', (t) => {
    t.increments('id');
    t.integer('userId').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.timestamp('expires', { useTz: true }).notNullable();
    t.string('sessionToken', 255).notNullable().unique();
  });
  await knex.schema.createTable('verification_token', (t) => {
    t.text('identifier').notNullable();
    t.timestamp('expires', { useTz: true }).notNullable();
    t.text('token').notNullable();
    t.primary(['identifier', 'token']);
  });

  // Our own tokens for e-mail verification and password reset: stored hashed, single use, expiring.
  await knex.schema.createTable('user_tokens', (t) => {
    t.increments('id');
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('purpose').notNullable();
    t.text('token_hash').notNullable().unique();
    t.timestamp('expires_at', { useTz: true }).notNullable();
    t.timestamp('used_at', { useTz: true });
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check(`purpose IN ('verify_email', 'reset_password')`, [], 'user_tokens_purpose_check');
  });

  // rate-limiter-flexible's PostgreSQL store (shared by every app instance).
  await knex.schema.createTable('rate_limits', (t) => {
    t.string('key', 255).primary();
    t.integer('points').notNullable().defaultTo(0);
    t.bigInteger('expire');
  });
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  for (const table of ['rate_limits', 'user_tokens', 'verification_token', 'sessions', 'accounts', 'users']) {
    await knex.schema.dropTableIfExists(table);
  }
}
