// The built files answered from memory by the server entry: the right type, caching and security headers, the copy
// compressed at build time for a reader who accepts it, 304 for a current copy, and the app for everything else.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadStaticFiles, serveStaticFile } from '@/server/http/static-files';

const css = `.bench { color: #0f4c4a; }\n`.repeat(200);
let dir: string;
let server: Server;
let base: string;

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'bl-static-'));
  mkdirSync(join(dir, '_astro'));
  mkdirSync(join(dir, 'kept'));
  writeFileSync(join(dir, '_astro', 'site.abc123.css'), css);
  writeFileSync(join(dir, '_astro', 'site.abc123.css.br'), brotliCompressSync(css));
  writeFileSync(join(dir, '_astro', 'site.abc123.css.gz'), gzipSync(css));
  writeFileSync(join(dir, 'sw.js'), 'self.addEventListener("fetch", () => {});');
  writeFileSync(join(dir, 'kept', 'index.html'), '<!doctype html><title>Kept</title>');
  const files = loadStaticFiles(dir, [
    { pathname: '/kept', headers: [{ key: 'Content-Security-Policy', value: "script-src 'sha256-x'" }] },
  ]);
  server = createServer((req, res) => {
    if (!serveStaticFile(files, req, res)) res.end('the app');
  });
  await new Promise<void>((done) => server.listen(0, '127.0.0.1', done));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});

afterAll(async () => {
  await new Promise((done) => server.close(done));
  rmSync(dir, { recursive: true, force: true });
});

describe('serveStaticFile', () => {
  it('serves a hashed stylesheet for a year, with its type and the security headers', async () => {
    const res = await fetch(`${base}/_astro/site.abc123.css`, { headers: { 'accept-encoding': 'identity' } });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('text/css; charset=utf-8');
    expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('content-security-policy')).toContain("script-src 'self'");
    expect(res.headers.get('vary')).toBe('Accept-Encoding');
    expect(res.headers.get('content-encoding')).toBeNull();
    expect(await res.text()).toBe(css);
  });

  it('sends the Brotli or gzip copy made at build time to a reader who accepts it', async () => {
    const { request } = await import('node:http');
    const raw = (encoding: string) =>
      new Promise<{ encoding: string | undefined; length: number }>((done, fail) => {
        request(`${base}/_astro/site.abc123.css`, { headers: { 'accept-encoding': encoding } }, (res) => {
          let length = 0;
          res.on('data', (chunk: Buffer) => (length += chunk.byteLength));
          res.on('end', () => done({ encoding: res.headers['content-encoding'], length }));
        })
          .on('error', fail)
          .end();
      });
    const br = await raw('gzip, deflate, br');
    const gz = await raw('gzip');
    expect(br).toEqual({ encoding: 'br', length: brotliCompressSync(css).byteLength });
    expect(gz).toEqual({ encoding: 'gzip', length: gzipSync(css).byteLength });
    // fetch decompresses: the text is the stylesheet itself.
    expect(await (await fetch(`${base}/_astro/site.abc123.css`)).text()).toBe(css);
  });

  it('answers 304 to a reader whose copy is current, and never serves a compressed copy by its own name', async () => {
    const first = await fetch(`${base}/_astro/site.abc123.css`);
    const again = await fetch(`${base}/_astro/site.abc123.css`, { headers: { 'if-none-match': first.headers.get('etag')! } });
    expect(again.status).toBe(304);
    expect(await (await fetch(`${base}/_astro/site.abc123.css.br`)).text()).toBe('the app');
  });

  it('serves a prerendered page at its address with its own policy, and unhashed files checked each time', async () => {
    for (const path of ['/kept', '/kept/', '/kept/index.html']) {
      const res = await fetch(base + path);
      expect(res.status, path).toBe(200);
      expect(res.headers.get('content-security-policy')).toBe("script-src 'sha256-x'");
      expect(await res.text()).toContain('<title>Kept</title>');
    }
    expect((await fetch(`${base}/sw.js?v=2`)).headers.get('cache-control')).toBe('public, max-age=0');
  });

  it('leaves other addresses to the app, refuses a post at a file with 405, and HEAD sends no body', async () => {
    expect(await (await fetch(`${base}/fixes/belt-slips`)).text()).toBe('the app');
    expect(await (await fetch(`${base}/nope.js`, { method: 'POST', body: 'x' })).text()).toBe('the app');
    const posted = await fetch(`${base}/kept`, { method: 'POST', body: 'x' });
    expect(posted.status).toBe(405);
    expect(posted.headers.get('allow')).toBe('GET, HEAD');
    const head = await fetch(`${base}/sw.js`, { method: 'HEAD' });
    expect(head.status).toBe(200);
    expect(await head.text()).toBe('');
  });
});
