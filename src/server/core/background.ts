// The app's background work, started once at boot by the server entry (scripts/serve.ts) and stopped on SIGTERM.
import { startMailOutbox, type MailOutbox } from '../mail/outbox-worker';
import { startPhotoWorker } from '../photos/worker';
import { ensureSearchSyncWorker } from '../search/provider';
import { logger } from './logger';
import { startNewsWorker } from '../notifications/news';
import { startDigestTimer } from '../notifications/digest';
import type { QueueWorker } from './job-queue';

export interface BackgroundWork {
  /** Stops taking new work; work in hand is finished, or after `timeoutMs` returned to its queue. */
  stop(timeoutMs?: number): Promise<void>;
}

/** How long to wait before trying again to start a queue worker when PostgreSQL did not answer at boot. */
const RETRY_START_MS = 3_000;

/**
 * Photo renditions and clean-up, search sync (with Meilisearch), the mail outbox, the news fan-out and the weekly digest. A worker that cannot start
 * because the database is down tries again every few seconds, so the server answers (with 503s) meanwhile.
 */
export function startBackgroundWork(): BackgroundWork {
  const photos = startPhotoWorker();
  let stopping = false;
  let retry: NodeJS.Timeout | undefined;
  let outbox: Promise<MailOutbox | null> = Promise.resolve(null);

  const startOutbox = (): void => {
    outbox = startMailOutbox().catch((error: unknown) => {
      if (stopping) return null;
      logger().warn({ err: error }, 'mail outbox did not start; trying again shortly');
      retry = setTimeout(startOutbox, RETRY_START_MS);
      return null;
    });
  };
  startOutbox();
  const search = ensureSearchSyncWorker();
  let newsRetry: NodeJS.Timeout | undefined;
  let news: Promise<QueueWorker | null> = Promise.resolve(null);
  const startNews = (): void => {
    news = startNewsWorker().catch((error: unknown) => {
      if (stopping) return null;
      logger().warn({ err: error }, 'news worker did not start; trying again shortly');
      newsRetry = setTimeout(startNews, RETRY_START_MS);
      return null;
    });
  };
  startNews();
  const digests = startDigestTimer();

  return {
    async stop(timeoutMs = 10_000) {
      stopping = true;
      clearTimeout(retry);
      clearTimeout(newsRetry);
      digests.stop();
      await Promise.all([
        photos.stop(),
        outbox.then((worker) => worker?.stop(timeoutMs)),
        search.then((worker) => worker?.stop()),
        news.then((worker) => worker?.stop(timeoutMs)),
      ]);
    },
  };
}
