// Sitemaps as the open sitemaps.org protocol (0.9) writes them: at most 50,000 addresses per file, and a sitemap
// index naming the files. Pure: the addresses come from src/server/fixes/site-map.ts.

/** The protocol's limit of addresses in one sitemap file. */
export const SITEMAP_LIMIT = 50_000;

export interface SitemapEntry {
  /** A path on this site, e.g. "/fixes/tray-will-not-close". */
  path: string;
  lastModified?: Date | null;
}

/** How many sitemap files `total` addresses need (always at least one, so the index is never empty). */
export function sitemapFileCount(total: number, limit = SITEMAP_LIMIT): number {
  return Math.max(1, Math.ceil(total / limit));
}

/** The part of the ordered list of addresses that sitemap file `file` (1-based) holds: offset and count. */
export function sitemapSlice(file: number, total: number, limit = SITEMAP_LIMIT): { offset: number; count: number } | null {
  if (!Number.isSafeInteger(file) || file < 1 || file > sitemapFileCount(total, limit)) return null;
  const offset = (file - 1) * limit;
  return { offset, count: Math.max(0, Math.min(limit, total - offset)) };
}

function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');
}

const day = (date: Date) => date.toISOString().slice(0, 10);

export function sitemapXml(origin: string, entries: SitemapEntry[]): string {
  if (entries.length > SITEMAP_LIMIT) throw new Error(`a sitemap file holds at most ${SITEMAP_LIMIT} addresses, not ${entries.length}`);
  const urls = entries.map((e) => {
    const lastmod = e.lastModified ? `<lastmod>${day(e.lastModified)}</lastmod>` : '';
    return `<url><loc>${escapeXml(new URL(e.path, origin).href)}</loc>${lastmod}</url>`;
  });
  return `<?xml version="1.0" encoding="UTF-8"?>\n<urlset xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">\n${urls.join('\n')}\n</urlset>\n`;
}

/** The index: one entry per file, /sitemaps/1.xml, /sitemaps/2.xml, … */
export function sitemapIndexXml(origin: string, files: number): string {
  const items = Array.from(
    { length: files },
    (_, i) => `<sitemap><loc>${escapeXml(new URL(`/sitemaps/${i + 1}.xml`, origin).href)}</loc></sitemap>`,
  );
  return `<?xml version="1.0" encoding="UTF-8"?>\n<sitemapindex xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">\n${items.join('\n')}\n</sitemapindex>\n`;
}
