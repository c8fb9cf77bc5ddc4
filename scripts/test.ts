// `npm test`: a throw-away test database on the local cluster, the demo world, a build, then every test.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { buildIfStale, ensureDatabase, migrateAndSeed } from './lib/prepare.ts';
import { testEnv } from '../tests/support/test-env.ts';

const env = testEnv();
rmSync(env.BENCHLORE_MEDIA_DIR ?? '', { recursive: true, force: true });
await ensureDatabase(env, { fresh: true });
migrateAndSeed(env);
// astro.config.mjs allows the public host on any port, so the same build serves `npm start` and the test
// servers on their own ports; each test server gets its full PUBLIC_ORIGIN at run time.
buildIfStale(env);

const report = join(env.BENCHLORE_DATA_DIR ?? '.data', `vitest-report-${env.BENCHLORE_DB_NAME}.json`);
const args = [
  'node_modules/vitest/vitest.mjs',
  'run',
  '--reporter=default',
  '--reporter=json',
  `--outputFile.json=${report}`,
  ...process.argv.slice(2),
];
const res = spawnSync(process.execPath, args, { stdio: 'inherit', env });

// One plain closing line, whatever reporter is in use.
if (existsSync(report)) {
  const summary = JSON.parse(readFileSync(report, 'utf8')) as { numPassedTests: number; numFailedTests: number; numPendingTests: number };
  console.log(`\n${summary.numPassedTests} passed, ${summary.numFailedTests} failed, ${summary.numPendingTests} skipped`);
}
process.exit(res.status ?? 1);
