// What a page costs in JavaScript, read from the built assets: the scripts its HTML names (module scripts, island
// components and renderers, inline scripts) and every module they import, statically (needed for the first paint)
// or dynamically (loaded afterwards), gzipped as a server or CDN would send them.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { DIST_DIR } from './test-env';

const assetDir = join(DIST_DIR, 'client');

export interface ScriptCost {
  /** Gzipped bytes of inline scripts plus every file loaded before the page is usable (static imports). */
  firstPaint: number;
  /** Gzipped bytes of files only loaded later, through dynamic import(). */
  later: number;
  /** The files counted in firstPaint, e.g. "/_astro/client.CYwmpaq4.js". */
  files: string[];
  lateFiles: string[];
  /** The text of every counted file and inline script, for checks of what they contain. */
  text: string;
  /** The text of the inline scripts and the first-paint files only. */
  firstText: string;
}

const gzipCache = new Map<string, { gz: number; text: string }>();

function asset(path: string): { gz: number; text: string } {
  let entry = gzipCache.get(path);
  if (!entry) {
    const text = readFileSync(join(assetDir, path), 'utf8');
    entry = { gz: gzipSync(text, { level: 9 }).length, text };
    gzipCache.set(path, entry);
  }
  return entry;
}

/** The imports of one built module, resolved to site paths: static ones and dynamic ones. */
export function importsOf(path: string): { staticImports: string[]; dynamicImports: string[] } {
  const { text } = asset(path);
  const resolve = (spec: string) => new URL(spec, `http://site${path}`).pathname;
  const dynamicImports = [...text.matchAll(/import\(\s*["'`]([^"'`]+\.js)["'`]\s*\)/g)].map((m) => resolve(m[1]!));
  // Vite lists a dynamic import's own dependencies in a preload map ("__vite__mapDeps"): loaded later too.
  const mapped = [
    ...text.matchAll(/__vite__mapDeps\.viteFileDeps\s*=\s*\[([^\]]*)\]|const __vite__mapDeps=.*?m\.f\|\|\(m\.f=\[([^\]]*)\]/g),
  ]
    .flatMap((m) => (m[1] ?? m[2] ?? '').split(','))
    .map((s) => s.trim().replace(/^["'`]|["'`]$/g, ''))
    .filter((s) => s.endsWith('.js'))
    .map((s) => (s.startsWith('/') ? s : resolve(`/${s}`)));
  const staticImports = [...text.matchAll(/(?:^|[;}\s])(?:import|export)\s*(?:[\w$*{},\s]*?\s*from\s*)?["'`]([^"'`]+\.js)["'`]/g)].map(
    (m) => resolve(m[1]!),
  );
  return { staticImports: [...new Set(staticImports)], dynamicImports: [...new Set([...dynamicImports, ...mapped])] };
}

function closure(entries: string[], follow: (path: string) => string[]): Set<string> {
  const seen = new Set<string>();
  const queue = [...entries];
  while (queue.length > 0) {
    const next = queue.pop()!;
    if (seen.has(next)) continue;
    seen.add(next);
    queue.push(...follow(next));
  }
  return seen;
}

/** The scripts a page's HTML asks for: module script sources, island components and renderers, inline scripts. */
export function scriptsOfPage(html: string): { entries: string[]; inline: string[] } {
  const entries = new Set<string>();
  for (const m of html.matchAll(/<script\b[^>]*\bsrc="([^"]+)"[^>]*>/g)) entries.add(m[1]!);
  for (const m of html.matchAll(/\b(?:component-url|renderer-url|before-hydration-url)="([^"]+)"/g)) if (m[1]) entries.add(m[1]);
  const inline = [...html.matchAll(/<script\b(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)]
    .map((m) => m[1]!)
    .filter((body) => body.trim() !== '');
  return { entries: [...entries].filter((src) => src.startsWith('/_astro/')), inline };
}

/** The cost of a page from its HTML as the server sent it. */
export function scriptCost(html: string): ScriptCost {
  const { entries, inline } = scriptsOfPage(html);
  const first = closure(entries, (path) => importsOf(path).staticImports);
  const lateEntries = [...first].flatMap((path) => importsOf(path).dynamicImports);
  const late = closure(lateEntries, (path) => [...importsOf(path).staticImports, ...importsOf(path).dynamicImports]);
  for (const path of first) late.delete(path);
  const inlineBytes = inline.reduce((sum, body) => sum + gzipSync(body, { level: 9 }).length, 0);
  const sum = (paths: Iterable<string>) => [...paths].reduce((total, path) => total + asset(path).gz, 0);
  return {
    firstPaint: inlineBytes + sum(first),
    later: sum(late),
    files: [...first].sort(),
    lateFiles: [...late].sort(),
    text: [...inline, ...[...first, ...late].map((path) => asset(path).text)].join('\n'),
    firstText: [...inline, ...[...first].map((path) => asset(path).text)].join('\n'),
  };
}

/**
 * Whether zod's full ("classic") build is in the text: its schemas carry chainable methods (`superRefine(e,t){…}`
 * in an object literal), whose names survive minification; zod/mini has plain functions instead, renamed by the
 * minifier.
 */
export function hasFullZod(text: string): boolean {
  return /[{,;]\s*superRefine\s*\(/.test(text);
}

export const kb = (bytes: number): string => `${(bytes / 1024).toFixed(1)} KB`;
