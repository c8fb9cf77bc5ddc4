// `npm run photos:cleanup`: removes photos never attached to a submitted revision, older than a day (the server also runs it hourly).
import { db, closeDb } from '../src/server/core/db.ts';
import { cleanupAbandonedPhotos } from '../src/server/photos/cleanup.ts';

try {
  const { removed } = await cleanupAbandonedPhotos(db());
  console.log(removed.length ? `Removed ${removed.length} abandoned photo(s): ${removed.join(', ')}.` : 'No abandoned photos.');
} finally {
  await closeDb();
}
