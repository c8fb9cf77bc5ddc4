// Removes uploads nobody used: photos never attached to a revision past draft, older than a day.
import type { Knex } from 'knex';
import { logger } from '../core/logger';
import { storage } from '../storage';
import type { Rendition } from './renditions';

export const ABANDONED_AFTER_HOURS = 24;
/** A photo in a draft its writer touched this recently is still work in progress and stays. */
export const DRAFT_GRACE_DAYS = 30;

/**
 * Soft-deletes abandoned photos (the row stays, marked deleted) and removes their stored renditions and any
 * waiting upload bytes. Illustrations and photos on any submitted, proofed, returned or withdrawn revision stay.
 */
export async function cleanupAbandonedPhotos(knex: Knex, now: Date = new Date()): Promise<{ removed: number[] }> {
  const cutoff = new Date(now.getTime() - ABANDONED_AFTER_HOURS * 3_600_000);
  const draftCutoff = new Date(now.getTime() - DRAFT_GRACE_DAYS * 86_400_000);
  const rows: { id: number; renditions: Rendition[] }[] = await knex('photos as p')
    .whereNull('p.deleted_at')
    .where('p.is_illustration', false)
    .where('p.created_at', '<', cutoff)
    .whereNotExists(
      knex('revision_photos as rp')
        .join('revisions as r', 'r.id', 'rp.revision_id')
        .whereRaw('rp.photo_id = p.id')
        .whereNot('r.state', 'draft'),
    )
    .whereNotExists(
      knex('revision_photos as rp')
        .join('revisions as r', 'r.id', 'rp.revision_id')
        .whereRaw('rp.photo_id = p.id')
        .where('r.state', 'draft')
        .where('r.updated_at', '>=', draftCutoff),
    )
    .limit(500)
    .select('p.id', 'p.renditions');
  const removed: number[] = [];
  for (const row of rows) {
    try {
      for (const r of row.renditions) await storage().delete(r.key);
      await knex('photo_uploads').where({ photo_id: row.id }).delete();
      await knex('photos').where({ id: row.id }).whereNull('deleted_at').update({ deleted_at: now });
      removed.push(row.id);
    } catch (error) {
      logger().warn({ err: error, photoId: row.id }, 'abandoned photo could not be removed; it is tried again next time');
    }
  }
  return { removed };
}
