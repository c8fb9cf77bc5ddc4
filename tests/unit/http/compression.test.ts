// Compressed answers: which encoding a reader gets, which answers are compressed on the way out, and that what
// arrives decompresses to exactly the bytes the page rendered.
import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { chooseEncoding, compressible, compressOnTheWay, varyOnEncoding } from '@/server/http/compression';

const CHROMIUM = 'gzip, deflate, br, zstd';

describe('chooseEncoding', () => {
  it('prefers Brotli when the reader takes both at the same weight, whatever order they list them in', () => {
    expect(chooseEncoding(CHROMIUM)).toBe('br');
    expect(chooseEncoding('br, gzip')).toBe('br');
    expect(chooseEncoding('*')).toBe('br');
  });

  it('honours weights and refusals, and falls back to what we have', () => {
    expect(chooseEncoding('gzip;q=1, br;q=0.5')).toBe('gzip');
    expect(chooseEncoding('br;q=0, gzip')).toBe('gzip');
    expect(chooseEncoding('gzip')).toBe('gzip');
    expect(chooseEncoding(CHROMIUM, ['gzip'])).toBe('gzip');
    expect(chooseEncoding('br', ['gzip'])).toBeNull();
  });

  it('sends the body as it is to a reader who asks for nothing or only identity', () => {
    expect(chooseEncoding(undefined)).toBeNull();
    expect(chooseEncoding('')).toBeNull();
    expect(chooseEncoding('identity')).toBeNull();
    expect(chooseEncoding('deflate')).toBeNull();
    expect(chooseEncoding(CHROMIUM, [])).toBeNull();
  });
});

describe('compressible', () => {
  it('takes text, JSON, XML, SVG and the manifest, and leaves images, fonts and event streams alone', () => {
    for (const type of [
      'text/html',
      'text/css; charset=utf-8',
      'application/json',
      'application/problem+json',
      'image/svg+xml',
      'application/xml',
      'application/manifest+json',
    ])
      expect(compressible(type), type).toBe(true);
    for (const type of ['image/jpeg', 'image/webp', 'font/woff2', 'application/octet-stream', 'text/event-stream', null, ''])
      expect(compressible(type), String(type)).toBe(false);
  });
});

describe('compressOnTheWay', () => {
  const page = 'A fix page. '.repeat(400);
  const html = (body: string | null = page, init: ResponseInit = {}) =>
    new Response(body, { status: 200, ...init, headers: { 'Content-Type': 'text/html; charset=utf-8', ...(init.headers ?? {}) } });
  const get = (headers: Record<string, string> = { 'accept-encoding': CHROMIUM }, method = 'GET') =>
    new Request('http://x.test/search?q=belt', { method, headers });

  it('gzips a page for a reader who accepts it, and the bytes come back exactly', async () => {
    const answer = compressOnTheWay(get(), html());
    expect(answer.headers.get('content-encoding')).toBe('gzip');
    expect(answer.headers.get('content-length')).toBeNull();
    expect(answer.headers.get('vary')).toBe('Accept-Encoding');
    const bytes = Buffer.from(await answer.arrayBuffer());
    expect(bytes.byteLength).toBeLessThan(page.length / 4);
    expect(gunzipSync(bytes).toString()).toBe(page);
  });

  it('sends the body as it is, but still varies on the encoding, for a reader who accepts none', async () => {
    const answer = compressOnTheWay(get({}), html());
    expect(answer.headers.get('content-encoding')).toBeNull();
    expect(answer.headers.get('vary')).toBe('Accept-Encoding');
    expect(await answer.text()).toBe(page);
  });

  it('leaves alone a HEAD, a small body, a redirect, partial content, images and answers already encoded', () => {
    const untouched: [Request, Response][] = [
      [get(undefined, 'HEAD'), html()],
      [get(), html('short', { headers: { 'Content-Length': '5' } })],
      [get(), new Response(null, { status: 303, headers: { Location: '/' } })],
      [get(), html(page, { status: 206 })],
      [get(), new Response(page, { headers: { 'Content-Type': 'image/jpeg' } })],
      [get(), html(page, { headers: { 'Content-Encoding': 'br' } })],
      [get(), html(page, { headers: { 'Cache-Control': 'no-transform' } })],
    ];
    for (const [request, response] of untouched) expect(compressOnTheWay(request, response)).toBe(response);
  });

  it('compresses an error page too, keeps a weak ETag, and leaves whole an answer with a strong one (If-Match needs it)', () => {
    expect(compressOnTheWay(get(), html(page, { status: 404 })).headers.get('content-encoding')).toBe('gzip');
    expect(compressOnTheWay(get(), html(page, { headers: { ETag: 'W/"abc"' } })).headers.get('etag')).toBe('W/"abc"');
    const versioned = html(page, { headers: { ETag: '"v3"' } });
    expect(compressOnTheWay(get(), versioned)).toBe(versioned);
    expect(versioned.headers.get('etag')).toBe('"v3"');
  });
});

describe('varyOnEncoding', () => {
  it('adds Accept-Encoding once beside what the answer already varies on', () => {
    const headers = new Headers({ Vary: 'Cookie' });
    varyOnEncoding(headers);
    varyOnEncoding(headers);
    expect(headers.get('vary')).toBe('Cookie, Accept-Encoding');
  });
});
