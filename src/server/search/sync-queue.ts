// Keeps Meilisearch in step with PostgreSQL through a pg-boss job queue: jobs survive restarts and Meilisearch outages.
import type { Knex } from 'knex';
import { config, databaseUrl } from '../core/config';
import { ensureQueue, sendJob, type RetryPolicy } from '../core/job-queue';

export const SEARCH_SYNC_QUEUE = 'search-sync';

/** A job names one fix to bring up to date, or asks for the synonyms to be set again. */
export type SearchSyncJob = { fixId: number } | { synonyms: true };

/** About a day and a half of retries with back-off: an outage of that length loses nothing. */
export const defaultRetry: RetryPolicy = { retryLimit: 16, retryDelay: 5, retryBackoff: true };

export function meiliConfigured(): boolean {
  return Boolean(config().MEILI_URL);
}

/** Installs pg-boss's schema and our queue once per process. */
export function ensureSearchQueue(connectionString = databaseUrl(config()), retry: RetryPolicy = defaultRetry): Promise<void> {
  return ensureQueue(SEARCH_SYNC_QUEUE, retry, connectionString);
}

/** Sends a sync job through `knex` (a transaction's jobs appear only when it commits). */
export async function sendSearchSync(knex: Knex, job: SearchSyncJob, retry: RetryPolicy = defaultRetry): Promise<void> {
  await ensureSearchQueue();
  await sendJob(knex, SEARCH_SYNC_QUEUE, job, retry);
}

/** Called whenever a fix's search row changes; does nothing unless Meilisearch is configured. */
export async function queueSearchSync(knex: Knex, fixId: number): Promise<void> {
  if (!meiliConfigured()) return;
  await sendSearchSync(knex, { fixId });
}

/** Called when word families change, so Meilisearch's synonyms follow. */
export async function queueSynonymsSync(knex: Knex): Promise<void> {
  if (!meiliConfigured()) return;
  await sendSearchSync(knex, { synonyms: true });
}
