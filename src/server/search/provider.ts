// Chooses the search provider from configuration: Meilisearch when MEILI_URL is set, PostgreSQL otherwise.
import { config } from '../core/config';
import { db } from '../core/db';
import { logger } from '../core/logger';
import { MeiliIndex } from './meili/index-client';
import { MeiliSearchProvider } from './meili/meili-provider';
import { PostgresSearchProvider } from './pg-provider';
import type { SearchProvider } from './provider-types';
import { startSearchSyncWorker, type SyncWorker } from './sync-worker';

let provider: SearchProvider | undefined;
let meili: MeiliIndex | undefined;
let worker: Promise<SyncWorker | null> | undefined;

function meiliIndex(url: string, key: string | undefined): MeiliIndex {
  meili ??= new MeiliIndex({ url, key });
  return meili;
}

/** Starts the app's own sync worker once when Meilisearch is configured (core/background.ts calls it at boot). */
export function ensureSearchSyncWorker(): Promise<SyncWorker | null> {
  const { MEILI_URL, MEILI_KEY } = config();
  if (!MEILI_URL) return Promise.resolve(null);
  if (worker) return worker;
  worker = startSearchSyncWorker(db(), meiliIndex(MEILI_URL, MEILI_KEY)).catch((error: unknown) => {
    logger().error({ err: error }, 'search sync worker did not start');
    return null;
  });
  return worker;
}

export function searchProvider(): SearchProvider {
  if (provider) return provider;
  const { MEILI_URL, MEILI_KEY } = config();
  if (!MEILI_URL) return (provider = new PostgresSearchProvider(db()));
  return (provider = new MeiliSearchProvider(db(), meiliIndex(MEILI_URL, MEILI_KEY)));
}
