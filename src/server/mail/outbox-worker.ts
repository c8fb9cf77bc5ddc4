// Works the mail outbox: sends each message once, retries with back-off, and sends everything waiting once the relay is back.
import PgBoss from 'pg-boss';
import { config, databaseUrl } from '../core/config';
import { logger } from '../core/logger';
import { ensureMailQueue, mailQueue, type MailJob } from './outbox';
import { sendMail } from './send';
import { mailTransport } from './transport';

export interface MailOutbox {
  /** Stops taking messages; one being sent is finished (or, after `timeoutMs`, returned to the queue). */
  stop(timeoutMs?: number): Promise<void>;
}

export interface MailOutboxOptions {
  connectionString?: string;
  pollingIntervalSeconds?: number;
  /** How often, while messages wait because the relay could not be reached, the relay is asked whether it is back. */
  relayCheckMs?: number;
}

/** Errors that mean the relay could not be reached at all (as opposed to refusing one message). */
const unreachableCodes = new Set(['ECONNECTION', 'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'ESOCKET', 'EDNS', 'EHOSTUNREACH']);

export function relayUnreachable(error: unknown): boolean {
  const { code, command } = (error ?? {}) as { code?: string; command?: string };
  return (code !== undefined && unreachableCodes.has(code)) || command === 'CONN';
}

/** Messages the relay has accepted in this process, kept so that one whose completion was not recorded is not sent again. */
class SentMemory {
  readonly #ids = new Set<string>();
  has(id: string): boolean {
    return this.#ids.has(id);
  }
  add(id: string): void {
    this.#ids.add(id);
    if (this.#ids.size > 5_000) this.#ids.delete(this.#ids.values().next().value as string);
  }
}

export async function startMailOutbox(options: MailOutboxOptions = {}): Promise<MailOutbox> {
  const connectionString = options.connectionString ?? databaseUrl(config());
  await ensureMailQueue();
  const boss = new PgBoss({ connectionString, max: 2, schedule: false });
  boss.on('error', (error) => logger().warn({ err: error }, 'mail outbox queue'));
  await boss.start();
  const sent = new SentMemory();
  const queue = mailQueue();

  await boss.work<MailJob>(queue, { batchSize: 5, pollingIntervalSeconds: options.pollingIntervalSeconds ?? 1 }, async (jobs) => {
    for (const job of jobs) {
      if (sent.has(job.id)) continue;
      try {
        await sendMail(job.data.mail, job.id);
        sent.add(job.id);
      } catch (error) {
        const unreachable = relayUnreachable(error);
        logger().warn(
          { err: error, mailId: job.id, subject: job.data.mail.subject, unreachable },
          'mail not sent yet; it stays in the outbox',
        );
        // Only this message goes back to wait; the others in the batch are completed when the handler returns.
        await boss.fail(queue, job.id, { message: error instanceof Error ? error.message : String(error), unreachable });
      }
    }
  });

  let checking = false;
  const relayCheck = setInterval(() => {
    if (checking) return;
    checking = true;
    releaseWhenRelayIsBack(boss, queue)
      .catch((error: unknown) => logger().debug({ err: error }, 'mail relay check'))
      .finally(() => (checking = false));
  }, options.relayCheckMs ?? 2_000);
  relayCheck.unref();

  return {
    async stop(timeoutMs = 10_000) {
      clearInterval(relayCheck);
      await boss.stop({ graceful: true, wait: true, timeout: timeoutMs });
    },
  };
}

/**
 * Back-off alone would leave a message waiting up to its next slot (minutes or hours into an outage). Messages that
 * failed because the relay was unreachable are made due now as soon as the relay answers a connection check.
 */
async function releaseWhenRelayIsBack(boss: PgBoss, queue: string): Promise<void> {
  const dbase = boss.getDb();
  const waiting = `FROM pgboss.job WHERE name = $1 AND state = 'retry' AND start_after > now() AND output->>'unreachable' = 'true'`;
  const { rows } = await dbase.executeSql(`SELECT count(*)::int AS n ${waiting}`, [queue]);
  if (!rows[0] || rows[0].n === 0) return;
  await mailTransport().verify();
  const released = await dbase.executeSql(`UPDATE pgboss.job SET start_after = now() WHERE id IN (SELECT id ${waiting}) RETURNING id`, [
    queue,
  ]);
  logger().info({ messages: released.rows.length }, 'mail relay answers again: waiting messages released');
}
