// Resolves the slugs of a search (named machine, maker and chassis filters) to the ids the search tables hold.
import type { Knex } from 'knex';
import type { SearchQuery } from '@/lib/search/query-schema';
import type { NamedMachine } from '@/lib/search/result-types';
import type { ProximityTarget } from '@/lib/search/ranking';

export interface ResolvedMachine {
  id: number;
  makerId: number;
  makerSlug: string;
  chassisId: number | null;
  named: NamedMachine;
}

export interface SearchContext {
  /** Null when no machine was named; `missing` when a slug was given that the catalogue lacks. */
  machine: ResolvedMachine | null;
  machineMissing: boolean;
  /** Filter ids; null means "asked for, but no such maker/chassis" (nothing can match). */
  makerId: number | null | undefined;
  chassisId: number | null | undefined;
}

export async function findNamedMachine(knex: Knex, slug: string): Promise<ResolvedMachine | null> {
  const row = await knex('machines as m')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .leftJoin('chassis_families as c', function joinLiveChassis() {
      this.on('c.id', '=', 'm.chassis_family_id').andOnNull('c.deleted_at');
    })
    .where('m.slug', slug)
    .whereNull('m.deleted_at')
    .first(
      'm.id',
      'm.slug',
      'm.model_number',
      'm.region',
      'mk.id as maker_id',
      'mk.slug as maker_slug',
      'mk.name as maker_name',
      'c.id as chassis_id',
      'c.slug as chassis_slug',
      'c.name as chassis_name',
    );
  if (!row) return null;
  return {
    id: row.id,
    makerId: row.maker_id,
    makerSlug: row.maker_slug,
    chassisId: row.chassis_id ?? null,
    named: {
      slug: row.slug,
      label: `${row.maker_name} ${row.model_number} (${row.region})`,
      chassis: row.chassis_id ? { slug: row.chassis_slug, name: row.chassis_name } : null,
    },
  };
}

/** A chassis family on its own, as a fix written for the whole family names it. */
export interface ResolvedChassis {
  chassisId: number;
  family: { slug: string; name: string };
}

export async function findNamedChassis(knex: Knex, slug: string): Promise<ResolvedChassis | null> {
  const row = await knex('chassis_families').where({ slug }).whereNull('deleted_at').first('id', 'slug', 'name');
  return row ? { chassisId: row.id, family: { slug: row.slug, name: row.name } } : null;
}

async function idOf(knex: Knex, table: 'makers' | 'chassis_families', slug: string | undefined): Promise<number | null | undefined> {
  if (slug === undefined) return undefined;
  const row = await knex(table).where({ slug }).whereNull('deleted_at').first('id');
  return row ? (row.id as number) : null;
}

export async function resolveContext(knex: Knex, query: SearchQuery): Promise<SearchContext> {
  const [machine, makerId, chassisId] = await Promise.all([
    query.machine ? findNamedMachine(knex, query.machine) : Promise.resolve(null),
    idOf(knex, 'makers', query.filters.maker),
    idOf(knex, 'chassis_families', query.filters.chassis),
  ]);
  return { machine, machineMissing: Boolean(query.machine) && !machine, makerId, chassisId };
}

export function proximityTarget(machine: ResolvedMachine | null): ProximityTarget<number> | null {
  return machine ? { machineId: machine.id, chassisId: machine.chassisId, makerId: machine.makerId } : null;
}
