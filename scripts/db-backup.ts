// `npm run db:backup [-- --out FILE]`: the database and the photo store in one checked file.
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { config, databaseUrl } from '../src/server/core/config.ts';
import { db, closeDb } from '../src/server/core/db.ts';
import { storage } from '../src/server/storage/index.ts';
import { createBackup } from '../src/server/backup/backup.ts';
import { ensureDatabase } from './lib/prepare.ts';

const { values } = parseArgs({ options: { out: { type: 'string' } } });
const stamp = new Date().toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);
const outFile = values.out ?? join(config().BENCHLORE_DATA_DIR, 'backups', `benchlore-${stamp}.tar`);

try {
  await ensureDatabase(process.env);
  const { file, manifest } = await createBackup({ knex: db(), connectionString: databaseUrl(config()), storage: storage(), outFile });
  const rows = Object.values(manifest.tables).reduce((sum, t) => sum + t.rows, 0);
  console.log(
    `Backup written to ${file}: ${Object.keys(manifest.tables).length} tables, ${rows} rows, ${manifest.photos.length} photo files.`,
  );
  if (manifest.missingPhotos.length) {
    console.warn(
      `${manifest.missingPhotos.length} photo files named in the database were not in the store: ${manifest.missingPhotos.join(', ')}`,
    );
  }
} catch (error) {
  console.error(`The backup failed: ${(error as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
