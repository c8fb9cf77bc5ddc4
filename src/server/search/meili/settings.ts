// The Meilisearch index settings Benchlore sets: what is searched, filtered and sorted, ranking rules, synonyms.
import type { Settings } from 'meilisearch';
import type { WordFamily } from '@/lib/search/word-families';

export const MEILI_INDEX = 'fixes';

/** Synonyms from word families: every term of a family stands for each of the others. */
export function synonymsFrom(families: readonly WordFamily[]): Record<string, string[]> {
  const synonyms: Record<string, string[]> = {};
  for (const family of families) {
    const terms = [...new Set(family.terms.map((t) => t.trim().toLowerCase()).filter(Boolean))];
    for (const term of terms) {
      const others = terms.filter((t) => t !== term);
      synonyms[term] = [...new Set([...(synonyms[term] ?? []), ...others])].sort();
    }
  }
  return synonyms;
}

export const filterableAttributes = [
  'makers',
  'machines',
  'chassis',
  'familyChassis',
  'deviceTypes',
  'formats',
  'cautions',
  'hasPhotos',
  'codes',
] as const;

export function indexSettings(families: readonly WordFamily[]): Settings {
  return {
    searchableAttributes: ['title', 'symptoms', 'codes', 'cause', 'machinesText', 'remedy', 'parts'],
    filterableAttributes: [...filterableAttributes],
    sortableAttributes: ['benchRank'],
    displayedAttributes: ['*'],
    // Our own order comes after the engine's text rules; closeness to the named machine is applied by us.
    rankingRules: ['words', 'typo', 'proximity', 'attribute', 'exactness', 'benchRank:desc'],
    synonyms: synonymsFrom(families),
    typoTolerance: {
      enabled: true,
      // Codes are matched exactly: a neighbour's model number is a different machine.
      disableOnAttributes: ['codes'],
      disableOnNumbers: true,
      minWordSizeForTypos: { oneTypo: 4, twoTypos: 8 },
    },
    faceting: { maxValuesPerFacet: 100 },
    pagination: { maxTotalHits: 1000 },
  };
}
