// Sitemaps split at the sitemaps.org protocol's limit of 50,000 addresses per file (sitemaps.org/protocol.html,
// "Sitemap index files"), with an index naming every file.
import { describe, expect, it } from 'vitest';
import { SITEMAP_LIMIT, sitemapFileCount, sitemapIndexXml, sitemapSlice, sitemapXml } from '@/lib/sitemap';

describe('splitting', () => {
  it('uses one file up to 50,000 addresses and another for each 50,000 past it', () => {
    expect(SITEMAP_LIMIT).toBe(50_000);
    expect(sitemapFileCount(0)).toBe(1);
    expect(sitemapFileCount(1)).toBe(1);
    expect(sitemapFileCount(50_000)).toBe(1);
    expect(sitemapFileCount(50_001)).toBe(2);
    expect(sitemapFileCount(100_000)).toBe(2);
    expect(sitemapFileCount(100_001)).toBe(3);
  });

  it('gives each file its own slice, together covering every address exactly once', () => {
    const total = 123_456;
    const slices = Array.from({ length: sitemapFileCount(total) }, (_, i) => sitemapSlice(i + 1, total)!);
    expect(slices).toEqual([
      { offset: 0, count: 50_000 },
      { offset: 50_000, count: 50_000 },
      { offset: 100_000, count: 23_456 },
    ]);
    expect(slices.reduce((n, s) => n + s.count, 0)).toBe(total);
  });

  it('has no file 0, no file past the last, and no fractional file', () => {
    expect(sitemapSlice(0, 10)).toBeNull();
    expect(sitemapSlice(2, 50_000)).toBeNull();
    expect(sitemapSlice(1.5, 10)).toBeNull();
    expect(sitemapSlice(2, 50_001)).toEqual({ offset: 50_000, count: 1 });
  });
});

describe('XML', () => {
  it('writes absolute, escaped addresses with the day of last change', () => {
    const xml = sitemapXml('https://bench.example', [
      { path: '/fixes/a', lastModified: new Date('2026-12-01T23:00:00Z') },
      { path: '/makers/x?y=1&z=2' },
    ]);
    expect(xml).toContain('<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">');
    expect(xml).toContain('<url><loc>https://bench.example/fixes/a</loc><lastmod>2026-12-01</lastmod></url>');
    expect(xml).toContain('<loc>https://bench.example/makers/x?y=1&amp;z=2</loc>');
  });

  it('refuses more than 50,000 addresses in one file', () => {
    const entries = Array.from({ length: 50_001 }, (_, i) => ({ path: `/fixes/f${i}` }));
    expect(() => sitemapXml('https://bench.example', entries)).toThrow(/at most 50000/);
    expect(() => sitemapXml('https://bench.example', entries.slice(0, 50_000))).not.toThrow();
  });

  it('names every file in the index', () => {
    const xml = sitemapIndexXml('https://bench.example', 3);
    expect(xml).toContain('<sitemapindex xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">');
    expect(xml.match(/<sitemap>/g)).toHaveLength(3);
    expect(xml).toContain('<loc>https://bench.example/sitemaps/3.xml</loc>');
  });
});
