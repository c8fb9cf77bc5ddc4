// Decides whether the built server is older than its sources, so a second `npm start` skips the build.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const SOURCES = [
  'src',
  'public',
  'astro.config.mjs',
  'tailwind.config.cjs',
  'package-lock.json',
  'tsconfig.json',
  'auth.config.ts',
  'knexfile.js',
  // The server entry is bundled into the build too (dist/serve.mjs).
  'scripts/serve.ts',
  'scripts/build-entry.mjs',
];
const DIST = process.env.BENCHLORE_DIST ?? 'dist';
const STAMP = join(DIST, '.source-hash');

function walk(path: string, hash: ReturnType<typeof createHash>): void {
  if (!existsSync(path)) return;
  const stat = statSync(path);
  if (stat.isDirectory()) {
    for (const entry of readdirSync(path).sort()) walk(join(path, entry), hash);
  } else {
    hash.update(path).update(readFileSync(path));
  }
}

export function sourceHash(): string {
  const hash = createHash('sha256');
  for (const source of SOURCES) walk(source, hash);
  return hash.digest('hex');
}

export function buildIsCurrent(): boolean {
  return (
    existsSync(join(DIST, 'server', 'entry.mjs')) &&
    existsSync(join(DIST, 'serve.mjs')) &&
    existsSync(STAMP) &&
    readFileSync(STAMP, 'utf8') === sourceHash()
  );
}

export const distDir = DIST;

export function markBuilt(): void {
  writeFileSync(STAMP, sourceHash());
}
