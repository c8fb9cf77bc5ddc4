// Bundles the server entry (scripts/serve.ts and the background work it starts from src/server) into one plain
// module beside the built app, `dist/serve.mjs`, so the server runs under plain `node`. Run under tsx instead, every
// dynamic import() the built app makes per request (each page's module, the Actions) went through tsx's loader
// hooks on another thread: about a third of an anonymous page's time. Packages stay outside, read from node_modules.
import { build } from 'esbuild';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';

export async function buildEntry(distDir = process.env.BENCHLORE_DIST ?? 'dist') {
  await build({
    entryPoints: ['scripts/serve.ts'],
    outfile: resolve(distDir, 'serve.mjs'),
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    tsconfig: 'tsconfig.json',
    logLevel: 'warning',
  });
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) await buildEntry(process.argv[2]);
