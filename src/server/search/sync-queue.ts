// Keeps Meilisearch in step with PostgreSQL through a pg-boss job queue: jobs survive restarts and Meilisearch outages.
import PgBoss from 'pg-boss';
import type { Knex } from 'knex';
import { config, databaseUrl } from '../core/config';
import { logger } from '../core/logger';

export const SEARCH_SYNC_QUEUE = 'search-sync';

/** A job names one fix to bring up to date, or asks for the synonyms to be set again. */
export type SearchSyncJob = { fixId: number } | { synonyms: true };

export interface RetryPolicy {
  retryLimit: number;
  retryDelay: number;
  retryBackoff: boolean;
}

/** About a day and a half of retries with back-off: an outage of that length loses nothing. */
export const defaultRetry: RetryPolicy = { retryLimit: 16, retryDelay: 5, retryBackoff: true };

export function meiliConfigured(): boolean {
  return Boolean(config().MEILI_URL);
}

/** Runs pg-boss's SQL on a Knex connection, so a job is sent inside the caller's transaction. */
export function knexExecutor(knex: Knex): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[]) {
      const connection = await knex.client.acquireConnection();
      try {
        const result = await connection.query(text, values);
        return { rows: result.rows ?? [] };
      } finally {
        await knex.client.releaseConnection(connection);
      }
    },
  };
}

let installed: Promise<void> | null = null;

/** Installs pg-boss's schema and our queue once per process (a short-lived connection of its own). */
export function ensureSearchQueue(connectionString = databaseUrl(config()), retry: RetryPolicy = defaultRetry): Promise<void> {
  installed ??= (async () => {
    const boss = new PgBoss({ connectionString, max: 1, supervise: false, schedule: false });
    boss.on('error', (error) => logger().warn({ err: error }, 'search queue set-up'));
    await boss.start();
    try {
      if (!(await boss.getQueue(SEARCH_SYNC_QUEUE))) await boss.createQueue(SEARCH_SYNC_QUEUE, { name: SEARCH_SYNC_QUEUE, ...retry });
    } finally {
      await boss.stop({ graceful: false, wait: true });
    }
  })().catch((error: unknown) => {
    installed = null;
    throw error;
  });
  return installed;
}

/** Sends a sync job through `knex` (a transaction's jobs appear only when it commits). */
export async function sendSearchSync(knex: Knex, job: SearchSyncJob, retry: RetryPolicy = defaultRetry): Promise<void> {
  await ensureSearchQueue();
  const sender = new PgBoss({ db: knexExecutor(knex), supervise: false, schedule: false, migrate: false });
  await sender.send(SEARCH_SYNC_QUEUE, job, { ...retry, db: knexExecutor(knex) });
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
