// The cleanup job removes photos nobody used (never on a revision past draft, older than a day) and keeps the rest.
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cleanupAbandonedPhotos } from '@/server/photos/cleanup';
import { storage } from '@/server/storage';
import { testDb } from '../support/db';
import { testEnv } from '../support/test-env';
import { createUser } from '../support/sign-in';
import { storedPhotoRow } from '../support/photo-rows';

const knex = testDb();
const HOUR = 3_600_000;
let ownerId: number;

beforeAll(async () => {
  ownerId = (await createUser(knex, { tag: 'wr-cleanup' })).id;
});
afterAll(() => knex.destroy());

/** A photo row (created `hoursAgo`) with one stored rendition, optionally on a revision in `state`. */
async function photo(hoursAgo: number, onRevision?: 'draft' | 'submitted', draftTouchedHoursAgo = 0): Promise<{ id: number; key: string }> {
  const { id, key } = await storedPhotoRow(knex, ownerId, { hoursAgo, tag: 'cleanup', altText: 'A test photo' });
  if (onRevision) {
    // A fix of its own each time: a writer keeps one draft per fix.
    const [{ id: fixId }] = await knex('fixes')
      .insert({ slug: `draft-cleanup-${randomBytes(4).toString('hex')}`, created_by: ownerId })
      .returning('id');
    const [{ id: revisionId }] = await knex('revisions')
      .insert({
        fix_id: fixId,
        number: 1,
        author_id: ownerId,
        title: 'Cleanup test',
        body: JSON.stringify({ type: 'doc', content: [] }),
        symptoms: ['x'],
        state: onRevision,
        submitted_at: onRevision === 'submitted' ? new Date() : null,
        updated_at: new Date(Date.now() - draftTouchedHoursAgo * HOUR),
      })
      .returning('id');
    await knex('revision_photos').insert({ revision_id: revisionId, photo_id: id });
  }
  return { id, key };
}

describe('cleanupAbandonedPhotos', () => {
  it('removes a back-dated unattached photo and its files, and keeps used, recent and in-progress ones', async () => {
    const abandoned = await photo(48);
    const submitted = await photo(48, 'submitted');
    const recent = await photo(2);
    const inDraft = await photo(48, 'draft', 1);
    const staleDraft = await photo(24 * 60, 'draft', 24 * 45);

    const { removed } = await cleanupAbandonedPhotos(knex);
    expect(removed).toContain(abandoned.id);
    expect(removed).toContain(staleDraft.id);
    for (const kept of [submitted, recent, inDraft]) expect(removed).not.toContain(kept.id);

    expect((await knex('photos').where({ id: abandoned.id }).first('deleted_at')).deleted_at).not.toBeNull();
    expect(await storage().get(abandoned.key)).toBeNull();
    expect(await storage().get(submitted.key)).not.toBeNull();
    expect((await knex('photos').where({ id: submitted.id }).first('deleted_at')).deleted_at).toBeNull();
    // Illustrations of the demo world are never touched.
    expect(await knex('photos').where({ is_illustration: true }).whereNotNull('deleted_at').first()).toBeUndefined();
  });

  it('runs as `npm run photos:cleanup`', async () => {
    const abandoned = await photo(30);
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/photos-cleanup.ts'], { env: testEnv(), encoding: 'utf8' });
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(new RegExp(`Removed \\d+ abandoned photo\\(s\\):.*\\b${abandoned.id}\\b`));
  });
});
