// The public pages' validators and kept renders: ETags from keys, If-None-Match, the bounded cache, and what is
// never kept (errors, cookies, a page that said so).
import { describe, expect, it, vi } from 'vitest';
import { RenderCache, answerPublicPage, pageEtag, readerHasCurrent } from '@/server/http/page-cache';

const kept = (key: string, size: number) => ({
  key,
  tag: `W/"${key}"`,
  status: 200,
  headers: [] as [string, string][],
  encoded: {},
  body: new Uint8Array(size),
});

describe('pageEtag', () => {
  it('is a weak ETag that changes with the build, the address and the key, and only with them', () => {
    const tag = pageEtag('b1', '/fixes/a', 'fix.1.r2.open,bench.3');
    expect(tag).toMatch(/^W\/"[^"]+"$/);
    expect(pageEtag('b1', '/fixes/a', 'fix.1.r2.open,bench.3')).toBe(tag);
    expect(pageEtag('b2', '/fixes/a', 'fix.1.r2.open,bench.3')).not.toBe(tag);
    expect(pageEtag('b1', '/fixes/b', 'fix.1.r2.open,bench.3')).not.toBe(tag);
    expect(pageEtag('b1', '/fixes/a', 'fix.1.r3.open,bench.3')).not.toBe(tag);
  });
});

describe('readerHasCurrent', () => {
  const tag = 'W/"12-abc"';
  const headers = (value?: string) => new Headers(value === undefined ? {} : { 'If-None-Match': value });
  it('matches our ETag, weakly (RFC 9110 §13.1.2: If-None-Match uses weak comparison), in a list, or *', () => {
    expect(readerHasCurrent(headers('W/"12-abc"'), tag)).toBe(true);
    expect(readerHasCurrent(headers('"12-abc"'), tag)).toBe(true);
    expect(readerHasCurrent(headers('"x", W/"12-abc"'), tag)).toBe(true);
    expect(readerHasCurrent(headers('*'), tag)).toBe(true);
  });
  it('does not match another ETag or no header', () => {
    expect(readerHasCurrent(headers('W/"12-abd"'), tag)).toBe(false);
    expect(readerHasCurrent(headers(), tag)).toBe(false);
  });
  it('still answers a revalidation that says no-cache (fetch() sends that with every If-None-Match): this is the origin', () => {
    expect(readerHasCurrent(new Headers({ 'If-None-Match': tag, 'Cache-Control': 'no-cache', Pragma: 'no-cache' }), tag)).toBe(true);
  });
});

describe('RenderCache', () => {
  it('gives back a render only at the key it was kept at, and keeps one key per address', () => {
    const cache = new RenderCache({ entries: 10, bytes: 1000 });
    cache.set('/a', kept('k1', 10));
    expect(cache.get('/a', 'k1')?.key).toBe('k1');
    expect(cache.get('/a', 'k2')).toBeUndefined();
    cache.set('/a', kept('k2', 20));
    expect(cache.get('/a', 'k1')).toBeUndefined();
    expect(cache.size).toEqual({ entries: 1, bytes: 20 });
  });

  it('drops the least recently used address past the count limit', () => {
    const cache = new RenderCache({ entries: 2, bytes: 1000 });
    cache.set('/a', kept('k', 1));
    cache.set('/b', kept('k', 1));
    cache.get('/a', 'k');
    cache.set('/c', kept('k', 1));
    expect(cache.get('/b', 'k')).toBeUndefined();
    expect(cache.get('/a', 'k')).toBeDefined();
    expect(cache.get('/c', 'k')).toBeDefined();
  });

  it('stays within its byte limit and never keeps a body larger than the limit', () => {
    const cache = new RenderCache({ entries: 100, bytes: 100 });
    cache.set('/a', kept('k', 60));
    cache.set('/b', kept('k', 60));
    expect(cache.size).toEqual({ entries: 1, bytes: 60 });
    expect(cache.get('/a', 'k')).toBeUndefined();
    cache.set('/huge', kept('k', 101));
    expect(cache.get('/huge', 'k')).toBeUndefined();
    expect(cache.size.bytes).toBeLessThanOrEqual(100);
  });
});

