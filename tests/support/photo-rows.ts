// A photo row with one tiny stored rendition, as an upload leaves it, for tests of the photo clean-up.
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { storage } from '@/server/storage';

/** An unattached photo of `ownerId` uploaded `hoursAgo`, its rendition key tagged with `tag`. */
export async function storedPhotoRow(
  knex: Knex,
  ownerId: number,
  options: { hoursAgo: number; tag: string; altText: string },
): Promise<{ id: number; key: string }> {
  const sha = randomBytes(32).toString('hex');
  const key = `photos/${sha.slice(0, 2)}/${sha.slice(0, 16)}-${options.tag}-480.jpg`;
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
      alt_text: options.altText,
      created_at: new Date(Date.now() - options.hoursAgo * 3_600_000),
    })
    .returning('id');
  return { id, key };
}
