// Journeys: a built server of their own, on a port of its own, driven by Debian's Chromium.
import { startServer } from '../support/server';
import { JOURNEYS_PORT } from '../support/test-env';

export default async function setup(): Promise<() => Promise<void>> {
  return startServer(JOURNEYS_PORT);
}
