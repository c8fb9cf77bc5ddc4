// The weekly file at /export: built once a week and kept, served with its manifest, and the same as the database says.
import { createHash } from 'node:crypto';
import { rm } from 'node:fs/promises';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { ExportedFix } from '@/server/export/knowledge-export';
import { isoWeek } from '@/server/export/weekly';
import { INTEGRATION_PORT, TEST_DB } from '../support/test-env';
import { testDb } from '../support/db';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
afterAll(() => knex.destroy());

describe('ISO weeks', () => {
  // ISO 8601 week dates; the examples are the standard's own boundary cases (from memory: 2004-W53 ends on 2005-01-02).
  it('numbers weeks from the week holding the first Thursday', () => {
    expect(isoWeek(new Date('2005-01-01T12:00:00Z'))).toBe('2004-W53');
    expect(isoWeek(new Date('2005-01-03T00:00:00Z'))).toBe('2005-W01');
    expect(isoWeek(new Date('2008-12-29T00:00:00Z'))).toBe('2009-W01');
    expect(isoWeek(new Date('2026-12-02T16:00:00Z'))).toBe('2026-W49');
  });
});

describe('/export', () => {
  it("serves this week's file with a manifest whose counts and checksum match it and the database", async () => {
    // Other tests of the run proof and hide fixes first: this week's file is made afresh from the database as it is now.
    await rm(join(process.env.BENCHLORE_DATA_DIR ?? '.data', 'export', 'weekly', TEST_DB, isoWeek(new Date())), {
      recursive: true,
      force: true,
    });
    const manifestRes = await fetch(`${base}/export/manifest.json`);
    expect(manifestRes.status).toBe(200);
    const manifest = await manifestRes.json();
    expect(manifest.week).toBe(isoWeek(new Date()));
    expect(manifest.licence.name).toBe('CC BY-SA 4.0');

    const fileRes = await fetch(`${base}/export/fixes.jsonl`);
    expect(fileRes.status).toBe(200);
    expect(fileRes.headers.get('content-type')).toMatch(/^application\/x-ndjson/);
    const text = await fileRes.text();
    const entry = manifest.files.find((f: { name: string }) => f.name === 'fixes.jsonl');
    expect(createHash('sha256').update(text).digest('hex')).toBe(entry.sha256);
    expect(Buffer.byteLength(text)).toBe(entry.bytes);
    expect(fileRes.headers.get('etag')).toBe(`"${entry.sha256}"`);

    const records: ExportedFix[] = text
      .trim()
      .split('\n')
      .map((line) => JSON.parse(line));
    expect(records.length).toBe(manifest.counts.fixes);
    const live = await knex('fixes')
      .whereNotNull('current_revision_id')
      .whereNull('hidden_at')
      .whereNull('deleted_at')
      .orderBy('slug')
      .pluck('slug');
    // Fixes proofed or hidden after this week's file was made show up next week; this test's database is fresh.
    expect(records.map((r) => r.slug)).toEqual(live);
    expect(text).not.toMatch(/@example\.test/);

    // Kept: asking again serves the same file, and a cache can revalidate it.
    const again = await fetch(`${base}/export/fixes.jsonl`, { headers: { 'if-none-match': `"${entry.sha256}"` } });
    expect(again.status).toBe(304);
    const page = await (await fetch(`${base}/export`)).text();
    expect(page).toContain(entry.sha256);
    expect(page).toContain(`${manifest.counts.fixes} fixes`);
  });
});
