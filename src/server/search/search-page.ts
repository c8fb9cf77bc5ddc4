// Everything the search page shows for one request: results, or near matches and wider searches when none.
import type { Knex } from 'knex';
import { searchParamsSchema, toSearchQuery, type SearchQuery } from '@/lib/search/query-schema';
import type { SearchResult } from '@/lib/search/result-types';
import { widerSearches, writeUpHref, type Suggestion } from '@/lib/search/suggestions';
import { fieldErrors } from '../http/responses';
import { logger } from '../core/logger';
import { findNamedMachine } from './context';
import { recordSearchMiss } from './misses';
import { nearMatches, type NearMatch } from './near-matches';
import type { SearchProvider } from './provider-types';

export type SearchPageData =
  | { kind: 'invalid'; messages: string[]; text: string }
  | { kind: 'unknown_machine'; query: SearchQuery }
  | { kind: 'prompt'; query: SearchQuery }
  | { kind: 'results'; query: SearchQuery; result: SearchResult; wider: Suggestion[]; near: NearMatch[]; writeUp: string };

/** Reads the address, runs the search, and when nothing matched counts the miss and finds near matches. */
export async function searchPage(knex: Knex, provider: SearchProvider, url: URL): Promise<SearchPageData> {
  const raw = Object.fromEntries([...url.searchParams].filter(([, v]) => v !== ''));
  const parsed = searchParamsSchema.safeParse(raw);
  if (!parsed.success)
    return { kind: 'invalid', messages: Object.values(fieldErrors(parsed.error)).flat(), text: String(raw.q ?? '').slice(0, 200) };
  const query = toSearchQuery(parsed.data);
  const machine = query.machine ? await findNamedMachine(knex, query.machine) : null;
  if (query.machine && !machine) return { kind: 'unknown_machine', query };
  if (!query.text && !query.machine && Object.keys(query.filters).length === 0) return { kind: 'prompt', query };
  const result = await provider.search(query);
  if (result.total > 0) return { kind: 'results', query, result, wider: [], near: [], writeUp: writeUpHref(query) };
  const near = query.text ? await nearMatches(knex, query.text, machine) : [];
  if (query.text) {
    // Counting must never cost the reader their answer.
    await recordSearchMiss(knex, query.text, machine?.id ?? null).catch((error: unknown) =>
      logger().warn({ err: error }, 'search miss not counted'),
    );
  }
  return { kind: 'results', query, result, wider: widerSearches(query, result.machine), near, writeUp: writeUpHref(query) };
}
