// Background jobs through pg-boss: queues installed once per process, jobs sent inside the caller's
// transaction (they appear only when it commits), workers started at boot and stopped gracefully.
import PgBoss from 'pg-boss';
import type { Knex } from 'knex';
import { config, databaseUrl } from './config';
import { logger } from './logger';
import { knexExecutor } from '../search/sync-queue';

export interface QueuePolicy {
  retryLimit: number;
  retryDelay: number;
  retryBackoff: boolean;
}

/** Retries with back-off for about a day: an outage of that length loses nothing. */
export const standardPolicy: QueuePolicy = { retryLimit: 12, retryDelay: 5, retryBackoff: true };

const installed = new Map<string, Promise<void>>();

/** Creates the queue (and pg-boss's schema) once per process, on a short-lived connection of its own. */
export function ensureQueue(name: string, policy: QueuePolicy = standardPolicy, connectionString = databaseUrl(config())): Promise<void> {
  let done = installed.get(name);
  if (!done) {
    done = (async () => {
      const boss = new PgBoss({ connectionString, max: 1, supervise: false, schedule: false });
      boss.on('error', (error) => logger().warn({ err: error, queue: name }, 'job queue set-up'));
      await boss.start();
      try {
        if (!(await boss.getQueue(name))) await boss.createQueue(name, { name, ...policy });
      } finally {
        await boss.stop({ graceful: false, wait: true });
      }
    })().catch((error: unknown) => {
      installed.delete(name);
      throw error;
    });
    installed.set(name, done);
  }
  return done;
}

/** Sends one job through `knex`: inside a transaction it is sent only if the transaction commits. */
export async function sendJob<T extends object>(knex: Knex, name: string, data: T, options: PgBoss.SendOptions = {}): Promise<void> {
  await ensureQueue(name);
  const sender = new PgBoss({ db: knexExecutor(knex), supervise: false, schedule: false, migrate: false });
  await sender.send(name, data, { ...standardPolicy, ...options, db: knexExecutor(knex) });
}

export interface Worker {
  stop(): Promise<void>;
}

/** Works one queue in batches; a thrown error returns the batch to the queue for a later retry. */
export async function startWorker<T extends object>(
  name: string,
  handler: (jobs: T[]) => Promise<void>,
  options: { batchSize?: number; pollingIntervalSeconds?: number; connectionString?: string } = {},
): Promise<Worker> {
  const connectionString = options.connectionString ?? databaseUrl(config());
  await ensureQueue(name, standardPolicy, connectionString);
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
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
