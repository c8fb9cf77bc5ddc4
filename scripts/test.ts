// `npm test`: a throw-away test database on the local cluster, the demo world, a build, then every test.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join, relative } from 'node:path';
import { buildIfStale, ensureDatabase, migrateAndSeed } from './lib/prepare.ts';
import { ensureChromium } from './lib/chromium.ts';
import { testEnv } from '../tests/support/test-env.ts';

const env = testEnv();
const args = process.argv.slice(2);
// Only a run that names other projects and neither e2e nor journeys can do without the browser.
const runsBrowserTests = !args.some((a) => a.startsWith('--project')) || args.some((a) => /e2e|journeys/.test(a));
if (runsBrowserTests) ensureChromium(env);
rmSync(env.BENCHLORE_MEDIA_DIR ?? '', { recursive: true, force: true });
await ensureDatabase(env, { fresh: true });
migrateAndSeed(env);
// astro.config.mjs allows the public host on any port, so the same build serves `npm start` and the test
// servers on their own ports; each test server gets its full PUBLIC_ORIGIN at run time.
buildIfStale(env);

const report = join(env.BENCHLORE_DATA_DIR ?? '.data', `vitest-report-${env.BENCHLORE_DB_NAME}.json`);
const vitestArgs = [
  'node_modules/vitest/vitest.mjs',
  'run',
  '--reporter=default',
  '--reporter=json',
  `--outputFile.json=${report}`,
  ...args,
];
const res = spawnSync(process.execPath, vitestArgs, { stdio: 'inherit', env });

// One plain closing line, whatever reporter is in use. A file whose set-up failed has its tests counted as
// skipped by vitest, so failed files are named apart: "0 failed" must never hide them.
if (existsSync(report)) {
  const summary = JSON.parse(readFileSync(report, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numPendingTests: number;
    testResults: { name: string; status: string; message?: string }[];
  };
  const brokenFiles = summary.testResults.filter((f) => f.status === 'failed' && f.message);
  const files = brokenFiles.length ? `, ${brokenFiles.length} test files failed to run` : '';
  console.log(`\n${summary.numPassedTests} passed, ${summary.numFailedTests} failed, ${summary.numPendingTests} skipped${files}`);
  for (const f of brokenFiles) console.log(`  ${relative(process.cwd(), f.name)}: ${f.message?.split('\n')[0]}`);
}
process.exit(res.status ?? 1);
