// `npm run db:backup` and `npm run db:restore`: a round trip into an empty database and photo store, and the refusals.
import { execFile } from 'node:child_process';
import { existsSync } from 'node:fs';
import { mkdtemp, readFile, rm, writeFile, appendFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { localDiskStorage } from '@/server/storage/local-disk';
import { storage } from '@/server/storage';
import { testDb } from '../support/db';
import { storedPhotoRow } from '../support/photo-rows';
import { TEST_DB, testEnv } from '../support/test-env';

const run = promisify(execFile);
const restoreDb = `${TEST_DB}_restore`;

async function script(name: string, args: string[], env: NodeJS.ProcessEnv = {}) {
  try {
    const { stdout, stderr } = await run(process.execPath, ['--import', 'tsx', `scripts/${name}.ts`, ...args], {
      env: { ...testEnv(), LOG_LEVEL: 'silent', ...env },
      timeout: 120_000,
    });
    return { code: 0, out: stdout + stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, out: e.stdout + e.stderr };
  }
}

async function publicCounts(knex: Knex): Promise<Record<string, number>> {
  const tables: { tablename: string }[] = await knex('pg_tables').select('tablename').where('schemaname', 'public');
  const out: Record<string, number> = {};
  for (const { tablename } of tables) {
    const [row] = await knex(tablename).count({ n: '*' });
    out[tablename] = Number(row?.n);
  }
  return out;
}

describe('npm run db:backup and db:restore', () => {
  let work: string;
  let source: Knex;
  let target: Knex;
  let photoKey: string;
  const restoreMedia = () => join(work, 'media');

  beforeAll(async () => {
    work = await mkdtemp(join(tmpdir(), 'benchlore-backup-test-'));
    source = testDb();
    await source.raw(`DROP DATABASE IF EXISTS ${restoreDb}`);
    const [owner] = await source('users').select('id').orderBy('id').limit(1);
    photoKey = (await storedPhotoRow(source, owner.id, { hoursAgo: 1, tag: 'backup', altText: 'A drawing for the backup test.' })).key;
  });

  afterAll(async () => {
    await target?.destroy();
    await source.raw(`DROP DATABASE IF EXISTS ${restoreDb}`).catch(() => undefined);
    await source.destroy();
    await rm(work, { recursive: true, force: true });
  });

  it('restores every table and photo of a backup into an empty database, with the same row counts and bytes', async () => {
    const backup = await script('db-backup', ['--out', join(work, 'one.tar')]);
    expect(backup.code, backup.out).toBe(0);
    expect(backup.out).toMatch(/Backup written to .*one\.tar: \d+ tables, \d+ rows, \d+ photo files\./);
    const before = await publicCounts(source);

    const restore = await script('db-restore', [join(work, 'one.tar')], {
      BENCHLORE_DB_NAME: restoreDb,
      BENCHLORE_MEDIA_DIR: restoreMedia(),
    });
    expect(restore.code, restore.out).toBe(0);
    expect(restore.out).toContain("match the backup's checksums");

    target = testDb(restoreDb);
    expect(await publicCounts(target)).toEqual(before);
    expect(before.fixes).toBeGreaterThan(0);
    const fixTitles = async (k: Knex) => (await k('revisions').select('title').orderBy('id')).map((r) => r.title);
    expect(await fixTitles(target)).toEqual(await fixTitles(source));

    const original = await storage().get(photoKey);
    const restored = await localDiskStorage(restoreMedia()).get(photoKey);
    expect(restored?.body.equals(original!.body)).toBe(true);
  });

  it('refuses to restore into a database that is not empty, and changes nothing there', async () => {
    const countBefore = await publicCounts(target);
    const again = await script('db-restore', [join(work, 'one.tar')], {
      BENCHLORE_DB_NAME: restoreDb,
      BENCHLORE_MEDIA_DIR: restoreMedia(),
    });
    expect(again.code).toBe(1);
    expect(again.out).toContain('Nothing was restored: The target database is not empty');
    expect(await publicCounts(target)).toEqual(countBefore);
  });

  it('refuses a backup whose dump was damaged, before writing anything', async () => {
    const unpacked = join(work, 'unpacked');
    await run('mkdir', ['-p', unpacked]);
    await run('tar', ['-xf', join(work, 'one.tar'), '-C', unpacked]);
    await appendFile(join(unpacked, 'database.dump'), 'x');
    await run('tar', ['-cf', join(work, 'damaged.tar'), '-C', unpacked, 'manifest.json', 'database.dump', 'photos']);
    const otherDb = `${TEST_DB}_restore_bad`;
    await source.raw(`DROP DATABASE IF EXISTS ${otherDb}`);
    const res = await script('db-restore', [join(work, 'damaged.tar')], {
      BENCHLORE_DB_NAME: otherDb,
      BENCHLORE_MEDIA_DIR: join(work, 'bad-media'),
    });
    await source.raw(`DROP DATABASE IF EXISTS ${otherDb}`);
    expect(res.code).toBe(1);
    expect(res.out).toContain('The database dump inside the backup is missing or damaged');
    expect(existsSync(join(work, 'bad-media'))).toBe(false);
  });

  it('says how to call it when no file is named, and refuses a file that is not a backup', async () => {
    const none = await script('db-restore', []);
    expect(none.code).toBe(2);
    expect(none.out).toContain('Name the backup file to restore, e.g. npm run db:restore --');
    await writeFile(join(work, 'notes.txt'), 'not a backup');
    const wrong = await script('db-restore', [join(work, 'notes.txt')], { BENCHLORE_DB_NAME: `${TEST_DB}_restore_bad` });
    await source.raw(`DROP DATABASE IF EXISTS ${TEST_DB}_restore_bad`);
    expect(wrong.code).toBe(1);
    expect(wrong.out).toContain('is not a backup file that can be unpacked');
    expect(await readFile(join(work, 'notes.txt'), 'utf8')).toBe('not a backup');
  });
});
