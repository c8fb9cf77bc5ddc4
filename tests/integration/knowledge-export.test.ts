// `npm run export`: the demo world exported, read back and compared with the database, and nothing private in it.
import { execFile } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ExportedFix, ExportManifest } from '@/server/export/knowledge-export';
import { testDb } from '../support/db';
import { INTEGRATION_PORT, testEnv } from '../support/test-env';
import { postForm } from '../support/sign-in';
import { completeValues, publishFix, session, someMachineId } from '../fixtures/writing';

const run = promisify(execFile);

describe('npm run export', () => {
  let dir: string;
  let knex: Knex;
  let manifest: ExportManifest;
  let text: string;
  let records: ExportedFix[];
  let hiddenSlug: string;

  beforeAll(async () => {
    dir = await mkdtemp(join(tmpdir(), 'benchlore-export-'));
    knex = testDb();
    // A fix of this file's own, proofed and then hidden by a moderator through the app: the export must leave it out.
    // (Not one of the demo world's: other files read those while this one runs.)
    const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
    const moderator = await session(knex, base, 'moderator', 'export-mod');
    const author = await session(knex, base, 'member', 'export-author');
    ({ slug: hiddenSlug } = await publishFix(base, author, moderator, completeValues(await someMachineId(knex, 2))));
    const hidden = await postForm(base, `/api/v1/proofing/fixes/${hiddenSlug}`, { action: 'hide' }, { cookie: moderator.cookie });
    expect(hidden.status).toBe(303);
    const { stdout } = await run(process.execPath, ['--import', 'tsx', 'scripts/export.ts', '--out', dir], {
      env: { ...testEnv(), LOG_LEVEL: 'silent', PUBLIC_ORIGIN: 'https://bench.example.test' },
      timeout: 120_000,
    });
    expect(stdout).toMatch(
      /Export written to .*: \d+ fixes, \d+ machines, \d+ chassis families, \d+ makers, \d+ photos \(CC BY-SA 4\.0\)\./,
    );
    manifest = JSON.parse(await readFile(join(dir, 'manifest.json'), 'utf8'));
    text = await readFile(join(dir, 'fixes.jsonl'), 'utf8');
    records = text
      .split('\n')
      .filter(Boolean)
      .map((l) => JSON.parse(l));
  });

  afterAll(async () => {
    await knex.destroy();
    await rm(dir, { recursive: true, force: true });
  });

  it('holds every live, visible fix once, and the manifest counts and checksums what the file holds', async () => {
    const live: { slug: string }[] = await knex('fixes')
      .whereNotNull('current_revision_id')
      .whereNull('hidden_at')
      .whereNull('deleted_at')
      .select('slug');
    expect(records.map((r) => r.slug).sort()).toEqual(live.map((f) => f.slug).sort());
    expect(manifest.counts.fixes).toBe(records.length);
    expect(manifest.files[0]).toEqual({
      name: 'fixes.jsonl',
      lines: records.length,
      bytes: Buffer.byteLength(text),
      sha256: createHash('sha256').update(text).digest('hex'),
    });
    expect(manifest.licence.name).toBe('CC BY-SA 4.0');
    expect(manifest.counts.machines).toBe(new Set(records.flatMap((r) => r.machines.map((m) => m.slug))).size);
    expect(manifest.counts.photos).toBe(records.reduce((n, r) => n + r.photos.length, 0));
  });

  it("gives each fix its live revision's fields and body, and that revision's machines and chassis families, as the database has them", async () => {
    for (const record of records) {
      const row = await knex('fixes as f')
        .join('revisions as r', 'r.id', 'f.current_revision_id')
        .where('f.slug', record.slug)
        .first(
          'f.id',
          'r.id as revision_id',
          'r.number',
          'r.title',
          'r.symptoms',
          'r.error_codes',
          'r.cause',
          'r.body',
          'r.parts',
          'r.cautions',
        );
      expect(record.revision).toMatchObject({
        number: row.number,
        title: row.title,
        symptoms: row.symptoms,
        errorCodes: row.error_codes,
        cause: row.cause,
        body: row.body,
        parts: row.parts,
        cautions: row.cautions,
      });
      const machines = await knex('revision_machines as rm')
        .join('machines as m', 'm.id', 'rm.machine_id')
        .where('rm.revision_id', row.revision_id)
        .pluck('m.slug');
      expect(record.machines.map((m) => m.slug).sort()).toEqual(machines.sort());
      const chassis = await knex('revision_chassis as rc')
        .join('chassis_families as c', 'c.id', 'rc.chassis_family_id')
        .where('rc.revision_id', row.revision_id)
        .pluck('c.slug');
      expect(record.chassisFamilies.map((c) => c.slug).sort()).toEqual(chassis.sort());
      const [reports] = await knex('bench_reports as b')
        .join('fixes as f', 'f.id', 'b.fix_id')
        .where('f.id', row.id)
        .whereRaw('b.member_id <> f.created_by')
        .count({ n: '*' });
      expect(record.benchReports.counted).toBe(Number(reports?.n));
      const photoCount = await knex('revision_photos as rp')
        .join('photos as p', 'p.id', 'rp.photo_id')
        .where('rp.revision_id', row.revision_id)
        .whereNull('p.deleted_at')
        .count({ n: '*' });
      expect(record.photos.length).toBe(Number(photoCount[0]?.n));
      expect(record.url).toBe(`https://bench.example.test/fixes/${record.slug}`);
    }
  });

  it('credits the authors and proofers of the proofed revisions, with absolute photo addresses and their alt text', () => {
    for (const record of records) {
      expect(record.attribution.some((a) => a.role === 'author')).toBe(true);
      for (const photo of record.photos) {
        expect(photo.altText.trim()).not.toBe('');
        for (const r of photo.renditions) expect(r.url).toMatch(/^https:\/\/bench\.example\.test\/media\//);
      }
    }
    expect(records.some((r) => r.photos.length > 0)).toBe(true);
  });

  it('carries no e-mail address and leaves out a hidden fix', async () => {
    const emails: string[] = await knex('users').pluck('email');
    expect(emails.length).toBeGreaterThan(0);
    for (const email of emails) expect(text).not.toContain(email);
    expect(records.map((r) => r.slug)).not.toContain(hiddenSlug);
    expect(text).not.toContain(`"slug":"${hiddenSlug}"`);
  });
});
