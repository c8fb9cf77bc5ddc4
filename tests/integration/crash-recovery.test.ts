// kill -9 of the server in the middle of 50 concurrent uploads and edits, in a database and photo store of its own;
// after a restart `npm run db:check` finds no half revision, orphan row or photo without its files, and collects
// orphan files. Slow: 40-120 s (a fresh database with the demo world, two server starts, 25 photos processed).
import { execFile } from 'node:child_process';
import { rmSync } from 'node:fs';
import { promisify } from 'node:util';
import knexFactory, { type Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { databaseUrl, readConfig } from '@/server/core/config';
import { ensureDatabase, migrateAndSeed } from '../../scripts/lib/prepare';
import { phoneJpeg } from '../fixtures/photo-files';
import { call, completeValues, session, someMachineId, type Session } from '../fixtures/writing';
import { startApp, type TestApp } from '../support/server';
import { INTEGRATION_PORT, TEST_DB, testEnv } from '../support/test-env';

const port = INTEGRATION_PORT + 15;
const DB = `${TEST_DB}_crash`;
const dataDir = process.env.BENCHLORE_DATA_DIR ?? '.data';
const own = { BENCHLORE_DB_NAME: DB, BENCHLORE_MEDIA_DIR: `${dataDir}/media-${DB}` };
const env = { ...testEnv(), ...own };
let knex: Knex;
let app: TestApp | undefined;

beforeAll(async () => {
  rmSync(own.BENCHLORE_MEDIA_DIR, { recursive: true, force: true });
  await ensureDatabase(env, { fresh: true });
  migrateAndSeed(env);
  knex = knexFactory({ client: 'pg', connection: databaseUrl(readConfig(env)), pool: { min: 0, max: 4 } });
}, 120_000);
afterAll(async () => {
  await app?.stop();
  await knex?.destroy();
});

async function dbCheck(args: string[]): Promise<{ code: number; out: string }> {
  try {
    const { stdout, stderr } = await promisify(execFile)(process.execPath, ['--import', 'tsx', 'scripts/db-check.ts', ...args], {
      env: { ...env, LOG_LEVEL: 'silent' },
      timeout: 60_000,
    });
    return { code: 0, out: stdout + stderr };
  } catch (error) {
    const e = error as { code: number; stdout: string; stderr: string };
    return { code: e.code, out: e.stdout + e.stderr };
  }
}

async function upload(base: string, writer: Session, file: Buffer, n: number): Promise<number> {
  const form = new FormData();
  form.append('alt', `Bench photo ${n} of the capstan pulley`);
  form.append('file', new Blob([new Uint8Array(file)]), `bench-${n}.jpg`);
  const res = await fetch(`${base}/api/v1/photos`, { method: 'POST', headers: { cookie: writer.cookie, origin: base }, body: form });
  return res.status;
}

/** A new fix written, saved twice and submitted: four writes in a row, any of which the kill may cut. */
async function edit(base: string, writer: Session, machineId: number, n: number): Promise<number> {
  const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: writer.cookie });
  const id = created.body.revision.id;
  for (const cause of [`Cause ${n}, first save.`, `Cause ${n}, second save, a little longer.`])
    await call(base, `/api/v1/drafts/${id}`, {
      method: 'PUT',
      body: { values: completeValues(machineId, { cause }) },
      cookie: writer.cookie,
    });
  return (await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: writer.cookie })).status;
}

describe('a crash in the middle of writing', () => {
  it('leaves nothing half-stored after kill -9 during 50 concurrent uploads and edits, and collects orphan files', async () => {
    app = await startApp(port, own);
    const writers = await Promise.all([0, 1, 2, 3, 4].map((i) => session(knex, app!.base, 'member', `crash-${i}`)));
    const machineId = await someMachineId(knex);
    const photos = await Promise.all(Array.from({ length: 25 }, (_, i) => phoneJpeg(1000 + i)));
    const before = Number((await knex('revisions').count({ n: '*' }).first())?.n);

    const work = [
      ...photos.map((file, i) => upload(app!.base, writers[i % 5]!, file, i)),
      ...Array.from({ length: 25 }, (_, i) => edit(app!.base, writers[i % 5]!, machineId, i)),
    ].map((p) => p.catch(() => 0));
    // Killed once some of both kinds have landed, while the rest is still in flight.
    const count = async (table: string) => Number((await knex(table).count({ n: '*' }).first())?.n);
    const photosBefore = await count('photos');
    const landed = Date.now() + 30_000;
    while ((await count('revisions')) - before < 8 || (await count('photos')) - photosBefore < 5) {
      if (Date.now() > landed) throw new Error('the writes had not started landing 30 s after they were sent');
      await new Promise((r) => setTimeout(r, 50));
    }
    expect(await app.stop('SIGKILL')).toBe('SIGKILL');
    const statuses = await Promise.all(work);
    const cut = statuses.filter((s) => s === 0).length;
    const stored = Number((await knex('revisions').count({ n: '*' }).first())?.n) - before;
    console.log(
      `kill -9 with ${cut} of 50 requests cut off; ${stored} revisions and ${(await count('photos')) - photosBefore} photos had been stored`,
    );
    expect(cut).toBeGreaterThan(0);

    // Restart: the photo worker finishes what was uploaded, then the check and the collection.
    app = await startApp(port, own, { keepMail: true });
    const deadline = Date.now() + 90_000;
    while (Number((await knex('photos').where({ processing_state: 'pending' }).count({ n: '*' }).first())?.n) > 0) {
      if (Date.now() > deadline) throw new Error('photos were still pending 90 s after the restart');
      await new Promise((r) => setTimeout(r, 250));
    }
    const collected = await dbCheck(['--collect', '--grace-minutes', '0']);
    console.log(collected.out.trim());
    expect(collected.code, collected.out).toBe(0);
    expect(collected.out).toContain('the database and the photo store agree');
    const again = await dbCheck([]);
    expect(again.code, again.out).toBe(0);
    expect(again.out).not.toMatch(/photo files no row names/);
  }, 240_000);
});
