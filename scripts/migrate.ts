// `npm run db:migrate` / `npm run db:rollback [-- --all]`: runs the Knex migrations.
import knexFactory from 'knex';
import knexConfig from '../knexfile.js';

const direction = process.argv[2] ?? 'latest';
const all = process.argv.includes('--all');
const db = knexFactory(knexConfig);
try {
  if (direction === 'rollback') {
    const [batch, names] = await db.migrate.rollback(undefined, all);
    console.log(names.length ? `Rolled back batch ${batch}: ${names.join(', ')}` : 'Nothing to roll back.');
  } else {
    const [batch, names] = await db.migrate.latest();
    console.log(names.length ? `Migrated batch ${batch}: ${names.length} migration(s).` : 'Database is up to date.');
  }
} finally {
  await db.destroy();
}
