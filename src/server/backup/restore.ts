// `npm run db:restore -- FILE`: checks a backup file against its manifest, restores it into an empty
// database and photo store, then proves the restored tables match the backup's checksums.
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { Knex } from 'knex';
import type { StorageDriver } from '../storage/storage-driver';
import { manifestSchema, sha256Of, type Manifest } from './manifest';
import { pgTool, runTool } from './pg-tools';
import { appTables, compareChecksums, tableChecksums } from './table-checksums';

export interface RestoreOptions {
  knex: Knex;
  connectionString: string;
  storage: StorageDriver;
  file: string;
}

export interface RestoreResult {
  manifest: Manifest;
  tables: number;
  rows: number;
  photos: number;
}

/** A refusal a person can act on: what is wrong and what to do. */
export class RestoreError extends Error {}

async function readManifest(work: string): Promise<Manifest> {
  let raw: unknown;
  try {
    raw = JSON.parse(await readFile(join(work, 'manifest.json'), 'utf8'));
  } catch {
    throw new RestoreError('The file has no readable manifest.json: is it a file made by `npm run db:backup`?');
  }
  const parsed = manifestSchema.safeParse(raw);
  if (!parsed.success) throw new RestoreError('The manifest is not one this version can read: make a new backup with `npm run db:backup`.');
  return parsed.data;
}

/** Every byte is checked before anything is written, so a damaged file changes nothing. */
async function verifyFiles(work: string, manifest: Manifest): Promise<void> {
  const dump = await readFile(join(work, manifest.database.file)).catch(() => null);
  if (!dump || sha256Of(dump) !== manifest.database.sha256) {
    throw new RestoreError('The database dump inside the backup is missing or damaged (its checksum does not match the manifest).');
  }
  for (const photo of manifest.photos) {
    const body = await readFile(join(work, photo.file)).catch(() => null);
    if (!body || sha256Of(body) !== photo.sha256) {
      throw new RestoreError(`The photo ${photo.key} inside the backup is missing or damaged (its checksum does not match the manifest).`);
    }
  }
}

export async function restoreBackup(options: RestoreOptions): Promise<RestoreResult> {
  const work = await mkdtemp(join(tmpdir(), 'benchlore-restore-'));
  try {
    await runTool('tar', ['-xf', resolve(options.file), '-C', work]).catch(() => {
      throw new RestoreError(`${options.file} is not a backup file that can be unpacked (a tar file made by \`npm run db:backup\`).`);
    });
    const manifest = await readManifest(work);
    await verifyFiles(work, manifest);
    const existing = await appTables(options.knex);
    if (existing.length > 0) {
      throw new RestoreError(
        `The target database is not empty (it has ${existing.length} tables, e.g. ${existing[0]}): restore into a new, empty database.`,
      );
    }
    // Extensions are created by whoever made the database (they need a superuser); their comments too.
    await runTool(pgTool('pg_restore'), [
      '--no-owner',
      '--no-privileges',
      '--no-comments',
      '--exit-on-error',
      '--single-transaction',
      `--dbname=${options.connectionString}`,
      join(work, manifest.database.file),
    ]);
    for (const photo of manifest.photos) {
      await options.storage.put(photo.key, await readFile(join(work, photo.file)), photo.contentType);
    }
    const restored = await options.knex.transaction((trx) => tableChecksums(trx));
    const problems = compareChecksums(manifest.tables, restored);
    if (problems.length) throw new RestoreError(`The restored database differs from the backup:\n  ${problems.join('\n  ')}`);
    const rows = Object.values(restored).reduce((sum, t) => sum + t.rows, 0);
    return { manifest, tables: Object.keys(restored).length, rows, photos: manifest.photos.length };
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}
