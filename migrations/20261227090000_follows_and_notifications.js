// Following machines, chassis families, makers and fixes; what is news for each member; how each kind reaches them.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('follows', (t) => {
    t.increments('id');
    // Deleting an account deletes what it followed.
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('target_kind').notNullable();
    t.integer('target_id').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['user_id', 'target_kind', 'target_id']);
    t.check(`target_kind IN ('machine', 'chassis', 'maker', 'fix')`, [], 'follows_target_kind_check');
  });
  // Fan-out reads followers of one target, in user order (keyset batches).
  await knex.raw('CREATE INDEX follows_target_idx ON follows (target_kind, target_id, user_id)');

  await knex.schema.createTable('notification_events', (t) => {
    t.bigIncrements('id');
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('kind').notNullable();
    /** What caused it, e.g. "proofed:r812"; with user_id it makes recording idempotent. */
    t.text('cause_key').notNullable();
    t.integer('fix_id').references('id').inTable('fixes').onDelete('CASCADE');
    t.text('title').notNullable();
    t.text('line').notNullable().defaultTo('');
    t.text('path').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('read_at', { useTz: true });
    t.timestamp('mailed_at', { useTz: true });
    t.unique(['user_id', 'cause_key']);
    t.check(
      `kind IN ('fix_proofed', 'bench_report', 'fault_came_back', 'handover_revised', 'moderator_reply')`,
      [],
      'notification_events_kind_check',
    );
    t.check(`path LIKE '/%'`, [], 'notification_events_path_check');
  });
  await knex.raw('CREATE INDEX notification_events_user_idx ON notification_events (user_id, created_at DESC)');
  await knex.raw('CREATE INDEX notification_events_unread_idx ON notification_events (user_id) WHERE read_at IS NULL');

  await knex.schema.createTable('notification_settings', (t) => {
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('kind').notNullable();
    t.text('delivery').notNullable();
    t.primary(['user_id', 'kind']);
    t.check(`delivery IN ('now', 'digest', 'app')`, [], 'notification_settings_delivery_check');
  });

  // One digest per member per week: the row is the proof it was built (and what it held).
  await knex.schema.createTable('notification_digests', (t) => {
    t.integer('user_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.date('week_start').notNullable();
    t.integer('events').notNullable();
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.primary(['user_id', 'week_start']);
  });
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.schema.dropTable('notification_digests');
  await knex.schema.dropTable('notification_settings');
  await knex.schema.dropTable('notification_events');
  await knex.schema.dropTable('follows');
}
