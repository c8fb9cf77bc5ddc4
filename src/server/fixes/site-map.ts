// The addresses the sitemap lists: every live, visible fix (with the day its live revision was proofed) and the
// catalogue's makers, chassis families and machines, in a fixed order so a file number always means the same slice.
import { db } from '../core/db';
import { sitemapFileCount, sitemapSlice, type SitemapEntry } from '@/lib/sitemap';
import { helpPages } from '@/layouts/help-pages';

/** Pages listed before the database's: the home page, the catalogue's entrances, the bench tools, help. */
export const fixedPaths: string[] = ['/', '/machines', '/makers', '/tools', ...helpPages.map((p) => p.href)];

const listed = `
  SELECT 1 AS kind, f.id, '/fixes/' || f.slug AS path, r.proofed_at AS last_modified
    FROM fixes f JOIN revisions r ON r.id = f.current_revision_id
   WHERE f.deleted_at IS NULL AND f.hidden_at IS NULL
  UNION ALL SELECT 2, id, '/machines/' || slug, NULL FROM machines WHERE deleted_at IS NULL
  UNION ALL SELECT 3, id, '/chassis/' || slug, NULL FROM chassis_families WHERE deleted_at IS NULL
  UNION ALL SELECT 4, id, '/makers/' || slug, NULL FROM makers WHERE deleted_at IS NULL`;

async function countListed(): Promise<number> {
  const result = await db().raw<{ rows: { n: string }[] }>(`SELECT count(*) AS n FROM (${listed}) AS listed`);
  return Number(result.rows[0]?.n ?? 0);
}

/** How many sitemap files the site needs, given the fixed pages listed first. */
export async function sitemapFiles(fixedPaths: string[]): Promise<number> {
  return sitemapFileCount(fixedPaths.length + (await countListed()));
}

/** The entries of sitemap file `file` (1-based), or null when there is no such file. */
export async function sitemapFile(file: number, fixedPaths: string[]): Promise<SitemapEntry[] | null> {
  const total = fixedPaths.length + (await countListed());
  const slice = sitemapSlice(file, total);
  if (!slice) return null;
  const fixed = fixedPaths.slice(slice.offset, slice.offset + slice.count).map((path) => ({ path }));
  const wanted = slice.count - fixed.length;
  if (wanted <= 0) return fixed;
  const result = await db().raw<{ rows: { path: string; last_modified: Date | null }[] }>(
    `SELECT path, last_modified FROM (${listed}) AS listed ORDER BY kind, id LIMIT ? OFFSET ?`,
    [wanted, Math.max(0, slice.offset - fixedPaths.length)],
  );
  return [...fixed, ...result.rows.map((r) => ({ path: r.path, lastModified: r.last_modified }))];
}
