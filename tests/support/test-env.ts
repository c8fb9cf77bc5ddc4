// The environment every test process uses: its own database and media folder, never the app's database.
// Several engineers may run tests side by side: each may choose a database, ports and a build folder.
export const TEST_DB = process.env.BENCHLORE_TEST_DB ?? 'benchlore_test';
export const INTEGRATION_PORT = Number(process.env.BENCHLORE_TEST_PORT ?? 4392);
export const E2E_PORT = INTEGRATION_PORT - 1;
/** The journeys (tests/journeys) run against a server of their own. */
export const JOURNEYS_PORT = INTEGRATION_PORT - 2;
export const DIST_DIR = process.env.BENCHLORE_DIST ?? 'dist';

/** Each test server sends its mail to a sink of its own, 1000 ports above it, with its own folder. */
export function sinkPortFor(serverPort: number): number {
  return serverPort + 1000;
}

export function mailDirFor(serverPort: number): string {
  return `${process.env.BENCHLORE_DATA_DIR ?? '.data'}/mail-${TEST_DB}-${serverPort}`;
}

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
    // The test servers stand behind no proxy, but tests speak as different clients through this header.
    TRUST_PROXY: '1',
  };
  // Tests never send real mail, whatever the shell says.
  delete env.SMTP_URL;
  // Tests wipe their database: they only ever use TEST_DATABASE_URL or the local cluster, never DATABASE_URL.
  delete env.DATABASE_URL;
  if (process.env.TEST_DATABASE_URL) env.DATABASE_URL = process.env.TEST_DATABASE_URL;
  return env;
}
