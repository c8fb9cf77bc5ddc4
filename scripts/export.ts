// `npm run export [-- --out DIR]`: the proofed knowledge as JSON Lines with a manifest, under its licence.
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { config } from '../src/server/core/config.ts';
import { db, closeDb } from '../src/server/core/db.ts';
import { writeKnowledgeExport } from '../src/server/export/knowledge-export.ts';

const { values } = parseArgs({ options: { out: { type: 'string' } } });
const dir = values.out ?? join(config().BENCHLORE_DATA_DIR, 'export', new Date().toISOString().slice(0, 10));

try {
  const manifest = await writeKnowledgeExport(db(), dir, config().PUBLIC_ORIGIN);
  const c = manifest.counts;
  console.log(
    `Export written to ${dir}: ${c.fixes} fixes, ${c.machines} machines, ${c.chassisFamilies} chassis families, ${c.makers} makers, ${c.photos} photos (${manifest.licence.name}).`,
  );
} catch (error) {
  console.error(`The export failed: ${(error as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
