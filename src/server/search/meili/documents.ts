// The Meilisearch documents: one per live fix, read from fix_search so both providers index the same content.
import type { Knex } from 'knex';

export interface MeiliFixDocument {
  id: number;
  slug: string;
  title: string;
  symptoms: string;
  cause: string;
  remedy: string;
  parts: string;
  machinesText: string;
  /** Normalised codes ("dr4120k", "e21"): filtered on, never typo-matched. */
  codes: string[];
  makers: string[];
  machines: string[];
  /** Every chassis family the fix touches, its machines' included. */
  chassis: string[];
  /** Chassis families the fix names itself (it applies to the whole family). */
  familyChassis: string[];
  deviceTypes: string[];
  formats: string[];
  cautions: string[];
  hasPhotos: boolean;
  benchScore: number | null;
  /** bench score for sorting: -1 when there is none yet, so unscored fixes sort last. */
  benchRank: number;
  reportCount: number;
}

interface DocumentRow {
  fix_id: number;
  slug: string;
  title: string;
  symptoms: string;
  cause: string;
  remedy: string;
  parts: string;
  machines_text: string;
  code_list: string[];
  makers: string[];
  machines: string[];
  chassis: string[];
  family_chassis: string[];
  device_types: string[];
  formats: string[];
  caution_kinds: string[];
  has_photos: boolean;
  bench_score: number | null;
  report_count: number;
}

function documentQuery(knex: Knex): Knex.QueryBuilder {
  return knex('fix_search as s')
    .join('fixes as f', 'f.id', 's.fix_id')
    .select(
      's.fix_id',
      'f.slug',
      's.title',
      's.symptoms',
      's.cause',
      's.remedy',
      's.parts',
      's.machines_text',
      's.code_list',
      's.device_types',
      's.formats',
      's.caution_kinds',
      's.has_photos',
      's.bench_score',
      's.report_count',
      knex.raw('ARRAY(SELECT slug FROM makers WHERE id = ANY(s.maker_ids) ORDER BY slug) AS makers'),
      knex.raw('ARRAY(SELECT slug FROM machines WHERE id = ANY(s.machine_ids) ORDER BY slug) AS machines'),
      knex.raw('ARRAY(SELECT slug FROM chassis_families WHERE id = ANY(s.chassis_ids) ORDER BY slug) AS chassis'),
      knex.raw('ARRAY(SELECT slug FROM chassis_families WHERE id = ANY(s.direct_chassis_ids) ORDER BY slug) AS family_chassis'),
    );
}

function toDocument(r: DocumentRow): MeiliFixDocument {
  return {
    id: r.fix_id,
    slug: r.slug,
    title: r.title,
    symptoms: r.symptoms,
    cause: r.cause,
    remedy: r.remedy,
    parts: r.parts,
    machinesText: r.machines_text,
    codes: r.code_list,
    makers: r.makers,
    machines: r.machines,
    chassis: r.chassis,
    familyChassis: r.family_chassis,
    deviceTypes: r.device_types,
    formats: r.formats,
    cautions: r.caution_kinds,
    hasPhotos: r.has_photos,
    benchScore: r.bench_score,
    benchRank: r.bench_score ?? -1,
    reportCount: r.report_count,
  };
}

/** Documents for these fixes; a fix with no live revision has no row and so no document. */
export async function documentsFor(knex: Knex, fixIds: number[]): Promise<MeiliFixDocument[]> {
  if (fixIds.length === 0) return [];
  const rows: DocumentRow[] = await documentQuery(knex).whereIn('s.fix_id', fixIds);
  return rows.map(toDocument);
}

/** One page of all documents, by fix id, for a full reindex. */
export async function documentsAfter(knex: Knex, afterFixId: number, limit: number): Promise<MeiliFixDocument[]> {
  const rows: DocumentRow[] = await documentQuery(knex).where('s.fix_id', '>', afterFixId).orderBy('s.fix_id').limit(limit);
  return rows.map(toDocument);
}
