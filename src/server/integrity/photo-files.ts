// The photo store against the photo rows: rows whose files are gone, and files no row names (orphans, e.g. left
// by a crash between writing renditions and recording them), which are collected once they are old enough.
import type { Knex } from 'knex';
import type { StorageDriver } from '../storage/storage-driver';

/** Photo files live under this prefix; the `uploads/<sha>` placeholder of a pending photo is not a file. */
const PHOTO_PREFIX = 'photos/';

async function namedKeys(knex: Knex): Promise<{ all: Set<string>; needed: Map<string, number> }> {
  const rows: { id: number; storage_key: string; renditions: { key?: string }[]; processing_state: string; deleted_at: Date | null }[] =
    await knex('photos').select('id', 'storage_key', 'renditions', 'processing_state', 'deleted_at');
  const all = new Set<string>();
  const needed = new Map<string, number>();
  for (const row of rows) {
    const keys = [row.storage_key, ...(row.renditions ?? []).map((r) => r.key ?? '')].filter((k) => k.startsWith(PHOTO_PREFIX));
    for (const key of keys) {
      all.add(key);
      if (row.processing_state === 'ready' && !row.deleted_at) needed.set(key, row.id);
    }
  }
  return { all, needed };
}

export interface PhotoFileReport {
  /** Ready photos with a file missing: photo id and the missing key. */
  missing: { photoId: number; key: string }[];
  /** Files no photo row names; `collected` were deleted, the rest are younger than the grace period. */
  orphans: string[];
  collected: string[];
}

/**
 * Compares store and rows. Orphans older than `graceMs` are deleted when `collect` is set: a younger one may
 * belong to an upload whose row is being written right now.
 */
export async function checkPhotoFiles(
  knex: Knex,
  store: StorageDriver,
  options: { collect: boolean; graceMs: number; now?: Date },
): Promise<PhotoFileReport> {
  const stored = new Map<string, Date>();
  for await (const object of store.list(PHOTO_PREFIX)) stored.set(object.key, object.modifiedAt);
  const { all, needed } = await namedKeys(knex);
  const missing = [...needed].filter(([key]) => !stored.has(key)).map(([key, photoId]) => ({ photoId, key }));
  const orphans = [...stored.keys()].filter((key) => !all.has(key)).sort();
  const collected: string[] = [];
  const cutoff = (options.now ?? new Date()).getTime() - options.graceMs;
  if (options.collect) {
    for (const key of orphans) {
      if (stored.get(key)!.getTime() > cutoff) continue;
      await store.delete(key);
      collected.push(key);
    }
  }
  return { missing, orphans, collected };
}
