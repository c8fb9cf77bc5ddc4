// Facet counts of a search (maker, device type, format, chassis family, cautions, photos) over its matches.
import type { Knex } from 'knex';
import { deviceTypeLabels, type DeviceType } from '@/lib/schemas/catalogue';
import { cautionLabels, type CautionKind } from '@/lib/schemas/revision';
import type { FacetValue, SearchFacets } from '@/lib/search/result-types';
import { frag, raw, type Fragment } from './sql-fragment';

/** Very broad queries are counted over this many matches, best bench score first; the page says so. */
export const FACET_CAP = 2000;

interface FacetRow {
  dim: 'maker' | 'chassis' | 'deviceType' | 'format' | 'caution' | 'photos' | 'rows';
  value: string;
  label: string;
  n: string;
}

const byCount = (a: FacetValue, b: FacetValue) => b.count - a.count || a.label.localeCompare(b.label);

/** Counts under `match` (a condition on fix_search s, filters included). */
export async function facetCounts(knex: Knex, match: Fragment): Promise<{ facets: SearchFacets; capped: boolean }> {
  const sql = frag(
    `WITH m AS MATERIALIZED (
       SELECT s.maker_ids, s.chassis_ids, s.device_types, s.formats, s.caution_kinds, s.has_photos FROM fix_search s
       WHERE ${match.sql} ORDER BY s.bench_score DESC NULLS LAST, s.fix_id LIMIT ${FACET_CAP + 1})
     SELECT 'maker' AS dim, mk.slug AS value, mk.name AS label, count(*) AS n FROM m, unnest(m.maker_ids) v JOIN makers mk ON mk.id = v GROUP BY mk.slug, mk.name
     UNION ALL SELECT 'chassis', c.slug, c.name, count(*) FROM m, unnest(m.chassis_ids) v JOIN chassis_families c ON c.id = v GROUP BY c.slug, c.name
     UNION ALL SELECT 'deviceType', v, v, count(*) FROM m, unnest(m.device_types) v GROUP BY v
     UNION ALL SELECT 'format', v, v, count(*) FROM m, unnest(m.formats) v GROUP BY v
     UNION ALL SELECT 'caution', v, v, count(*) FROM m, unnest(m.caution_kinds) v GROUP BY v
     UNION ALL SELECT 'photos', 'yes', 'yes', count(*) FROM m WHERE m.has_photos
     UNION ALL SELECT 'rows', 'all', 'all', count(*) FROM m`,
    ...match.bindings,
  );
  const { rows } = (await raw(knex, sql)) as unknown as { rows: FacetRow[] };
  const of = (dim: FacetRow['dim']) => rows.filter((r) => r.dim === dim);
  const named = (dim: FacetRow['dim']): FacetValue[] => of(dim).map((r) => ({ value: r.value, label: r.label, count: Number(r.n) }));
  const facets: SearchFacets = {
    maker: named('maker').sort(byCount),
    chassis: named('chassis').sort(byCount),
    deviceType: of('deviceType')
      .map((r) => ({ value: r.value, label: deviceTypeLabels[r.value as DeviceType] ?? r.value, count: Number(r.n) }))
      .sort(byCount),
    format: of('format')
      .map((r) => ({ value: r.value, label: r.value, count: Number(r.n) }))
      .sort(byCount),
    caution: of('caution')
      .map((r) => ({ value: r.value, label: cautionLabels[r.value as CautionKind] ?? r.value, count: Number(r.n) }))
      .sort(byCount),
    hasPhotos: Number(of('photos')[0]?.n ?? 0),
  };
  return { facets, capped: Number(of('rows')[0]?.n ?? 0) > FACET_CAP };
}
