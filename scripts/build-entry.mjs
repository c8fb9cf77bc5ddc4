// After `astro build`: bundles the server entry and compresses the built files it serves.
//
// The entry (scripts/serve.ts and the background work it starts from src/server) becomes one plain module beside the
// built app, `dist/serve.mjs`, so the server runs under plain `node`. Run under tsx instead, every dynamic import()
// the built app makes per request (each page's module, the Actions) went through tsx's loader hooks on another
// thread: about a third of an anonymous page's time. Packages stay outside, read from node_modules.
//
// Each script, stylesheet, page, SVG and manifest in dist/client gets a Brotli (`.br`, highest quality) and a gzip
// (`.gz`, level 9) copy beside it, made once here so no request pays for it; src/server/http/static-files.ts serves
// the copy a reader accepts. A copy that would not be smaller is not written.
import { build } from 'esbuild';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { extname, join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

const COMPRESSIBLE = new Set(['.js', '.mjs', '.css', '.html', '.svg', '.json', '.webmanifest', '.txt', '.xml']);
const MIN_BYTES = 1024;

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

export function compressClientFiles(distDir = process.env.BENCHLORE_DIST ?? 'dist') {
  const walk = (dir) =>
    readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(join(dir, e.name)) : [join(dir, e.name)]));
  for (const path of walk(resolve(distDir, 'client'))) {
    if (!COMPRESSIBLE.has(extname(path))) continue;
    const body = readFileSync(path);
    if (body.byteLength < MIN_BYTES) continue;
    const br = brotliCompressSync(body, {
      params: { [constants.BROTLI_PARAM_QUALITY]: constants.BROTLI_MAX_QUALITY, [constants.BROTLI_PARAM_SIZE_HINT]: body.byteLength },
    });
    const gz = gzipSync(body, { level: 9 });
    if (br.byteLength < body.byteLength) writeFileSync(`${path}.br`, br);
    if (gz.byteLength < body.byteLength) writeFileSync(`${path}.gz`, gz);
  }
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  await buildEntry(process.argv[2]);
  compressClientFiles(process.argv[2]);
}