describe('answerPublicPage', () => {
  const page = (body: string, init: ResponseInit = {}) =>
    new Response(body, { status: 200, headers: { 'Content-Type': 'text/html', 'Cache-Control': 'public, max-age=60' }, ...init });
  const request = (headers: Record<string, string> = {}) => new Request('http://x.test/fixes/a', { headers });

  it('renders once, then serves the kept bytes at the same key, with the ETag, a length and the cache header', async () => {
    const cache = new RenderCache({ entries: 10, bytes: 10_000 });
    const render = vi.fn(async () => page('<p>r2</p>'));
    const input = { address: '/fixes/a', key: 'k1', policy: 'public' as const, render, mayKeep: () => true, cache };
    const first = await answerPublicPage({ ...input, request: request() });
    const second = await answerPublicPage({ ...input, request: request() });
    expect(render).toHaveBeenCalledTimes(1);
    expect(await second.text()).toBe('<p>r2</p>');
    expect(second.headers.get('etag')).toBe(first.headers.get('etag'));
    expect(second.headers.get('content-length')).toBe('9');
    expect(second.headers.get('cache-control')).toBe('public, max-age=60');
  });

  it('answers a current If-None-Match with 304 and no body, without rendering', async () => {
    const cache = new RenderCache({ entries: 10, bytes: 10_000 });
    const first = await answerPublicPage({
      request: request(),
      address: '/a',
      key: 'k1',
      policy: 'public',
      render: async () => page('x'),
      mayKeep: () => true,
      cache,
    });
    const render = vi.fn(async () => page('y'));
    const again = await answerPublicPage({
      request: request({ 'If-None-Match': first.headers.get('etag')! }),
      address: '/a',
      key: 'k1',
      policy: 'public',
      render,
      mayKeep: () => true,
      cache,
    });
    expect(again.status).toBe(304);
    expect(again.body).toBeNull();
    expect(again.headers.get('etag')).toBe(first.headers.get('etag'));
    expect(again.headers.get('cache-control')).toContain('public');
    expect(render).not.toHaveBeenCalled();
  });

  it('renders again when the key changed, and the old ETag no longer answers 304', async () => {
    const cache = new RenderCache({ entries: 10, bytes: 10_000 });
    const base = { address: '/a', policy: 'public' as const, mayKeep: () => true, cache };
    const old = await answerPublicPage({ ...base, request: request(), key: 'r1', render: async () => page('old text') });
    const fresh = await answerPublicPage({
      ...base,
      request: request({ 'If-None-Match': old.headers.get('etag')! }),
      key: 'r2',
      render: async () => page('new text'),
    });
    expect(fresh.status).toBe(200);
    expect(await fresh.text()).toBe('new text');
  });

  it('keeps no error, no private answer, no answer that sets a cookie, and nothing the caller refuses', async () => {
    const cases: [Response, boolean][] = [
      [page('missing', { status: 404 }), true],
      [new Response('mine', { headers: { 'Cache-Control': 'private, no-store' } }), true],
      [new Response('c', { headers: { 'Cache-Control': 'public', 'Set-Cookie': 'a=b' } }), true],
      [page('refused'), false],
    ];
    for (const [response, mayKeep] of cases) {
      const cache = new RenderCache({ entries: 10, bytes: 10_000 });
      await answerPublicPage({
        request: request(),
        address: '/a',
        key: 'k',
        policy: 'public',
        render: async () => response,
        mayKeep: () => mayKeep,
        cache,
      });
      expect(cache.size.entries).toBe(0);
    }
  });

  it('gives a page that named no cache policy its route policy', async () => {
    const cache = new RenderCache({ entries: 10, bytes: 10_000 });
    const res = await answerPublicPage({
      request: request(),
      address: '/help',
      key: 'build',
      policy: 'public',
      render: async () => new Response('help'),
      mayKeep: () => true,
      cache,
    });
    expect(res.headers.get('cache-control')).toContain('public');
    expect(res.headers.get('etag')).toMatch(/^W\//);
    expect(cache.size.entries).toBe(1);
  });
});

describe('answerPublicPage, compressed', () => {
  const text = '<main>Check the pinch roller for a glazed face before anything else.</main>'.repeat(40);
  const render = async () =>
    new Response(text, { status: 200, headers: { 'Content-Type': 'text/html', 'Cache-Control': 'public, max-age=60' } });
  const ask = (acceptEncoding?: string) =>
    new Request('http://x.test/fixes/a', { headers: acceptEncoding ? { 'Accept-Encoding': acceptEncoding } : {} });

  it('keeps Brotli and gzip copies made once, serves the one the reader takes, and each decompresses to the page', async () => {
    const { brotliDecompressSync, gunzipSync } = await import('node:zlib');
    const cache = new RenderCache({ entries: 10, bytes: 100_000 });
    const renderOnce = vi.fn(render);
    const input = { address: '/fixes/a', key: 'k1', policy: 'public' as const, render: renderOnce, mayKeep: () => true, cache };
    const br = await answerPublicPage({ ...input, request: ask('gzip, deflate, br') });
    const gz = await answerPublicPage({ ...input, request: ask('gzip') });
    const plain = await answerPublicPage({ ...input, request: ask() });
    expect(renderOnce).toHaveBeenCalledTimes(1);
    expect(br.headers.get('content-encoding')).toBe('br');
    expect(gz.headers.get('content-encoding')).toBe('gzip');
    expect(plain.headers.get('content-encoding')).toBeNull();
    for (const answer of [br, gz, plain]) {
      expect(answer.headers.get('vary')).toContain('Accept-Encoding');
      expect(answer.headers.get('etag')).toBe(plain.headers.get('etag'));
    }
    const brBytes = Buffer.from(await br.arrayBuffer());
    expect(Number(br.headers.get('content-length'))).toBe(brBytes.byteLength);
    expect(brotliDecompressSync(brBytes).toString()).toBe(text);
    expect(gunzipSync(Buffer.from(await gz.arrayBuffer())).toString()).toBe(text);
    expect(await plain.text()).toBe(text);
    // The copies count against the cache's byte limit.
    expect(cache.size.bytes).toBeGreaterThan(text.length);
  });
});
