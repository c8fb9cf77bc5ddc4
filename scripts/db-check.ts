// `npm run db:check [-- --collect] [-- --grace-minutes N]`: integrity of the database and the photo store.
// Exits 1 when anything is wrong; orphan photo files are deleted with --collect (older than the grace period).
import { parseArgs } from 'node:util';
import { db, closeDb } from '../src/server/core/db.ts';
import { storage } from '../src/server/storage/index.ts';
import { checkDatabase } from '../src/server/integrity/checks.ts';
import { checkPhotoFiles } from '../src/server/integrity/photo-files.ts';

const { values } = parseArgs({ options: { collect: { type: 'boolean' }, 'grace-minutes': { type: 'string', default: '60' } } });
const graceMinutes = Number(values['grace-minutes']);
if (!Number.isFinite(graceMinutes) || graceMinutes < 0) {
  console.error('--grace-minutes takes a number of minutes, e.g. --grace-minutes 60');
  process.exit(2);
}

try {
  const problems = await checkDatabase(db());
  for (const p of problems) console.log(`✗ ${p.ids.length} ${p.problem}: ${p.ids.slice(0, 20).join(', ')}`);
  const files = await checkPhotoFiles(db(), storage(), { collect: Boolean(values.collect), graceMs: graceMinutes * 60_000 });
  for (const m of files.missing) console.log(`✗ photo ${m.photoId} is missing its file ${m.key}`);
  if (files.collected.length) console.log(`Collected ${files.collected.length} orphan photo files.`);
  const waiting = files.orphans.length - files.collected.length;
  if (waiting)
    console.log(
      `${waiting} photo files no row names${values.collect ? ' are younger than the grace period' : ' (run with --collect to delete them)'}.`,
    );
  const bad = problems.length + files.missing.length;
  console.log(bad ? `db:check found ${bad} problems (listed above).` : 'db:check: the database and the photo store agree.');
  process.exitCode = bad ? 1 : 0;
} catch (error) {
  console.error(`db:check failed: ${(error as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
