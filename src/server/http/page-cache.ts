// Validators and kept renders for public pages read by anonymous readers: the ETag comes from what the page
// depends on (its key, see src/server/render/page-keys.ts), never from hashing a body; If-None-Match is answered
// with 304 before anything renders; a 200 is kept in memory per address until its key changes, bounded by count
// and bytes. Signed-in readers never reach this: their answers stay `private` and are rendered for them.
import { readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import etag from 'etag';
import fresh from 'fresh';
import { chooseEncoding, compressOnce, MIN_COMPRESS_BYTES, varyOnEncoding, type Encoding } from './compression';
import { cachePolicies } from './responses';

export type CachePolicy = Exclude<keyof typeof cachePolicies, 'private' | 'counted'>;

/** The weak ETag of one address at one key: the build, the address and the key, hashed by the `etag` package. */
export function pageEtag(build: string, address: string, key: string): string {
  return etag(`${build}\n${address}\n${key}`, { weak: true });
}

/**
 * Whether the reader's copy is current: If-None-Match against our ETag (RFC 9110 §13.1.2, weak comparison, via
 * `fresh`). The request's Cache-Control is left out on purpose: `no-cache` asks caches on the way to revalidate
 * with the origin, and this is the origin (fetch() itself adds `no-cache` whenever it sends If-None-Match).
 */
export function readerHasCurrent(requestHeaders: Headers, tag: string): boolean {
  const ifNoneMatch = requestHeaders.get('if-none-match');
  if (!ifNoneMatch) return false;
  return fresh({ 'if-none-match': ifNoneMatch }, { etag: tag });
}

interface Kept {
  key: string;
  tag: string;
  status: number;
  headers: [string, string][];
  body: Uint8Array<ArrayBuffer>;
  /** The body compressed once when kept, with its own headers, for readers who accept it (none for a tiny body). */
  encoded: Partial<Record<Encoding, { body: Uint8Array<ArrayBuffer>; headers: [string, string][] }>>;
}

const sizeOf = (kept: Kept): number =>
  kept.body.byteLength + Object.values(kept.encoded).reduce((sum, variant) => sum + variant.body.byteLength, 0);

/**
 * Rendered pages by address, each with the key it was rendered at; only the newest key per address is kept, and the
 * least recently used addresses go first when the count or byte limit would be passed.
 */
export class RenderCache {
  private readonly entries = new Map<string, Kept>();
  private bytes = 0;

  constructor(readonly limits: { entries: number; bytes: number }) {}

  get(address: string, key: string): Kept | undefined {
    const kept = this.entries.get(address);
    if (!kept || kept.key !== key) return undefined;
    // Most recently used last, so eviction takes from the front.
    this.entries.delete(address);
    this.entries.set(address, kept);
    return kept;
  }

  set(address: string, kept: Kept): void {
    this.delete(address);
    if (sizeOf(kept) > this.limits.bytes) return;
    this.entries.set(address, kept);
    this.bytes += sizeOf(kept);
    for (const [oldest] of this.entries) {
      if (this.entries.size <= this.limits.entries && this.bytes <= this.limits.bytes) break;
      this.delete(oldest);
    }
  }

  delete(address: string): void {
    const kept = this.entries.get(address);
    if (!kept) return;
    this.bytes -= sizeOf(kept);
    this.entries.delete(address);
  }

  get size(): { entries: number; bytes: number } {
    return { entries: this.entries.size, bytes: this.bytes };
  }
}

/**
 * What identifies this build, the same on every instance running it: the names and sizes of the server's bundled
 * modules (Vite puts a content hash in each chunk's name). A new deployment changes every ETag.
 */
function computeBuildId(): string {
  try {
    const here = dirname(fileURLToPath(import.meta.url));
    const serverDir = here.includes(`${join('dist', 'server')}`) ? here.slice(0, here.lastIndexOf('server') + 'server'.length) : here;
    const names: string[] = [];
    const walk = (dir: string, depth: number): void => {
      for (const name of readdirSync(dir).sort()) {
        const path = join(dir, name);
        const stat = statSync(path);
        if (stat.isDirectory() && depth < 4) walk(path, depth + 1);
        else if (name.endsWith('.mjs')) names.push(`${path.slice(serverDir.length)}:${stat.size}`);
      }
    };
    walk(serverDir, 0);
    return etag(names.join('\n'));
  } catch {
    // Not running from a build (tests of this module, `astro dev`): this process is its own build.
    return `process-${process.pid}-${Date.now()}`;
  }
}

let buildId: string | null = null;
export function currentBuild(): string {
  buildId ??= computeBuildId();
  return buildId;
}

const HOP_BY_HOP = new Set(['set-cookie', 'date', 'transfer-encoding', 'connection', 'keep-alive']);

export const publicPageCache = new RenderCache({ entries: 2000, bytes: 64 * 1024 * 1024 });
/** Kept search pages, apart from the rest (see KeptShelf in src/server/render/page-keys.ts). */
export const searchPageCache = new RenderCache({ entries: 500, bytes: 16 * 1024 * 1024 });

/**
 * Answers an anonymous GET of a public page: 304 when the reader's ETag is current, the kept render when its key
 * still holds, otherwise renders (`render`), keeps a public 200 and adds the ETag. `mayKeep` is asked after rendering
 * (for instance: no cookie was set on the way).
 */
export async function answerPublicPage(input: {
  request: Request;
  address: string;
  key: string;
  policy: CachePolicy;
  render: () => Promise<Response>;
  mayKeep: () => boolean;
  cache?: RenderCache;
}): Promise<Response> {
  const cache = input.cache ?? publicPageCache;
  const tag = pageEtag(currentBuild(), input.address, input.key);
  if (readerHasCurrent(input.request.headers, tag)) {
    return new Response(null, { status: 304, headers: { ETag: tag, 'Cache-Control': cachePolicies[input.policy] } });
  }
  const kept = cache.get(input.address, input.key);
  if (kept) return keptAnswer(kept, input.request);

  const response = await input.render();
  // A page that names no policy (the MDX help pages) takes its route's.
  const cacheControl = response.headers.get('cache-control') ?? cachePolicies[input.policy];
  if (response.status !== 200 || !cacheControl.startsWith('public') || response.headers.has('set-cookie') || !response.body) {
    return response;
  }
  const body = new Uint8Array(await response.arrayBuffer());
  const headers = new Headers(response.headers);
  headers.set('Cache-Control', cacheControl);
  headers.set('ETag', tag);
  varyOnEncoding(headers);
  // A known length goes out in one write, without chunked encoding.
  const withLength = (length: number, encoding?: Encoding): [string, string][] => [
    ...[...headers].filter(([name]) => !HOP_BY_HOP.has(name.toLowerCase()) && name.toLowerCase() !== 'content-length'),
    ['content-length', String(length)],
    ...(encoding ? [['content-encoding', encoding] as [string, string]] : []),
  ];
  const encoded: Kept['encoded'] = {};
  if (body.byteLength >= MIN_COMPRESS_BYTES && !headers.has('content-encoding')) {
    for (const encoding of ['br', 'gzip'] as const) {
      const compressed = compressOnce(body, encoding);
      encoded[encoding] = { body: compressed, headers: withLength(compressed.byteLength, encoding) };
    }
  }
  const entry: Kept = { key: input.key, tag, status: 200, headers: withLength(body.byteLength), body, encoded };
  if (input.mayKeep()) cache.set(input.address, entry);
  return keptAnswer(entry, input.request);
}

/** A kept render as this reader asked for it: compressed when they accept an encoding we hold, with its length known. */
function keptAnswer(kept: Kept, request: Request): Response {
  const encoding = chooseEncoding(request.headers.get('accept-encoding'), Object.keys(kept.encoded) as Encoding[]);
  const answer = encoding ? kept.encoded[encoding]! : kept;
  return new Response(answer.body, { status: kept.status, headers: answer.headers });
}
