// The bench side: bench reports, job sheets (private), hand-over notes for customers, saved order lists.
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  await knex.schema.createTable('bench_reports', (t) => {
    t.increments('id');
    t.integer('fix_id').notNullable().references('id').inTable('fixes').onDelete('CASCADE');
    /** The revision the member followed: reports on older revisions weigh less. */
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.integer('machine_id').notNullable().references('id').inTable('machines').onDelete('RESTRICT');
    t.integer('member_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('outcome').notNullable();
    /** For "came back": how many days the repair held. */
    t.integer('held_days');
    t.text('note').notNullable().defaultTo('');
    t.jsonb('readings').notNullable().defaultTo('[]');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.unique(['fix_id', 'member_id', 'machine_id']);
    t.check(`outcome IN ('fixed', 'partly', 'not_fixed', 'came_back')`, [], 'bench_reports_outcome_check');
    t.check(`held_days IS NULL OR (outcome = 'came_back' AND held_days >= 0)`, [], 'bench_reports_held_check');
    t.check(`jsonb_typeof(readings) = 'array'`, [], 'bench_reports_readings_check');
  });
  await knex.raw('CREATE INDEX bench_reports_fix_idx ON bench_reports (fix_id)');
  await knex.raw('CREATE INDEX bench_reports_machine_idx ON bench_reports (machine_id)');

  await knex.schema.createTable('job_sheets', (t) => {
    t.increments('id');
    // Deleting the owner deletes their customers' data with them.
    t.integer('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('customer_ref').notNullable();
    t.integer('machine_id').references('id').inTable('machines').onDelete('SET NULL');
    t.text('serial_number').notNullable().defaultTo('');
    t.text('reported_symptom').notNullable().defaultTo('');
    t.text('findings').notNullable().defaultTo('');
    t.jsonb('parts_used').notNullable().defaultTo('[]');
    t.integer('labour_minutes').notNullable().defaultTo(0);
    t.text('status').notNullable().defaultTo('booked_in');
    t.text('outcome').notNullable().defaultTo('');
    t.timestamp('booked_in_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check(
      `status IN ('booked_in', 'diagnosing', 'waiting_for_parts', 'repaired', 'collected', 'returned_unrepaired')`,
      [],
      'job_sheets_status_check',
    );
    t.check('labour_minutes BETWEEN 0 AND 100000', [], 'job_sheets_labour_check');
    t.check(`length(btrim(customer_ref)) > 0`, [], 'job_sheets_customer_check');
    t.check(`jsonb_typeof(parts_used) = 'array'`, [], 'job_sheets_parts_check');
  });
  await knex.raw('CREATE INDEX job_sheets_owner_idx ON job_sheets (owner_id, updated_at DESC)');

  await knex.schema.createTable('job_sheet_fixes', (t) => {
    t.integer('job_sheet_id').notNullable().references('id').inTable('job_sheets').onDelete('CASCADE');
    t.integer('fix_id').notNullable().references('id').inTable('fixes').onDelete('CASCADE');
    /** Pinned: the exact revision applied on the bench. */
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.primary(['job_sheet_id', 'fix_id']);
  });

  await knex.schema.createTable('handover_notes', (t) => {
    t.increments('id');
    t.text('code').notNullable().unique();
    t.integer('fix_id').notNullable().references('id').inTable('fixes').onDelete('CASCADE');
    t.integer('revision_id').notNullable().references('id').inTable('revisions').onDelete('CASCADE');
    t.integer('member_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.integer('job_sheet_id').references('id').inTable('job_sheets').onDelete('SET NULL');
    t.boolean('include_job_details').notNullable().defaultTo(false);
    t.text('shop_name').notNullable().defaultTo('');
    t.text('message').notNullable().defaultTo('');
    t.jsonb('parts_replaced').notNullable().defaultTo('[]');
    t.text('warranty').notNullable().defaultTo('');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('revoked_at', { useTz: true });
    // Unambiguous alphabet (no 0/O, 1/I/L), at least 10 characters.
    t.check(`code ~ '^[23456789ABCDEFGHJKMNPQRSTUVWXYZ]{10,16}$'`, [], 'handover_notes_code_check');
    t.check(`jsonb_typeof(parts_replaced) = 'array'`, [], 'handover_notes_parts_check');
  });

  await knex.schema.createTable('order_lists', (t) => {
    t.increments('id');
    t.integer('owner_id').notNullable().references('id').inTable('users').onDelete('CASCADE');
    t.text('name').notNullable().defaultTo('Order list');
    t.jsonb('lines').notNullable().defaultTo('[]');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.check(`jsonb_typeof(lines) = 'array'`, [], 'order_lists_lines_check');
  });
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  for (const table of ['order_lists', 'handover_notes', 'job_sheet_fixes', 'job_sheets', 'bench_reports']) {
    await knex.schema.dropTableIfExists(table);
  }
}
