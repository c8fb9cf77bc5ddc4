// What each public page's rendered bytes depend on, read in one indexed query (or none): the key its kept render
// and its ETag are derived from. The counters are raised by triggers (migration 20261222090000_page_versions), so a
// proofing, a lock, a hide, a bench report or a catalogue edit changes the key in the same transaction.
import { sharedReads } from '@/lib/shared-read';
import { config } from '../core/config';
import { db } from '../core/db';

/** The page's dependencies as one string, or null when the page should render normally (not found, say). */
export type PageKey = (params: Record<string, string | undefined>) => Promise<string | null>;

interface VersionsRow {
  versions: string | null;
}

interface FixKeyRow extends VersionsRow {
  id: number | null;
  current_revision_id: number | null;
  locked_at: Date | null;
}

const versionsOf = (scopes: string[]) =>
  `(SELECT string_agg(scope || '.' || version, ',' ORDER BY scope) FROM page_versions WHERE scope IN (${scopes.map((s) => `'${s}'`).join(', ')}))`;

const everyScope = versionsOf(['bench', 'catalogue', 'fixes', 'people', 'photos']);
const searchScopes = versionsOf(['bench', 'catalogue', 'fixes', 'people', 'photos', 'search']);
// A fix page reads its own row instead of the "fixes" counter, so proofing one fix leaves every other fix's key alone.
const fixPageScopes = versionsOf(['bench', 'catalogue', 'people', 'photos']);

// Every anonymous read of a kept page asks for its key; readers arriving while a key query runs share it (so a
// reader may miss a change committed within that query's time; the next query sees it).
const sharedKeys = sharedReads<string | null>();

/** The named counters as one string, read in one query. */
function countersKey(name: string, versions: string): Promise<string | null> {
  return sharedKeys(name, async () => {
    const rows = await db().raw<{ rows: VersionsRow[] }>(`SELECT ${versions} AS versions`).options({ name });
    return rows.rows[0]?.versions ?? null;
  });
}

/** Pages that list across the site (home, catalogue, machine, chassis, maker): every counter. */
export const siteKey: PageKey = () => countersKey('page-key-site', everyScope);

/** A fix page or one of its revision permalinks: the fix's live revision, its lock, and the counters it shows. */
export const fixKey: PageKey = async ({ slug }) => {
  if (!slug) return null;
  return sharedKeys(`fix/${slug}`, async () => {
    const result = await db()
      .raw<{ rows: FixKeyRow[] }>(
        `SELECT f.id, f.current_revision_id, f.locked_at, ${fixPageScopes} AS versions
         FROM fixes f WHERE f.slug = ? AND f.deleted_at IS NULL AND f.hidden_at IS NULL`,
        [slug],
      )
      .options({ name: 'page-key-fix' });
    const row = result.rows[0];
    // Not found, hidden or not yet live: the page answers its 404 the ordinary way.
    if (!row?.id || row.current_revision_id === null) return null;
    return fixKeyOf(row);
  });
};

export function fixKeyOf(row: {
  id: number | null;
  current_revision_id: number | null;
  locked_at: Date | null;
  versions: string | null;
}): string {
  return `fix.${row.id}.r${row.current_revision_id}.${row.locked_at ? `locked${row.locked_at.getTime()}` : 'open'},${row.versions ?? ''}`;
}

/**
 * The search page and the search API: results come from the search tables (the "search" counter) and show machines,
 * makers, bench scores, photos and names, so every counter. One query, shared by every address of the page.
 * With Meilisearch configured, results come from an index that catches up after the commit, so a counter raised
 * in the transaction could key results read before the index had the change: nothing is kept then.
 */
export const searchKey: PageKey = () => (config().MEILI_URL ? Promise.resolve(null) : countersKey('page-key-search', searchScopes));

/** Help pages change only with a new build: no query at all. */
export const buildOnlyKey: PageKey = () => Promise.resolve('build');

/** How long shared caches may keep a page (a name from cachePolicies in src/server/http/responses.ts). */
export type KeptPolicy = 'public' | 'immutable';

const site = { key: siteKey, policy: 'public' } as const;
const help = { key: buildOnlyKey, policy: 'public' } as const;

/**
 * Where a page's kept renders go: searches have their own, smaller shelf, so a run of one-off queries (a crawler
 * trying words) pushes out other searches, never the fix pages.
 */
export type KeptShelf = 'pages' | 'searches';

/** The public pages (and the search API) whose anonymous answers are kept and validated, by route pattern. */
export const pageKeys: Record<string, { key: PageKey; policy: KeptPolicy; shelf?: KeptShelf }> = {
  '/': site,
  '/machines': site,
  '/machines/[slug]': site,
  '/makers': site,
  '/makers/[slug]': site,
  '/chassis/[slug]': site,
  '/fixes/[slug]': { key: fixKey, policy: 'public' },
  // The revision never changes, but the page around it does (live revision, bench reports): the key still holds it.
  '/fixes/[slug]/r/[number]': { key: fixKey, policy: 'immutable' },
  // A search that found nothing is not kept (its page says `no-cache`): every such search is counted as a miss.
  '/search': { key: searchKey, policy: 'public', shelf: 'searches' },
  // What the search box asks while the reader types; never counted as a miss, so an empty answer is kept too.
  '/api/v1/search': { key: searchKey, policy: 'public', shelf: 'searches' },
  '/sitemap.xml': site,
  '/sitemaps/[file].xml': site,
  '/help': help,
  '/help/content-licence': help,
  '/help/house-rules': help,
  '/help/privacy': help,
  '/help/working-safely': help,
  '/help/writing-a-good-fix': help,
};
