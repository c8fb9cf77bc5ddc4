// When nothing matched: wider searches to try, and the writing page started with the symptom.
import { describe, expect, it } from 'vitest';
import { widerSearches, writeUpHref } from '@/lib/search/suggestions';
import type { SearchQuery } from '@/lib/search/query-schema';

const query: SearchQuery = {
  text: 'tray rattles',
  machine: 'tamberlyn-dr4120-pal',
  scope: 'machine',
  filters: { caution: 'laser' },
  page: 1,
  perPage: 10,
};
const machine = {
  slug: 'tamberlyn-dr4120-pal',
  label: 'Tamberlyn DR-4120 (PAL)',
  chassis: { slug: 'tamberlyn-tl2-loader', name: 'TL-2 DVD recorder loader platform' },
};

describe('widerSearches', () => {
  it('offers the chassis family, then every machine, then no filters', () => {
    expect(widerSearches(query, machine).map((s) => s.href)).toEqual([
      '/search?q=tray+rattles&machine=tamberlyn-dr4120-pal&scope=family&caution=laser',
      '/search?q=tray+rattles&machine=tamberlyn-dr4120-pal&scope=all&caution=laser',
      '/search?q=tray+rattles&machine=tamberlyn-dr4120-pal',
    ]);
  });
  it('offers no family search for a machine without one, and nothing when already wide', () => {
    expect(widerSearches({ ...query, filters: {} }, { ...machine, chassis: null }).map((s) => s.label)).toEqual([
      'Search every machine (fixes for the Tamberlyn DR-4120 (PAL) first)',
    ]);
    expect(widerSearches({ ...query, scope: 'all', filters: {} }, machine)).toEqual([]);
  });
});

describe('writeUpHref', () => {
  it('carries the symptom and machine to the writing page', () => {
    expect(writeUpHref(query)).toBe('/write?symptom=tray+rattles&machine=tamberlyn-dr4120-pal');
    expect(writeUpHref({ ...query, text: '', machine: undefined })).toBe('/write');
  });
});
