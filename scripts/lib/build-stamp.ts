// Decides whether the built server is older than its sources, so a second `npm start` skips the build.
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const SOURCES = ['src', 'public', 'astro.config.mjs', 'tailwind.config.cjs', 'package-lock.json', 'tsconfig.json', 'auth.config.ts'];
const STAMP = join('dist', '.source-hash');

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
  return existsSync(join('dist', 'server', 'entry.mjs')) && existsSync(STAMP) && readFileSync(STAMP, 'utf8') === sourceHash();
}

export function markBuilt(): void {
  writeFileSync(STAMP, sourceHash());
}
