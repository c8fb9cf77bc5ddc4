// The pg-boss plumbing every queue shares: its schema and queues installed once, jobs sent through Knex.
import PgBoss from 'pg-boss';
import type { Knex } from 'knex';
import { config, databaseUrl } from './config';
import { logger } from './logger';

export interface RetryPolicy {
  retryLimit: number;
  /** Seconds before the first retry; with back-off each retry waits about twice as long as the one before. */
  retryDelay: number;
  retryBackoff: boolean;
}

/** Runs pg-boss's SQL on a Knex connection, so a job sent inside a transaction appears only when it commits. */
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

const installed = new Map<string, Promise<void>>();

/** Installs pg-boss's schema and one queue once per process (a short-lived connection of its own). */
export function ensureQueue(name: string, retry: RetryPolicy, connectionString = databaseUrl(config())): Promise<void> {
  const key = `${connectionString} ${name}`;
  let done = installed.get(key);
  if (!done) {
    done = (async () => {
      const boss = new PgBoss({ connectionString, max: 1, supervise: false, schedule: false });
      boss.on('error', (error) => logger().warn({ err: error, queue: name }, 'job queue set-up'));
      await boss.start();
      try {
        if (!(await boss.getQueue(name))) await boss.createQueue(name, { name, ...retry });
      } finally {
        await boss.stop({ graceful: false, wait: true });
      }
    })().catch((error: unknown) => {
      installed.delete(key);
      throw error;
    });
    installed.set(key, done);
  }
  return done;
}

/** Sends one job through `knex` (a transaction's jobs appear only when it commits); returns its id. */
export async function sendJob(knex: Knex, name: string, data: object, options: PgBoss.SendOptions): Promise<string | null> {
  const sender = new PgBoss({ db: knexExecutor(knex), supervise: false, schedule: false, migrate: false });
  return sender.send(name, data, { ...options, db: knexExecutor(knex) });
}

export interface QueueWorker {
  /** Stops taking jobs; jobs in hand are finished, or after `timeoutMs` returned to the queue. */
  stop(timeoutMs?: number): Promise<void>;
}

/** Works one queue in batches; a thrown error returns the batch to the queue for a later retry. */
export async function startQueueWorker<T extends object>(
  name: string,
  retry: RetryPolicy,
  handler: (jobs: T[]) => Promise<void>,
  options: { batchSize?: number; pollingIntervalSeconds?: number; connectionString?: string } = {},
): Promise<QueueWorker> {
  const connectionString = options.connectionString ?? databaseUrl(config());
  await ensureQueue(name, retry, connectionString);
  const boss = new PgBoss({ connectionString, max: 2, schedule: false });
  boss.on('error', (error) => logger().warn({ err: error, queue: name }, 'job queue'));
  await boss.start();
  await boss.work<T>(
    name,
    { batchSize: options.batchSize ?? 10, pollingIntervalSeconds: options.pollingIntervalSeconds ?? 2 },
    async (jobs) => {
      await handler(jobs.map((job) => job.data));
    },
  );
  return {
    async stop(timeoutMs = 10_000) {
      await boss.stop({ graceful: true, wait: true, timeout: timeoutMs });
    },
  };
}
