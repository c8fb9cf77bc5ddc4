// Facet counts of a search (maker, device type, format, chassis family, cautions, photos) over its matches.
import type { Knex } from 'knex';
import { deviceTypeLabels, type DeviceType } from '@/lib/schemas/catalogue';
import { cautionLabels, type CautionKind } from '@/lib/schemas/revision';
import type { FacetValue, SearchFacets } from '@/lib/search/result-types';
import { frag, raw, type Fragment } from './sql-fragment';

/** Very broad queries are counted over this many matches, best bench score first; the page says so. */
export const FACET_CAP = 2000;

interface FacetRow {
  dim: 'maker' | 'chassis' | 'deviceType' | 'format' | 'caution' | 'photos';
  value: string;
  n: string;
}

async function labelsFor(knex: Knex, table: 'makers' | 'chassis_families', ids: string[]): Promise<Map<string, { slug: string; name: string }>> {
  if (ids.length === 0) return new Map();
  const rows: { id: number; slug: string; name: string }[] = await knex(table).whereIn('id', ids.map(Number)).select('id', 'slug', 'name');
  return new Map(rows.map((r) => [String(r.id), { slug: r.slug, name: r.name }]));
}

const byCount = (a: FacetValue, b: FacetValue) => b.count - a.count || a.label.localeCompare(b.label);

/** Counts under `match` (a condition on fix_search s, filters included). */
export async function facetCounts(knex: Knex, match: Fragment): Promise<{ facets: SearchFacets; capped: boolean }> {
  const sql = frag(
    `WITH m AS MATERIALIZED (
       SELECT s.maker_ids, s.chassis_ids, s.device_types, s.formats, s.caution_kinds, s.has_photos FROM fix_search s
       WHERE ${match.sql} ORDER BY s.bench_score DESC NULLS LAST, s.fix_id LIMIT ${FACET_CAP + 1})
     SELECT 'maker' AS dim, v::text AS value, count(*) AS n FROM m, unnest(m.maker_ids) v GROUP BY v
     UNION ALL SELECT 'chassis', v::text, count(*) FROM m, unnest(m.chassis_ids) v GROUP BY v
     UNION ALL SELECT 'deviceType', v, count(*) FROM m, unnest(m.device_types) v GROUP BY v
     UNION ALL SELECT 'format', v, count(*) FROM m, unnest(m.formats) v GROUP BY v
     UNION ALL SELECT 'caution', v, count(*) FROM m, unnest(m.caution_kinds) v GROUP BY v
     UNION ALL SELECT 'photos', 'yes', count(*) FROM m WHERE m.has_photos
     UNION ALL SELECT 'rows', 'all', count(*) FROM m`,
    ...match.bindings,
  );
  const { rows } = (await raw(knex, sql)) as unknown as { rows: (FacetRow | { dim: 'rows'; value: string; n: string })[] };
  const of = (dim: string) => rows.filter((r) => r.dim === dim);
  const [makers, chassis] = await Promise.all([labelsFor(knex, 'makers', of('maker').map((r) => r.value)), labelsFor(knex, 'chassis_families', of('chassis').map((r) => r.value))]);
  const named = (dim: string, names: Map<string, { slug: string; name: string }>): FacetValue[] =>
    of(dim).flatMap((r) => {
      const name = names.get(r.value);
      return name ? [{ value: name.slug, label: name.name, count: Number(r.n) }] : [];
    });
  const facets: SearchFacets = {
    maker: named('maker', makers).sort(byCount),
    chassis: named('chassis', chassis).sort(byCount),
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
