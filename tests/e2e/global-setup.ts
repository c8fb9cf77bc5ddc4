// Browser tests: a built server of their own, driven by Debian's Chromium through playwright-core.
import { startServer } from '../support/server';
import { E2E_PORT } from '../support/test-env';

export default async function setup(): Promise<() => Promise<void>> {
  return startServer(E2E_PORT);
}
