// The built files (dist/client: scripts, stylesheets, fonts, icons, the service worker, the two prerendered pages),
// read into memory when the server starts and answered from there, with the copies compressed at build time.
// The adapter's own server looked each request up on disk first (a stat for every page, about a sixth of an anonymous
// page's time) and sent scripts and stylesheets uncompressed; this is the server entry's first stop instead.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { extname, join, relative, sep } from 'node:path';
import etag from 'etag';
import fresh from 'fresh';
import mime from 'mime-types';
import { chooseEncoding, compressible, type Encoding } from './compression';
import { applySecurityHeaders } from './security-headers';

interface StaticFile {
  body: Buffer;
  encoded: Partial<Record<Encoding, Buffer>>;
  /** Headers every answer for this file carries (type, validators, caching, security). */
  headers: Record<string, string>;
}

/** Where Vite puts hashed build output: a new build gives a new name, so browsers may keep these for a year. */
const HASHED_DIR = '_astro';
const IMMUTABLE = 'public, max-age=31536000, immutable';
/** Unhashed files (the service worker, icons, the manifest): kept, but checked with the server each time. */
const REVALIDATE = 'public, max-age=0';

/** The suffixes scripts/build-entry.mjs writes beside each compressible file. */
export const ENCODED_SUFFIX: Record<Encoding, string> = { br: '.br', gzip: '.gz' };

function walk(dir: string): string[] {
  const files: string[] = [];
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = join(dir, entry.name);
    if (entry.isDirectory()) files.push(...walk(path));
    else if (entry.isFile()) files.push(path);
  }
  return files;
}

/** Extra headers the adapter wrote for prerendered pages (their Content-Security-Policy), by path. */
export type PrerenderedHeaders = { pathname: string; headers: { key: string; value: string }[] }[];

/**
 * Reads every built file under `clientDir` into memory, by the address that serves it: `/kept/index.html` answers
 * `/kept`, `/kept/` and `/kept/index.html`. Compressed copies (`.br`, `.gz`) are attached to their file, never served
 * by their own names.
 */
export function loadStaticFiles(clientDir: string, prerendered: PrerenderedHeaders = []): Map<string, StaticFile> {
  const files = new Map<string, StaticFile>();
  const paths = walk(clientDir);
  const all = new Set(paths);
  const encodedNames = new Set(
    paths.filter((p) => Object.values(ENCODED_SUFFIX).some((suffix) => p.endsWith(suffix) && all.has(p.slice(0, -suffix.length)))),
  );
  for (const path of paths) {
    if (encodedNames.has(path)) continue;
    const address = `/${relative(clientDir, path).split(sep).join('/')}`;
    const body = readFileSync(path);
    const stat = statSync(path);
    const type = mime.contentType(extname(path)) || 'application/octet-stream';
    const headers = new Headers({
      'Content-Type': type,
      ETag: etag(stat),
      'Last-Modified': stat.mtime.toUTCString(),
      'Cache-Control': address.startsWith(`/${HASHED_DIR}/`) ? IMMUTABLE : REVALIDATE,
      'Accept-Ranges': 'none',
    });
    const page = address.endsWith('/index.html') ? address.slice(0, -'/index.html'.length) || '/' : null;
    for (const header of prerendered.find((p) => p.pathname === page)?.headers ?? []) headers.set(header.key, header.value);
    applySecurityHeaders(headers);
    const encoded: StaticFile['encoded'] = {};
    if (compressible(type)) {
      headers.set('Vary', 'Accept-Encoding');
      for (const [encoding, suffix] of Object.entries(ENCODED_SUFFIX) as [Encoding, string][]) {
        if (encodedNames.has(path + suffix)) encoded[encoding] = readFileSync(path + suffix);
      }
    }
    const file: StaticFile = { body, encoded, headers: Object.fromEntries(headers) };
    files.set(address, file);
    if (page) {
      files.set(page, file);
      if (page !== '/') files.set(`${page}/`, file);
    }
  }
  return files;
}

/**
 * Answers a GET or HEAD for a built file (405 for any other method) and returns true, or returns false for the
 * app to answer. 304 when the
 * reader's copy is current (If-None-Match or If-Modified-Since, via `fresh`); compressed when the reader accepts it.
 */
export function serveStaticFile(files: Map<string, StaticFile>, req: IncomingMessage, res: ServerResponse): boolean {
  const url = req.url ?? '/';
  const end = url.search(/[?#]/);
  const file = files.get(end === -1 ? url : url.slice(0, end));
  if (!file) return false;
  if (req.method !== 'GET' && req.method !== 'HEAD') {
    // A built file is only ever read: a form posted at one is refused plainly, as the app refuses closed methods.
    res.writeHead(405, { ...file.headers, Allow: 'GET, HEAD', 'Content-Type': 'text/plain; charset=utf-8' });
    res.end(`This address only serves a file; ${req.method} is not allowed here. Open it with GET, e.g. in the browser.`);
    return true;
  }
  // The request's Cache-Control is left out, as for pages (page-cache.ts): `no-cache` is for caches on the way.
  const conditions = { 'if-none-match': req.headers['if-none-match'], 'if-modified-since': req.headers['if-modified-since'] };
  if (fresh(conditions, { etag: file.headers.etag, 'last-modified': file.headers['last-modified'] })) {
    res.writeHead(304, file.headers);
    res.end();
    return true;
  }
  const encoding = chooseEncoding(req.headers['accept-encoding'], Object.keys(file.encoded) as Encoding[]);
  const body = encoding ? file.encoded[encoding]! : file.body;
  res.writeHead(200, {
    ...file.headers,
    'Content-Length': String(body.byteLength),
    ...(encoding ? { 'Content-Encoding': encoding } : {}),
  });
  res.end(req.method === 'HEAD' ? undefined : body);
  return true;
}
