// `npm run search:reindex`: rebuilds every fix's search row and the vocabularies, then Meilisearch when MEILI_URL is set.
import { config } from '../src/server/core/config.ts';
import { db, closeDb } from '../src/server/core/db.ts';
import { MeiliIndex } from '../src/server/search/meili/index-client.ts';
import { reindexMeili, reindexPostgres } from '../src/server/search/reindex.ts';

const postgresOnly = process.argv.includes('--postgres-only');
const started = Date.now();
try {
  const report = await reindexPostgres(db(), (done, total) => console.log(`  ${done} of ${total} fixes…`));
  console.log(`PostgreSQL: ${report.fixes} live fixes indexed${report.removed ? `, ${report.removed} stale rows removed` : ''}.`);
  const { MEILI_URL, MEILI_KEY } = config();
  if (MEILI_URL && !postgresOnly) {
    const sent = await reindexMeili(db(), new MeiliIndex({ url: MEILI_URL, key: MEILI_KEY }));
    console.log(`Meilisearch at ${new URL(MEILI_URL).host}: ${sent} documents indexed and swapped in.`);
  } else if (!MEILI_URL) {
    console.log('MEILI_URL is not set: searches use PostgreSQL, nothing more to do.');
  }
  console.log(`Done in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
} catch (error) {
  console.error(`Reindex failed: ${(error as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
