// What to offer when a search found nothing: a wider scope, fewer filters, and writing the fault up.
import { searchHref, type SearchQuery } from './query-schema';
import type { NamedMachine } from './result-types';

export interface Suggestion {
  href: string;
  label: string;
}

/** Wider searches worth a click, most specific first; each drops one restriction. */
export function widerSearches(query: SearchQuery, machine: NamedMachine | null): Suggestion[] {
  const suggestions: Suggestion[] = [];
  if (machine?.chassis && query.scope === 'machine') {
    suggestions.push({ href: searchHref(query, { scope: 'family', page: 1 }), label: `Search the whole ${machine.chassis.name} family` });
  }
  if (machine && query.scope !== 'all') {
    suggestions.push({
      href: searchHref(query, { scope: 'all', page: 1 }),
      label: `Search every machine (fixes for the ${machine.label} first)`,
    });
  }
  if (Object.keys(query.filters).length > 0) {
    suggestions.push({ href: searchHref(query, { filters: {}, page: 1 }), label: 'Search without the filters' });
  }
  return suggestions;
}

/** The writing page, started with the symptom and machine the reader searched for. */
export function writeUpHref(query: SearchQuery): string {
  const params = new URLSearchParams();
  if (query.text.trim()) params.set('symptom', query.text.trim());
  if (query.machine) params.set('machine', query.machine);
  const search = params.toString();
  return search ? `/write?${search}` : '/write';
}
