// `npm run db:backup`: one consistent snapshot of the database (pg_dump's custom format) plus every photo
// file the database names, packed in one tar file with a manifest of checksums.
import { mkdtemp, mkdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import type { Knex } from 'knex';
import type { StorageDriver } from '../storage/storage-driver';
import { photoFileName, sha256Of, type Manifest } from './manifest';
import { pgTool, runTool } from './pg-tools';
import { tableChecksums } from './table-checksums';

export interface BackupOptions {
  knex: Knex;
  connectionString: string;
  storage: StorageDriver;
  outFile: string;
}

/** Every storage key a photo row names: the kept original or largest rendition, and each rendition. */
async function photoKeys(trx: Knex.Transaction): Promise<string[]> {
  const rows: { storage_key: string; renditions: { key?: string }[] }[] = await trx('photos').select('storage_key', 'renditions');
  const keys = new Set<string>();
  for (const row of rows) {
    keys.add(row.storage_key);
    for (const r of row.renditions ?? []) if (r.key) keys.add(r.key);
  }
  return [...keys].sort();
}

async function latestMigration(trx: Knex.Transaction): Promise<string | null> {
  const row = await trx('knex_migrations').max('name as name').first();
  return (row?.name as string | undefined) ?? null;
}

export async function createBackup(options: BackupOptions): Promise<{ file: string; manifest: Manifest }> {
  const work = await mkdtemp(join(tmpdir(), 'benchlore-backup-'));
  try {
    await mkdir(join(work, 'photos'));
    const dumpFile = join(work, 'database.dump');
    // The checksums, the photo list and pg_dump all read one exported snapshot, so they agree even while
    // the app keeps writing.
    const manifest = await options.knex.transaction(
      async (trx) => {
        const snapshot = (await trx.raw('SELECT pg_export_snapshot() AS id')).rows[0].id as string;
        const dumping = runTool(pgTool('pg_dump'), [
          '--format=custom',
          `--snapshot=${snapshot}`,
          '--no-owner',
          '--no-privileges',
          `--file=${dumpFile}`,
          `--dbname=${options.connectionString}`,
        ]);
        const tables = await tableChecksums(trx);
        const keys = await photoKeys(trx);
        const migration = await latestMigration(trx);
        await dumping;
        const photos: Manifest['photos'] = [];
        const missingPhotos: string[] = [];
        for (const key of keys) {
          const object = await options.storage.get(key);
          if (!object) {
            missingPhotos.push(key);
            continue;
          }
          const file = photoFileName(photos.length);
          await writeFile(join(work, file), object.body);
          photos.push({ key, file, contentType: object.contentType, bytes: object.body.length, sha256: sha256Of(object.body) });
        }
        const dump = await readFile(dumpFile);
        return {
          format: 'benchlore-backup',
          version: 1,
          createdAt: new Date().toISOString(),
          latestMigration: migration,
          database: { file: 'database.dump', bytes: dump.length, sha256: sha256Of(dump) },
          tables,
          photos,
          missingPhotos,
        } satisfies Manifest;
      },
      { isolationLevel: 'repeatable read', readOnly: true },
    );
    await writeFile(join(work, 'manifest.json'), JSON.stringify(manifest, null, 2));
    const outFile = resolve(options.outFile);
    await mkdir(dirname(outFile), { recursive: true });
    await runTool('tar', ['-cf', outFile, '-C', work, 'manifest.json', 'database.dump', 'photos']);
    await stat(outFile);
    return { file: outFile, manifest };
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
