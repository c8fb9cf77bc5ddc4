// The seeded demo world is large enough to explore, and seeding it again changes nothing.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import knexConfig from '../../knexfile.js';
import { testDb } from '../support/db';
import { TEST_DB } from '../support/test-env';
import { seedDemoWorld } from '@/server/seed/seed-demo-world';
import { closeDb } from '@/server/core/db';

const knex = testDb();
const count = async (db: Knex, sql: string): Promise<number> => Number((await db.raw(sql)).rows[0].n);

afterAll(async () => {
  await knex.destroy();
  await closeDb();
});

describe('demo world', () => {
  it('holds the catalogue, proofed fixes, revisions, photos and bench reports', async () => {
    expect(await count(knex, 'SELECT count(*) AS n FROM makers')).toBeGreaterThanOrEqual(4);
    expect(await count(knex, 'SELECT count(*) AS n FROM chassis_families')).toBeGreaterThanOrEqual(6);
    expect(await count(knex, 'SELECT count(*) AS n FROM machines')).toBeGreaterThanOrEqual(24);
    expect(await count(knex, `SELECT count(DISTINCT region) AS n FROM machines WHERE region IN ('PAL', 'NTSC')`)).toBe(2);
    expect(await count(knex, 'SELECT count(DISTINCT device_type) AS n FROM machines')).toBeGreaterThanOrEqual(7);
    expect(
      await count(knex, `SELECT count(*) AS n FROM fixes f JOIN revisions r ON r.id = f.current_revision_id WHERE r.state = 'proofed'`),
    ).toBeGreaterThanOrEqual(60);
    expect(
      await count(knex, `SELECT count(*) AS n FROM (SELECT fix_id FROM revisions GROUP BY fix_id HAVING count(*) > 1) x`),
    ).toBeGreaterThanOrEqual(5);
    expect(await count(knex, 'SELECT count(*) AS n FROM bench_reports')).toBeGreaterThanOrEqual(120);
    expect(await count(knex, 'SELECT count(*) AS n FROM photos WHERE is_illustration')).toBeGreaterThan(0);
    // Every live fix is searchable (other tests may add drafts, which are not). One statement, one snapshot: other
    // test files publish and hide fixes while this runs.
    const { rows } = await knex.raw<{ rows: { searchable: string; live: string }[] }>(
      `SELECT (SELECT count(*) FROM fix_search) AS searchable,
              (SELECT count(*) FROM fixes WHERE current_revision_id IS NOT NULL AND deleted_at IS NULL AND hidden_at IS NULL) AS live`,
    );
    expect(Number(rows[0]!.searchable)).toBe(Number(rows[0]!.live));
    expect(await count(knex, `SELECT count(DISTINCT role) AS n FROM users`)).toBe(4);
  });
});

describe('seeding', () => {
  // A database of its own: other tests change the shared one while they run. Dropped without FORCE: that option
  // would try to end an autovacuum worker busy on the fresh data, which only a superuser may do; a plain DROP
  // ends autovacuum workers itself.
  const SCRATCH = `${TEST_DB}_seed`;
  let admin: Knex;
  let scratch: Knex;

  beforeAll(async () => {
    admin = testDb('postgres');
    await admin.raw(`DROP DATABASE IF EXISTS ${SCRATCH}`);
    await admin.raw(`CREATE DATABASE ${SCRATCH}`);
    scratch = testDb(SCRATCH);
    await scratch.migrate.latest({ ...knexConfig.migrations });
  }, 120_000);

  afterAll(async () => {
    await scratch?.destroy();
    await admin?.raw(`DROP DATABASE IF EXISTS ${SCRATCH}`);
    await admin?.destroy();
  });

  it('a second run adds nothing', { timeout: 120_000 }, async () => {
    const total = `SELECT (SELECT count(*) FROM fixes) + (SELECT count(*) FROM revisions) + (SELECT count(*) FROM bench_reports)
      + (SELECT count(*) FROM photos) + (SELECT count(*) FROM machines) + (SELECT count(*) FROM users) AS n`;
    const first = await seedDemoWorld(scratch);
    expect(first.fixesCreated).toBeGreaterThanOrEqual(40);
    expect(first.reportsCreated).toBeGreaterThanOrEqual(120);
    const before = await count(scratch, total);
    expect(await seedDemoWorld(scratch)).toEqual({ fixesCreated: 0, reportsCreated: 0 });
    expect(await count(scratch, total)).toBe(before);
  });
});
