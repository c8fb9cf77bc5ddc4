// Facet counts from Meilisearch's facet distribution, labelled from the catalogue in PostgreSQL.
import type { Knex } from 'knex';
import { deviceTypeLabels, type DeviceType } from '@/lib/schemas/catalogue';
import { cautionLabels, type CautionKind } from '@/lib/schemas/revision';
import type { FacetValue, SearchFacets } from '@/lib/search/result-types';

type Distribution = Record<string, Record<string, number>>;

const byCount = (a: FacetValue, b: FacetValue) => b.count - a.count || a.label.localeCompare(b.label);

async function namesBySlug(knex: Knex, table: 'makers' | 'chassis_families', slugs: string[]): Promise<Map<string, string>> {
  if (slugs.length === 0) return new Map();
  const rows: { slug: string; name: string }[] = await knex(table).whereIn('slug', slugs).select('slug', 'name');
  return new Map(rows.map((r) => [r.slug, r.name]));
}

function values(distribution: Distribution, attribute: string, label: (value: string) => string | undefined): FacetValue[] {
  return Object.entries(distribution[attribute] ?? {})
    .flatMap(([value, count]) => {
      const name = label(value);
      return name === undefined ? [] : [{ value, label: name, count }];
    })
    .sort(byCount);
}

export async function facetsFromDistribution(knex: Knex, distribution: Distribution): Promise<SearchFacets> {
  const [makers, chassis] = await Promise.all([
    namesBySlug(knex, 'makers', Object.keys(distribution.makers ?? {})),
    namesBySlug(knex, 'chassis_families', Object.keys(distribution.chassis ?? {})),
  ]);
  return {
    maker: values(distribution, 'makers', (v) => makers.get(v)),
    chassis: values(distribution, 'chassis', (v) => chassis.get(v)),
    deviceType: values(distribution, 'deviceTypes', (v) => deviceTypeLabels[v as DeviceType] ?? v),
    format: values(distribution, 'formats', (v) => v),
    caution: values(distribution, 'cautions', (v) => cautionLabels[v as CautionKind] ?? v),
    hasPhotos: distribution.hasPhotos?.true ?? 0,
  };
}
