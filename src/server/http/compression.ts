// Compressed answers for readers who accept them: a technician on a poor workshop connection gets a fix page and its
// stylesheet in a quarter of the bytes. Three cases, each paid for once where it can be:
//  - built files (scripts, stylesheets): compressed at build time (scripts/build-entry.mjs), served by static-files.ts;
//  - kept public pages: compressed once per kept render (page-cache.ts), not per request;
//  - everything else that is text: gzip on the way out, per request, only for a reader who asked for it.
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import Negotiator from 'negotiator';

export type Encoding = 'br' | 'gzip';

/** Brotli first: smaller than gzip for the same text at the levels used here. */
const PREFERRED: Encoding[] = ['br', 'gzip'];

/** Bodies smaller than this go out as they are: a frame of headers costs more than compressing saves. */
export const MIN_COMPRESS_BYTES = 1024;

/**
 * The encoding to answer with, from the request's Accept-Encoding (q-values honoured, `identity;q=0` respected by
 * falling back to whatever the reader allows) among those we have, or null for the body as it is.
 */
export function chooseEncoding(acceptEncoding: string | null | undefined, available: readonly Encoding[] = PREFERRED): Encoding | null {
  if (!acceptEncoding || available.length === 0) return null;
  const ordered = PREFERRED.filter((e) => available.includes(e));
  // negotiator 1.0 breaks ties between equally weighted encodings by our order (`preferred`); its types predate that.
  const negotiator = new Negotiator({ headers: { 'accept-encoding': acceptEncoding } });
  const encoding = negotiator.encoding.bind(negotiator) as (available: string[], options: { preferred: string[] }) => string | undefined;
  const best = encoding([...ordered, 'identity'], { preferred: [...ordered, 'identity'] });
  return best === 'br' || best === 'gzip' ? best : null;
}

/** Content types worth compressing: text, JSON, XML, SVG, the web manifest. Images and fonts are compressed already. */
export function compressible(contentType: string | null | undefined): boolean {
  if (!contentType) return false;
  const type = contentType.split(';')[0]!.trim().toLowerCase();
  if (type === 'text/event-stream') return false;
  return (
    type.startsWith('text/') ||
    type === 'application/json' ||
    type.endsWith('+json') ||
    type === 'application/xml' ||
    type.endsWith('+xml') ||
    type === 'application/javascript' ||
    type === 'application/manifest+json'
  );
}

/**
 * One body compressed at once, for a body kept and sent many times. Brotli quality 6 and gzip level 6: a kept fix
 * page (about 24 KB) compresses in about a millisecond, once per revision; build files use the highest levels.
 */
export function compressOnce(body: Uint8Array, encoding: Encoding): Uint8Array<ArrayBuffer> {
  const out =
    encoding === 'br'
      ? brotliCompressSync(body, {
          params: {
            [constants.BROTLI_PARAM_QUALITY]: 6,
            [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT,
            [constants.BROTLI_PARAM_SIZE_HINT]: body.byteLength,
          },
        })
      : gzipSync(body, { level: 6 });
  return new Uint8Array(out.buffer.slice(out.byteOffset, out.byteOffset + out.byteLength)) as Uint8Array<ArrayBuffer>;
}

/** Adds Accept-Encoding to the answer's Vary (once), so a shared cache keeps one copy per encoding. */
export function varyOnEncoding(headers: Headers): void {
  const vary = headers.get('vary');
  if (vary && /(^|,)\s*(accept-encoding|\*)\s*(,|$)/i.test(vary)) return;
  headers.set('Vary', vary ? `${vary}, Accept-Encoding` : 'Accept-Encoding');
}

/**
 * A response compressed on the way out with gzip (the platform's CompressionStream; Node 20 has no Brotli stream in
 * it), when the reader accepts gzip and the answer is text worth compressing. Anything already encoded, empty, partial
 * or not a 200-class answer with a body goes out untouched.
 */
export function compressOnTheWay(request: Request, response: Response): Response {
  if (request.method === 'HEAD' || !response.body) return response;
  // Partial content must keep its byte ranges; redirects and 304s carry no body worth the work.
  const { status } = response;
  if (status < 200 || status === 204 || status === 206 || (status >= 300 && status < 400)) return response;
  const headers = response.headers;
  if (headers.has('content-encoding') || !compressible(headers.get('content-type'))) return response;
  if (/no-transform/i.test(headers.get('cache-control') ?? '')) return response;
  const length = headers.get('content-length');
  if (length !== null && Number(length) < MIN_COMPRESS_BYTES) return response;
  varyOnEncoding(headers);
  if (chooseEncoding(request.headers.get('accept-encoding'), ['gzip']) !== 'gzip') return response;
  // A strong validator names exact bytes, and If-Match compares it strongly (RFC 9110 §13.1.1): an answer that
  // carries one (a job sheet's version) goes out as it is rather than lose it.
  const tag = headers.get('etag');
  if (tag && !tag.startsWith('W/')) return response;
  const compressed = new Headers(headers);
  compressed.set('Content-Encoding', 'gzip');
  compressed.delete('Content-Length');
  return new Response(response.body.pipeThrough(new CompressionStream('gzip')), {
    status: response.status,
    statusText: response.statusText,
    headers: compressed,
  });
}
