// The framework's floor for `npm run bench`: the project's own Astro and Node adapter, nothing else, serving one
// endpoint that returns fixed bytes. Built by the benchmark into the data folder; never part of the app.
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  outDir: process.env.BENCH_FLOOR_OUT,
  cacheDir: process.env.BENCH_FLOOR_CACHE,
  telemetry: false,
  security: { checkOrigin: false },
});
