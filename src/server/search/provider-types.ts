// The one interface both search providers implement; pages and endpoints only ever see this.
import type { SearchQuery } from '@/lib/search/query-schema';
import type { SearchResult } from '@/lib/search/result-types';

export interface SearchProvider {
  readonly name: 'postgres' | 'meilisearch';
  search(query: SearchQuery): Promise<SearchResult>;
  /** Brings the fix's entry up to date with its live revision (or removes it when there is none). */
  index(fixId: number): Promise<void>;
  remove(fixId: number): Promise<void>;
}
