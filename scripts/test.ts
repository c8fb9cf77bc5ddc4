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
// The integration and browser servers run on ports of their own: build with a PUBLIC_ORIGIN that names no
// port, so Astro's allowedDomains (read at build time) accepts 127.0.0.1 on any port and form posts pass
// its origin check. Each test server then gets its full PUBLIC_ORIGIN at run time.
buildIfStale({ ...env, PUBLIC_ORIGIN: 'http://127.0.0.1' });

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
