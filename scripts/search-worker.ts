// `npm run search:worker`: works the Meilisearch sync queue in a process of its own (the app server also does, once asked to search).
import { config } from '../src/server/core/config.ts';
import { db, closeDb } from '../src/server/core/db.ts';
import { MeiliIndex } from '../src/server/search/meili/index-client.ts';
import { startSearchSyncWorker } from '../src/server/search/sync-worker.ts';

const { MEILI_URL, MEILI_KEY } = config();
if (!MEILI_URL) {
  console.error('MEILI_URL is not set: there is nothing to keep in sync (PostgreSQL search needs no worker).');
  process.exit(2);
}
const worker = await startSearchSyncWorker(db(), new MeiliIndex({ url: MEILI_URL, key: MEILI_KEY }));
console.log(`Keeping Meilisearch at ${new URL(MEILI_URL).host} in sync (Ctrl+C stops).`);
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    void worker
      .stop()
      .then(closeDb)
      .then(() => process.exit(0));
  });
}
