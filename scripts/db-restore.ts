// `npm run db:restore -- FILE`: restores a backup into the configured database, which must be empty.
import { config, databaseUrl } from '../src/server/core/config.ts';
import { db, closeDb } from '../src/server/core/db.ts';
import { storage } from '../src/server/storage/index.ts';
import { restoreBackup, RestoreError } from '../src/server/backup/restore.ts';
import { ensureDatabase } from './lib/prepare.ts';

const file = process.argv[2];
if (!file) {
  console.error('Name the backup file to restore, e.g. npm run db:restore -- .data/backups/benchlore-20261202-1400.tar');
  process.exit(2);
}

try {
  await ensureDatabase(process.env);
  const result = await restoreBackup({ knex: db(), connectionString: databaseUrl(config()), storage: storage(), file });
  console.log(
    `Restored ${file} into ${config().BENCHLORE_DB_NAME}: ${result.tables} tables and ${result.rows} rows match the backup's checksums; ${result.photos} photo files put back.`,
  );
} catch (error) {
  console.error(
    error instanceof RestoreError ? `Nothing was restored: ${error.message}` : `The restore failed: ${(error as Error).message}`,
  );
  process.exitCode = 1;
} finally {
  await closeDb();
}
