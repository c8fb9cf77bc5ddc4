// Makes the renditions of uploaded photos off the request path; any app instance may pick up any pending photo.
import type { Knex } from 'knex';
import { logger } from '../core/logger';
import { storage } from '../storage';
import { makeRenditions } from './renditions';

const MAX_ATTEMPTS = 3;

/** Where a photo's renditions live: by hash for spreading, with the id so a re-upload after deletion never collides. */
export function renditionPrefix(sha256: string, photoId: number): string {
  return `photos/${sha256.slice(0, 2)}/${sha256.slice(0, 16)}-${photoId}`;
}

/** Processes one pending photo if no other worker holds it; true when it did one. */
async function processOne(knex: Knex): Promise<boolean> {
  return knex.transaction(async (trx) => {
    const photo = await trx('photos')
      .where({ processing_state: 'pending' })
      .whereNull('deleted_at')
      .orderBy('created_at')
      .forUpdate()
      .skipLocked()
      .first('id', 'sha256', 'processing_attempts');
    if (!photo) return false;
    const upload = await trx('photo_uploads').where({ photo_id: photo.id }).first('bytes');
    if (!upload) {
      await trx('photos').where({ id: photo.id }).update({
        processing_state: 'failed',
        processing_error: 'The uploaded file was lost before it could be processed; upload it again.',
      });
      return true;
    }
    try {
      const made = await makeRenditions(upload.bytes as Buffer, renditionPrefix(photo.sha256, photo.id));
      for (const r of made.renditions) await storage().put(r.key, r.body, r.format === 'webp' ? 'image/webp' : 'image/jpeg');
      const largestJpeg = made.renditions.filter((r) => r.format === 'jpeg').sort((a, b) => b.width - a.width)[0];
      await trx('photos')
        .where({ id: photo.id })
        .update({
          processing_state: 'ready',
          processing_error: null,
          storage_key: largestJpeg?.key ?? `uploads/${photo.sha256}`,
          width: made.width,
          height: made.height,
          renditions: JSON.stringify(made.renditions.map(({ body: _body, ...r }) => r)),
        });
      // The upload as sent may carry camera metadata (GPS included): it is not kept once the renditions exist.
      await trx('photo_uploads').where({ photo_id: photo.id }).delete();
    } catch (error) {
      const attempts = Number(photo.processing_attempts) + 1;
      logger().warn({ err: error, photoId: photo.id, attempts }, 'photo renditions failed');
      const giveUp = attempts >= MAX_ATTEMPTS;
      await trx('photos')
        .where({ id: photo.id })
        .update({
          processing_attempts: attempts,
          processing_state: giveUp ? 'failed' : 'pending',
          processing_error: giveUp ? 'The photo could not be processed. Save it again as JPEG or PNG and upload that.' : null,
        });
      if (giveUp) await trx('photo_uploads').where({ photo_id: photo.id }).delete();
    }
    return true;
  });
}

/** Works through pending photos, one transaction each; returns how many it handled. */
export async function processPendingPhotos(knex: Knex, limit = 20): Promise<number> {
  let done = 0;
  while (done < limit && (await processOne(knex))) done++;
  return done;
}
