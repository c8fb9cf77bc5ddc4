// The search address: one schema for page, endpoint and island, and links that change one thing.
import { describe, expect, it } from 'vitest';
import { searchHref, searchParamsOf, searchParamsSchema, toSearchQuery } from '@/lib/search/query-schema';

describe('searchParamsSchema', () => {
  it('reads a full address into a query with filters', () => {
    const parsed = searchParamsSchema.parse({
      q: ' tray  ',
      machine: 'tamberlyn-dr4120-pal',
      scope: 'family',
      maker: 'tamberlyn',
      photos: '1',
      caution: 'laser',
      page: '2',
    });
    expect(toSearchQuery(parsed)).toEqual({
      text: 'tray',
      machine: 'tamberlyn-dr4120-pal',
      scope: 'family',
      filters: { maker: 'tamberlyn', hasPhotos: true, caution: 'laser' },
      page: 2,
      perPage: 10,
    });
  });
  it('refuses bad values with a message per field', () => {
    const parsed = searchParamsSchema.safeParse({ q: 'x'.repeat(201), deviceType: 'toaster', page: '0', machine: 'Not A Slug' });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((i) => i.path[0]).sort()).toEqual(['deviceType', 'machine', 'page', 'q']);
  });
  it('caps the depth of paging', () => {
    expect(searchParamsSchema.safeParse({ page: '51' }).success).toBe(false);
  });
});

describe('searchHref', () => {
  const query = toSearchQuery(searchParamsSchema.parse({ q: 'no rewind', machine: 'quillmere-vr3100-pal', maker: 'quillmere', page: '3' }));
  it('keeps everything but what changes, and leaves defaults out', () => {
    expect(searchHref(query, { scope: 'all', page: 1 })).toBe('/search?q=no+rewind&machine=quillmere-vr3100-pal&scope=all&maker=quillmere');
    expect(searchHref(query, { filters: {} })).toBe('/search?q=no+rewind&machine=quillmere-vr3100-pal&page=3');
  });
  it('round-trips through the schema', () => {
    const again = toSearchQuery(searchParamsSchema.parse(searchParamsOf(query)));
    expect(again).toEqual(query);
  });
});
