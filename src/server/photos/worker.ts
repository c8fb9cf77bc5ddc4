// Runs photo work inside the app process: renditions soon after each upload, abandoned uploads once an hour.
import { db } from '../core/db';
import { logger } from '../core/logger';
import { cleanupAbandonedPhotos } from './cleanup';
import { processPendingPhotos } from './processing';

const SWEEP_MS = 15_000;
const CLEANUP_MS = 60 * 60_000;

let running: Promise<void> | null = null;
let kickedMeanwhile = false;

async function drain(): Promise<void> {
  do {
    kickedMeanwhile = false;
    try {
      await processPendingPhotos(db());
    } catch (error) {
      logger().error({ err: error }, 'photo processing failed');
    }
  } while (kickedMeanwhile);
}

/** Processes pending photos now; a kick during a run makes it look once more, so no upload waits for the sweep. */
export function kickPhotoWork(): Promise<void> {
  if (running) {
    kickedMeanwhile = true;
    return running;
  }
  running = drain().finally(() => {
    running = null;
  });
  return running;
}

function cleanUp(): void {
  cleanupAbandonedPhotos(db())
    .then(({ removed }) => removed.length && logger().info({ count: removed.length, photoIds: removed }, 'abandoned photos removed'))
    .catch((error: unknown) => logger().error({ err: error }, 'photo cleanup failed'));
}

/**
 * Starts the periodic sweep and cleanup (the server entry calls it at boot through core/background.ts). Both run at
 * once too, so a restart never leaves photos waiting a full interval; timers never keep the process alive. `stop`
 * ends the timers and waits for a sweep in progress, so no photo is left half processed.
 */
export function startPhotoWorker(): { stop(): Promise<void> } {
  void kickPhotoWork();
  cleanUp();
  const timers = [setInterval(() => void kickPhotoWork(), SWEEP_MS), setInterval(cleanUp, CLEANUP_MS)];
  for (const timer of timers) timer.unref();
  return {
    async stop() {
      for (const timer of timers) clearInterval(timer);
      await running;
    },
  };
}
