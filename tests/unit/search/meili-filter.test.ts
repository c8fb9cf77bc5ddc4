// Meilisearch filters and settings built by our adapter: values escaped, synonyms from word families.
import { describe, expect, it } from 'vitest';
import { buildFilter, equals, inList, quoteFilterValue } from '@/server/search/meili/filter';
import { indexSettings, synonymsFrom } from '@/server/search/meili/settings';
import type { SearchQuery } from '@/lib/search/query-schema';

const base: SearchQuery = { text: 'tray', scope: 'machine', filters: {}, page: 1, perPage: 10 };
const machine = { slug: 'tamberlyn-dr4120-pal', label: 'Tamberlyn DR-4120 (PAL)', chassis: { slug: 'tamberlyn-tl2-loader', name: 'TL-2' } };

describe('quoteFilterValue', () => {
  it('escapes backslashes and double quotes inside the quotes', () => {
    expect(quoteFilterValue('say "hi" \\ bye')).toBe('"say \\"hi\\" \\\\ bye"');
    expect(quoteFilterValue(true)).toBe('true');
  });
  it('cannot be broken out of to add a condition', () => {
    const hostile = 'x" OR makers = "y';
    expect(equals('makers', hostile)).toBe('makers = "x\\" OR makers = \\"y"');
  });
});

describe('buildFilter', () => {
  it('scopes to the machine and its family-wide fixes by default', () => {
    expect(buildFilter({ ...base, machine: machine.slug }, machine, [])).toEqual([
      '(machines = "tamberlyn-dr4120-pal" OR familyChassis = "tamberlyn-tl2-loader")',
    ]);
  });
  it('scopes to the whole family, or to nothing, as asked', () => {
    expect(buildFilter({ ...base, machine: machine.slug, scope: 'family' }, machine, [])).toEqual(['chassis = "tamberlyn-tl2-loader"']);
    expect(buildFilter({ ...base, machine: machine.slug, scope: 'all' }, machine, [])).toEqual([]);
  });
  it('adds every facet filter and one IN list per code', () => {
    const query: SearchQuery = {
      ...base,
      filters: { maker: 'tamberlyn', deviceType: 'dvd_recorder', format: 'DVD+R', hasPhotos: true, caution: 'laser' },
    };
    expect(buildFilter(query, null, [{ kind: 'code', label: 'dr4120', exact: ['dr4120'], variants: ['dr4120k'] }])).toEqual([
      'makers = "tamberlyn"',
      'deviceTypes = "dvd_recorder"',
      'formats = "DVD+R"',
      'hasPhotos = true',
      'cautions = "laser"',
      'codes IN ["dr4120", "dr4120k"]',
    ]);
    expect(inList('codes', [])).toBe('codes IN []');
  });
});

describe('indexSettings', () => {
  const families = [
    { id: 1, name: 'tray', terms: ['tray', 'Drawer', 'disc tray'] },
    { id: 2, name: 'eject', terms: ['eject', 'open', 'tray'] },
  ];
  it('makes every term of a family a synonym of the others, merging families that share a term', () => {
    expect(synonymsFrom(families)).toEqual({
      tray: ['disc tray', 'drawer', 'eject', 'open'],
      drawer: ['disc tray', 'tray'],
      'disc tray': ['drawer', 'tray'],
      eject: ['open', 'tray'],
      open: ['eject', 'tray'],
    });
  });
  it('filters on every facet, sorts on the bench score, and never typo-matches codes', () => {
    const settings = indexSettings(families);
    expect(settings.filterableAttributes).toEqual(
      expect.arrayContaining(['makers', 'machines', 'chassis', 'deviceTypes', 'formats', 'cautions', 'hasPhotos', 'codes']),
    );
    expect(settings.rankingRules?.at(-1)).toBe('benchRank:desc');
    expect(settings.typoTolerance?.disableOnAttributes).toEqual(['codes']);
  });
});
