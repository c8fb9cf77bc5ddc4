// `npm run db:check`: finds a half-made fix, a photo row without its file and orphan files, and collects
// orphans past the grace period only.
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { storage } from '@/server/storage';
import { checkDatabase } from '@/server/integrity/checks';
import { checkPhotoFiles } from '@/server/integrity/photo-files';
import { testDb } from '../support/db';
import { storedPhotoRow } from '../support/photo-rows';
import { testEnv } from '../support/test-env';

const run = promisify(execFile);

async function dbCheck(args: string[] = []) {
  try {
    const { stdout, stderr } = await run(process.execPath, ['--import', 'tsx', 'scripts/db-check.ts', ...args], {
      env: { ...testEnv(), LOG_LEVEL: 'silent' },
      timeout: 60_000,
    });
    return { code: 0, out: stdout + stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, out: e.stdout + e.stderr };
  }
}

describe('npm run db:check', () => {
  let knex: Knex;
  let ownerId: number;
  const halfSlug = `half-made-${Date.now()}`;
  const orphanKey = `photos/zz/orphan-${Date.now()}-480.jpg`;

  beforeAll(async () => {
    knex = testDb();
    ownerId = (await knex('users').orderBy('id').first('id')).id;
  });

  afterAll(async () => {
    await knex('fixes').where('slug', halfSlug).del();
    await storage().delete(orphanKey);
    await knex.destroy();
  });

  it('finds a fix left with no revision, which the seeded demo world does not have', async () => {
    const before = await checkDatabase(knex);
    expect(before.find((p) => p.check === 'fix without revisions')).toBeUndefined();
    await knex('fixes').insert({ slug: halfSlug, created_by: ownerId });
    const after = await checkDatabase(knex);
    expect(after.find((p) => p.check === 'fix without revisions')?.ids).toContain(halfSlug);
    const cli = await dbCheck();
    expect(cli.code).toBe(1);
    expect(cli.out).toContain(`fix with no revision at all (left half-made): ${halfSlug}`);
    await knex('fixes').where('slug', halfSlug).del();
  });

  it('finds a ready photo whose file is gone', async () => {
    const photo = await storedPhotoRow(knex, ownerId, { hoursAgo: 0, tag: 'check', altText: 'A photo whose file goes missing.' });
    await storage().delete(photo.key);
    const report = await checkPhotoFiles(knex, storage(), { collect: false, graceMs: 0 });
    expect(report.missing).toContainEqual({ photoId: photo.id, key: photo.key });
    expect((await dbCheck()).out).toContain(`photo ${photo.id} is missing its file ${photo.key}`);
    await knex('photos').where('id', photo.id).del();
  });

  it('keeps an orphan file younger than the grace period and collects it once it is older', async () => {
    await storage().put(orphanKey, Buffer.from([0xff, 0xd8, 0xff, 0xd9]), 'image/jpeg');
    const young = await checkPhotoFiles(knex, storage(), { collect: true, graceMs: 60 * 60_000 });
    expect(young.orphans).toContain(orphanKey);
    expect(young.collected).not.toContain(orphanKey);
    expect(await storage().get(orphanKey)).not.toBeNull();

    const cli = await dbCheck(['--collect', '--grace-minutes', '0']);
    expect(cli.out).toMatch(/Collected \d+ orphan photo files\./);
    expect(await storage().get(orphanKey)).toBeNull();
  });

  it('never collects a file a photo row names', async () => {
    const photo = await storedPhotoRow(knex, ownerId, { hoursAgo: 5, tag: 'kept', altText: 'A photo that stays.' });
    const report = await checkPhotoFiles(knex, storage(), { collect: true, graceMs: 0 });
    expect(report.collected).not.toContain(photo.key);
    expect(await storage().get(photo.key)).not.toBeNull();
    await knex('photos').where('id', photo.id).del();
    await storage().delete(photo.key);
  });

  it('answers a bad grace period with the flag and an example', async () => {
    const bad = await dbCheck(['--grace-minutes', 'soon']);
    expect(bad.code).toBe(2);
    expect(bad.out).toContain('--grace-minutes takes a number of minutes, e.g. --grace-minutes 60');
  });
});
