// Facet counts for the PostgreSQL provider, from the candidate rows already read: only the names are looked up.
import type { Knex } from 'knex';
import { countFacets, type FacetRow, type Named } from '@/lib/search/facet-count';
import type { SearchFacets } from '@/lib/search/result-types';
import type { CandidateRow } from './pg-candidates';

async function names(knex: Knex, table: 'makers' | 'chassis_families', ids: number[]): Promise<Named> {
  if (ids.length === 0) return new Map();
  const rows: { id: number; slug: string; name: string }[] = await knex(table).whereIn('id', ids).select('id', 'slug', 'name');
  return new Map(rows.map((r) => [r.id, { slug: r.slug, name: r.name }]));
}

export async function facetsOf(knex: Knex, rows: CandidateRow[]): Promise<SearchFacets> {
  const facetRows: FacetRow[] = rows.map((r) => ({
    makerIds: r.maker_ids,
    chassisIds: r.chassis_ids,
    deviceTypes: r.device_types,
    formats: r.formats,
    cautionKinds: r.caution_kinds,
    hasPhotos: r.has_photos,
  }));
  const [makers, chassis] = await Promise.all([
    names(knex, 'makers', [...new Set(rows.flatMap((r) => r.maker_ids))]),
    names(knex, 'chassis_families', [...new Set(rows.flatMap((r) => r.chassis_ids))]),
  ]);
  return countFacets(facetRows, makers, chassis);
}
