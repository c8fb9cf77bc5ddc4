// The writing island's type-ahead over the catalogue: machines and chassis families matching what is typed.
import type { LookupQuery } from '@/lib/schemas/catalogue-lookup';
import { normaliseCode } from '@/lib/schemas/catalogue';
import { db } from '../core/db';

export interface LookupHit {
  kind: 'machine' | 'chassis';
  id: number;
  slug: string;
  label: string;
}

/** Model numbers match loosely ("dr410" finds "DR-410K"); words match makers and family names. */
export async function lookupCatalogue(query: LookupQuery): Promise<LookupHit[]> {
  const knex = db();
  const code = normaliseCode(query.q);
  const words = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  const hits: LookupHit[] = [];
  if (query.kind !== 'chassis') {
    const machines = await knex('machines as m')
      .join('makers as mk', 'mk.id', 'm.maker_id')
      .whereNull('m.deleted_at')
      .where((q) => {
        if (code) q.where('m.model_code', 'like', `%${code}%`);
        q.orWhereRaw(`(mk.name || ' ' || m.model_number) ILIKE ?`, [words]);
      })
      .orderByRaw('m.model_code = ? DESC, length(m.model_code), mk.name, m.model_number', [code])
      .limit(10)
      .select('m.id', 'm.slug', knex.raw(`mk.name || ' ' || m.model_number || ' (' || m.region || ')' AS label`));
    hits.push(...machines.map((m) => ({ kind: 'machine' as const, id: m.id, slug: m.slug, label: m.label })));
  }
  if (query.kind !== 'machine') {
    const chassis = await knex('chassis_families as c')
      .join('makers as mk', 'mk.id', 'c.maker_id')
      .whereNull('c.deleted_at')
      .where((q) => q.whereRaw(`(mk.name || ' ' || c.name || ' ' || c.code) ILIKE ?`, [words]))
      .orderBy('c.name')
      .limit(5)
      .select('c.id', 'c.slug', knex.raw(`c.name || ' ' || c.code AS label`));
    hits.push(...chassis.map((c) => ({ kind: 'chassis' as const, id: c.id, slug: c.slug, label: c.label })));
  }
  return hits;
}

/** Labels for machines named by slug in a prefill link (`/write?machine=...`). */
export async function machinesBySlug(slugs: string[]): Promise<{ id: number; label: string }[]> {
  if (slugs.length === 0) return [];
  const knex = db();
  return knex('machines as m')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .whereIn('m.slug', slugs.slice(0, 10))
    .whereNull('m.deleted_at')
    .select('m.id', knex.raw(`mk.name || ' ' || m.model_number || ' (' || m.region || ')' AS label`));
}
