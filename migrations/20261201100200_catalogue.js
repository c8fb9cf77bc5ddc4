// The machine catalogue: makers, chassis families, machines (with a normalised code for loose matching).
/** @param {import('knex').Knex} knex */
export async function up(knex) {
  const deviceTypes = `'vcr','dvd_recorder','dvd_ram_recorder','bluray_recorder','vhs_dvd_combo','camcorder','cassette_deck','cd_player','minidisc'`;

  await knex.schema.createTable('makers', (t) => {
    t.increments('id');
    t.text('slug').notNullable().unique();
    t.text('name').notNullable().unique();
    t.text('country');
    t.text('about').notNullable().defaultTo('');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('deleted_at', { useTz: true });
    t.check(`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`, [], 'makers_slug_check');
  });

  await knex.schema.createTable('chassis_families', (t) => {
    t.increments('id');
    t.text('slug').notNullable().unique();
    t.integer('maker_id').notNullable().references('id').inTable('makers').onDelete('RESTRICT');
    t.text('name').notNullable();
    t.text('code').notNullable();
    t.text('device_type').notNullable();
    t.text('about').notNullable().defaultTo('');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('deleted_at', { useTz: true });
    t.unique(['maker_id', 'code']);
    t.check(`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`, [], 'chassis_slug_check');
    t.check(`device_type IN (${deviceTypes})`, [], 'chassis_device_type_check');
  });

  await knex.schema.createTable('machines', (t) => {
    t.increments('id');
    t.text('slug').notNullable().unique();
    t.integer('maker_id').notNullable().references('id').inTable('makers').onDelete('RESTRICT');
    t.integer('chassis_family_id').references('id').inTable('chassis_families').onDelete('SET NULL');
    t.text('model_number').notNullable();
    t.text('model_code').notNullable();
    t.text('region').notNullable();
    t.text('device_type').notNullable();
    t.specificType('formats', 'text[]').notNullable().defaultTo('{}');
    t.smallint('year_from');
    t.smallint('year_to');
    t.text('about').notNullable().defaultTo('');
    t.timestamp('created_at', { useTz: true }).notNullable().defaultTo(knex.fn.now());
    t.timestamp('deleted_at', { useTz: true });
    t.unique(['maker_id', 'model_number', 'region']);
    t.check(`slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$'`, [], 'machines_slug_check');
    t.check(`model_code ~ '^[a-z0-9]+$'`, [], 'machines_model_code_check');
    t.check(`region IN ('PAL', 'NTSC', 'SECAM', 'multi')`, [], 'machines_region_check');
    t.check(`device_type IN (${deviceTypes})`, [], 'machines_device_type_check');
    t.check(`year_from IS NULL OR year_from BETWEEN 1950 AND 2100`, [], 'machines_year_from_check');
    t.check(`year_to IS NULL OR (year_from IS NOT NULL AND year_to >= year_from)`, [], 'machines_years_check');
  });
  await knex.raw('CREATE INDEX machines_model_code_trgm ON machines USING gin (model_code gin_trgm_ops)');
  await knex.raw('CREATE INDEX machines_chassis_idx ON machines (chassis_family_id)');
  await knex.raw('CREATE INDEX machines_maker_idx ON machines (maker_id)');
}

/** @param {import('knex').Knex} knex */
export async function down(knex) {
  await knex.schema.dropTableIfExists('machines');
  await knex.schema.dropTableIfExists('chassis_families');
  await knex.schema.dropTableIfExists('makers');
}
