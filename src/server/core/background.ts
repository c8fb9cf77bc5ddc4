// Starts the app's own background work once per process: photo renditions and clean-up, and (with Meilisearch) search sync.
import { ensurePhotoWorker } from '../photos/worker';
import { ensureSearchSyncWorker } from '../search/provider';
import { logger } from './logger';
import { startNewsWorker } from '../notifications/news';
import { startDigestTimer } from '../notifications/digest';

let started = false;

/**
 * Called by the middleware on every request; only the first does anything. Astro 5's Node adapter loads the
 * app lazily and offers no start-up hook, so the first request of any kind (a health check will do) starts it.
 */
export function startBackgroundWork(): void {
  if (started) return;
  started = true;
  ensurePhotoWorker();
  ensureSearchSyncWorker();
  startNewsWorker().catch((error: unknown) => logger().error({ err: error }, 'news worker did not start'));
  startDigestTimer();
}
