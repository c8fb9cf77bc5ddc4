// `npm run db:seed`: seeds the invented demo world (idempotent).
import { db, closeDb } from '../src/server/core/db.ts';
import { seedDemoWorld } from '../src/server/seed/seed-demo-world.ts';

try {
  const result = await seedDemoWorld(db());
  console.log(`Demo world ready (${result.fixesCreated} new fixes, ${result.reportsCreated} new bench reports).`);
} finally {
  await closeDb();
}
