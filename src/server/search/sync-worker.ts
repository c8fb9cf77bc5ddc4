// Works the search-sync queue: reads each named fix from PostgreSQL and upserts or deletes it in Meilisearch.
import PgBoss from 'pg-boss';
import type { Knex } from 'knex';
import { config, databaseUrl } from '../core/config';
import { logger } from '../core/logger';
import { documentsFor } from './meili/documents';
import type { MeiliIndex } from './meili/index-client';
import { activeWordFamilies } from './word-families';
import { SEARCH_SYNC_QUEUE, ensureSearchQueue, type SearchSyncJob } from './sync-queue';

export interface SyncWorker {
  stop(): Promise<void>;
}

export interface SyncWorkerOptions {
  connectionString?: string;
  pollingIntervalSeconds?: number;
}

/** Applies one batch of jobs. Throwing fails the whole batch, and pg-boss retries it later. */
export async function applySyncJobs(knex: Knex, meili: MeiliIndex, jobs: SearchSyncJob[], prepared: { done: boolean }): Promise<void> {
  if (!prepared.done) {
    await meili.prepare(await activeWordFamilies(knex));
    prepared.done = true;
  }
  if (jobs.some((j) => 'synonyms' in j)) await meili.updateSynonyms(await activeWordFamilies(knex));
  const ids = [...new Set(jobs.flatMap((j) => ('fixId' in j ? [j.fixId] : [])))];
  // Always the fix's state now, not when the job was sent: jobs may run late, twice or out of order.
  const documents = await documentsFor(knex, ids);
  const present = new Set(documents.map((d) => d.id));
  await meili.apply(
    documents,
    ids.filter((id) => !present.has(id)),
  );
}

export async function startSearchSyncWorker(knex: Knex, meili: MeiliIndex, options: SyncWorkerOptions = {}): Promise<SyncWorker> {
  const connectionString = options.connectionString ?? databaseUrl(config());
  await ensureSearchQueue(connectionString);
  const boss = new PgBoss({ connectionString, max: 2, schedule: false });
  boss.on('error', (error) => logger().warn({ err: error }, 'search sync queue'));
  await boss.start();
  const prepared = { done: false };
  await boss.work<SearchSyncJob>(
    SEARCH_SYNC_QUEUE,
    { batchSize: 50, pollingIntervalSeconds: options.pollingIntervalSeconds ?? 2 },
    async (jobs) => {
      try {
        await applySyncJobs(
          knex,
          meili,
          jobs.map((j) => j.data),
          prepared,
        );
      } catch (error) {
        prepared.done = false;
        logger().warn({ err: error, jobs: jobs.length }, 'search sync failed; pg-boss will retry');
        throw error;
      }
    },
  );
  return {
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
