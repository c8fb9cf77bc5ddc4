// The mail outbox: every message the app sends is a job in a PostgreSQL queue (pg-boss), sent by the outbox worker.
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { config, type Config } from '../core/config';
import { db } from '../core/db';
import { ensureQueue, sendJob, type RetryPolicy } from '../core/job-queue';
import type { OutgoingMail } from './send';

/**
 * The queue of messages for one relay: every instance sending through SMTP_URL shares `mail-outbox`; a server using a
 * local sink has a queue for that sink alone, so servers side by side (the tests') never send each other's mail.
 */
export function mailQueue(settings: Pick<Config, 'SMTP_URL' | 'SMTP_SINK_PORT'> = config()): string {
  return settings.SMTP_URL ? 'mail-outbox' : `mail-outbox-sink-${settings.SMTP_SINK_PORT}`;
}

/**
 * Retries with back-off from 2 s (about 2, 4, 8 … s apart, 20 tries: well over a day). While the relay cannot be
 * reached, the worker also checks it every few seconds and sends everything waiting as soon as it answers again.
 */
export const mailRetry: RetryPolicy = { retryLimit: 20, retryDelay: 2, retryBackoff: true };

export interface MailJob {
  mail: OutgoingMail;
}

export function ensureMailQueue(): Promise<void> {
  return ensureQueue(mailQueue(), mailRetry);
}

/**
 * Puts a message in the outbox; it is sent by the worker, at once when the relay answers, later when it does not.
 * Pass a transaction as `knex` to send the message only if that transaction commits. Returns the message's id.
 */
export async function enqueueMail(mail: OutgoingMail, knex: Knex = db()): Promise<string> {
  await ensureMailQueue();
  const id = randomUUID();
  const job: MailJob = { mail };
  await sendJob(knex, mailQueue(), job, { ...mailRetry, id, expireInSeconds: 120 });
  return id;
}
