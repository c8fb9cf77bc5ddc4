// Background work starts with the server: a fresh server that has only been asked for its home page cleans up abandoned photos.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { storage } from '@/server/storage';
import { testDb } from '../support/db';
import { startServer } from '../support/server';
import { INTEGRATION_PORT } from '../support/test-env';
import { createUser } from '../support/sign-in';
import { storedPhotoRow } from '../support/photo-rows';

// A server of its own (the shared one has long since seen photo requests); +7 is the mail test's.
const port = INTEGRATION_PORT + 3;
const knex = testDb();
let ownerId: number;

beforeAll(async () => {
  ownerId = (await createUser(knex, { tag: 'bg-photos' })).id;
});
afterAll(() => knex.destroy());

/** An unattached upload from two days ago, with one stored rendition: what the cleanup removes. */
const abandonedPhoto = () => storedPhotoRow(knex, ownerId, { hoursAgo: 48, tag: 'background', altText: 'A photo nobody used' });

const deletedAt = async (id: number): Promise<Date | null> => (await knex('photos').where({ id }).first('deleted_at')).deleted_at;

describe('background work', () => {
  it('removes abandoned photos once a fresh server has answered its first request, with no photo request at all', async () => {
    const photo = await abandonedPhoto();
    // The servers already running ran their start-up cleanup before this photo existed; the next is an hour away.
    await new Promise((r) => setTimeout(r, 1_000));
    expect(await deletedAt(photo.id)).toBeNull();

    // startServer waits for GET / to answer: the only request this server ever gets.
    const stop = await startServer(port);
    try {
      let removed: Date | null = null;
      for (let i = 0; i < 60 && !removed; i++) {
        removed = await deletedAt(photo.id);
        if (!removed) await new Promise((r) => setTimeout(r, 250));
      }
      expect(removed, 'the photo was still there 15 s after the server started').not.toBeNull();
      expect(await storage().get(photo.key)).toBeNull();
    } finally {
      await stop();
    }
  });
});
