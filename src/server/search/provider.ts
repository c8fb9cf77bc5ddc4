// Chooses the search provider from configuration: Meilisearch when MEILI_URL is set, PostgreSQL otherwise.
import { config } from '../config';
import { db } from '../db';
import { logger } from '../logger';
import { MeiliIndex } from './meili/index-client';
import { MeiliSearchProvider } from './meili/meili-provider';
import { PostgresSearchProvider } from './pg-provider';
import type { SearchProvider } from './provider-types';
import { startSearchSyncWorker, type SyncWorker } from './sync-worker';

let provider: SearchProvider | undefined;
let worker: Promise<SyncWorker | null> | undefined;

export function searchProvider(): SearchProvider {
  if (provider) return provider;
  const { MEILI_URL, MEILI_KEY } = config();
  if (!MEILI_URL) return (provider = new PostgresSearchProvider(db()));
  const meili = new MeiliIndex({ url: MEILI_URL, key: MEILI_KEY });
  // The app process works the sync queue too, so a single `npm start` keeps Meilisearch current.
  worker ??= startSearchSyncWorker(db(), meili).catch((error: unknown) => {
    logger().error({ err: error }, 'search sync worker did not start');
    return null;
  });
  return (provider = new MeiliSearchProvider(db(), meili));
}
