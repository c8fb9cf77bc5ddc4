// Four test projects: unit (pure code, fast), integration (real PostgreSQL), e2e (real Chromium), and journeys (a
// person's whole errand in Chromium, each step checked for errors and for sideways scrolling at 360 px).
import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';
import { testEnv } from './tests/support/test-env';

const alias = { '@': fileURLToPath(new URL('./src', import.meta.url)) };
// Integration and browser tests never touch the app's own database.
const env = Object.fromEntries(Object.entries(testEnv()).filter((e): e is [string, string] => e[1] !== undefined));

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts', 'tests/reference/**/*.test.ts'], environment: 'node' },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/integration/global-setup.ts'],
          env,
          // One worker: these files share one database and one server.
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/e2e/global-setup.ts'],
          env,
          // One worker: these files share one database and one server.
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'journeys',
          include: ['tests/journeys/**/*.test.ts'],
          globalSetup: ['tests/journeys/global-setup.ts'],
          env,
          // One worker: one browser at a time on a shared machine, one server.
          poolOptions: { forks: { singleFork: true } },
          testTimeout: 90_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
});
