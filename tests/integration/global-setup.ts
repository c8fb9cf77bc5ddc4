// Integration tests: the test database is migrated and seeded (by `npm test`), and a built server runs.
import { startServer } from '../support/server';
import { INTEGRATION_PORT } from '../support/test-env';

export default async function setup(): Promise<() => Promise<void>> {
  return startServer(INTEGRATION_PORT);
}
