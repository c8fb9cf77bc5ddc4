// Background work starts with the server: a fresh server that has only been asked for its home page cleans up abandoned photos.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { storage } from '@/server/storage';
import { testDb } from '../support/db';
import { startServer } from '../support/server';
import { INTEGRATION_PORT } from '../support/test-env';
import { createUser } from '../support/sign-in';

// A server of its own (the shared one has long since seen photo requests); +7 is the mail test's.
const port = INTEGRATION_PORT + 3;
const knex = testDb();
let ownerId: number;

beforeAll(async () => {
  ownerId = (await createUser(knex, { tag: 'bg-photos' })).id;
});
afterAll(() => knex.destroy());

/** An unattached upload from two days ago, with one stored rendition: what the cleanup removes. */
async function abandonedPhoto(): Promise<{ id: number; key: string }> {
  const sha = randomBytes(32).toString('hex');
  const key = `photos/${sha.slice(0, 2)}/${sha.slice(0, 16)}-background-480.jpg`;
  await storage().put(key, Buffer.from([0xff, 0xd8, 0xff, 0xd9]), 'image/jpeg');
  const [{ id }] = await knex('photos')
    .insert({
      owner_id: ownerId,
      storage_key: key,
      mime_type: 'image/jpeg',
      byte_size: 4,
      width: 480,
      height: 320,
      sha256: sha,
      renditions: JSON.stringify([{ width: 480, height: 320, format: 'jpeg', key, bytes: 4 }]),
      alt_text: 'A photo nobody used',
      created_at: new Date(Date.now() - 48 * 3_600_000),
    })
    .returning('id');
  return { id, key };
}

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
