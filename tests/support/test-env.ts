// The environment every test process uses: its own database and media folder, never the app's database.
// Several engineers may run tests side by side: each may choose a database, ports and a build folder.
export const TEST_DB = process.env.BENCHLORE_TEST_DB ?? 'benchlore_test';
export const INTEGRATION_PORT = Number(process.env.BENCHLORE_TEST_PORT ?? 4392);
export const E2E_PORT = INTEGRATION_PORT - 1;
export const DIST_DIR = process.env.BENCHLORE_DIST ?? 'dist';

export function testEnv(): NodeJS.ProcessEnv {
  const dataDir = process.env.BENCHLORE_DATA_DIR ?? '.data';
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'test',
    BENCHLORE_DATA_DIR: dataDir,
    BENCHLORE_DB_NAME: TEST_DB,
    BENCHLORE_MEDIA_DIR: `${dataDir}/media-${TEST_DB}`,
    AUTH_SECRET: 'test-secret-not-for-production-0123456789',
    LOG_LEVEL: 'warn',
  };
  // Tests wipe their database: they only ever use TEST_DATABASE_URL or the local cluster, never DATABASE_URL.
  delete env.DATABASE_URL;
  if (process.env.TEST_DATABASE_URL) env.DATABASE_URL = process.env.TEST_DATABASE_URL;
  return env;
}
