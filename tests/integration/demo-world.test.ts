// The seeded demo world is large enough to explore, and seeding it again changes nothing.
import { afterAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { seedDemoWorld } from '@/server/seed/seed-demo-world';
import { closeDb } from '@/server/db';

const knex = testDb();
afterAll(async () => {
  await knex.destroy();
  await closeDb();
});

const count = async (sql: string): Promise<number> => Number((await knex.raw(sql)).rows[0].n);

describe('demo world', () => {
  it('holds the catalogue, proofed fixes, revisions, photos and bench reports', async () => {
    expect(await count('SELECT count(*) AS n FROM makers')).toBeGreaterThanOrEqual(4);
    expect(await count('SELECT count(*) AS n FROM chassis_families')).toBeGreaterThanOrEqual(6);
    expect(await count('SELECT count(*) AS n FROM machines')).toBeGreaterThanOrEqual(24);
    expect(await count(`SELECT count(DISTINCT region) AS n FROM machines WHERE region IN ('PAL', 'NTSC')`)).toBe(2);
    expect(await count('SELECT count(DISTINCT device_type) AS n FROM machines')).toBeGreaterThanOrEqual(7);
    expect(await count(`SELECT count(*) AS n FROM fixes f JOIN revisions r ON r.id = f.current_revision_id WHERE r.state = 'proofed'`)).toBeGreaterThanOrEqual(40);
    expect(await count(`SELECT count(*) AS n FROM (SELECT fix_id FROM revisions GROUP BY fix_id HAVING count(*) > 1) x`)).toBeGreaterThanOrEqual(5);
    expect(await count('SELECT count(*) AS n FROM bench_reports')).toBeGreaterThanOrEqual(120);
    expect(await count('SELECT count(*) AS n FROM photos WHERE is_illustration')).toBeGreaterThan(0);
    // Every live fix is searchable (other tests may add drafts, which are not).
    expect(await count('SELECT count(*) AS n FROM fix_search')).toBe(
      await count('SELECT count(*) AS n FROM fixes WHERE current_revision_id IS NOT NULL AND deleted_at IS NULL AND hidden_at IS NULL'),
    );
    expect(await count(`SELECT count(DISTINCT role) AS n FROM users`)).toBe(4);
  });

  it('seeding a second time adds nothing', async () => {
    const before = await count('SELECT (SELECT count(*) FROM fixes) + (SELECT count(*) FROM revisions) + (SELECT count(*) FROM bench_reports) + (SELECT count(*) FROM photos) + (SELECT count(*) FROM machines) AS n');
    const result = await seedDemoWorld(knex);
    expect(result).toEqual({ fixesCreated: 0, reportsCreated: 0 });
    const after = await count('SELECT (SELECT count(*) FROM fixes) + (SELECT count(*) FROM revisions) + (SELECT count(*) FROM bench_reports) + (SELECT count(*) FROM photos) + (SELECT count(*) FROM machines) AS n');
    expect(after).toBe(before);
  });
});
