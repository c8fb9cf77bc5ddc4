// Migrations run forward, roll all the way back, and run forward again on a database of their own.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import knexConfig from '../../knexfile.js';
import { testDb } from '../support/db';
import { TEST_DB } from '../support/test-env';

const SCRATCH = `${TEST_DB}_migrations`;
let admin: Knex;
let scratch: Knex;

beforeAll(async () => {
  admin = testDb('postgres');
  await admin.raw(`DROP DATABASE IF EXISTS ${SCRATCH} WITH (FORCE)`);
  await admin.raw(`CREATE DATABASE ${SCRATCH}`);
  scratch = testDb(SCRATCH);
});

afterAll(async () => {
  await scratch?.destroy();
  await admin?.raw(`DROP DATABASE IF EXISTS ${SCRATCH} WITH (FORCE)`);
  await admin?.destroy();
});

const tables = async (knex: Knex): Promise<string[]> =>
  (await knex.raw(`SELECT tablename FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename`)).rows.map(
    (r: { tablename: string }) => r.tablename,
  );

describe('migrations', () => {
  it('migrate up, roll everything back, and migrate up again to the same tables', async () => {
    const migrations = { ...knexConfig.migrations };
    await scratch.migrate.latest(migrations);
    const first = await tables(scratch);
    expect(first).toEqual(
      expect.arrayContaining([
        'users',
        'accounts',
        'sessions',
        'verification_token',
        'makers',
        'chassis_families',
        'machines',
        'fixes',
        'revisions',
        'photos',
        'bench_reports',
        'handover_notes',
        'job_sheets',
        'word_families',
        'reports',
        'audit_log',
        'fix_search',
      ]),
    );

    await scratch.migrate.rollback(migrations, true);
    expect((await tables(scratch)).filter((t) => !t.startsWith('knex_'))).toEqual([]);

    await scratch.migrate.latest(migrations);
    expect(await tables(scratch)).toEqual(first);
  });
});
