// Catalogue reads: makers, chassis families and machines, with filters and pagination.
import { z } from 'zod';
import type { Knex } from 'knex';
import { db } from '../core/db';
import { deviceTypeSchema, mediaFormatSchema, regionSchema, type DeviceType, type Region } from '@/lib/schemas/catalogue';
import { pageQuerySchema, toPage, type Page } from '../core/pagination';

export interface MakerRef {
  slug: string;
  name: string;
}
export interface ChassisRef {
  slug: string;
  name: string;
  code: string;
}
export interface MachineSummary {
  slug: string;
  modelNumber: string;
  region: Region;
  deviceType: DeviceType;
  formats: string[];
  yearFrom: number | null;
  yearTo: number | null;
  maker: MakerRef;
  chassis: ChassisRef | null;
  fixCount: number;
}
export interface MachineDetail extends MachineSummary {
  id: number;
  about: string;
  chassisId: number | null;
  makerId: number;
}

export const machineFilterSchema = pageQuerySchema.extend({
  maker: z.string().max(80).optional(),
  deviceType: deviceTypeSchema.optional(),
  format: mediaFormatSchema.optional(),
  region: regionSchema.optional(),
  chassis: z.string().max(80).optional(),
});
export type MachineFilter = z.infer<typeof machineFilterSchema>;

interface MachineRow {
  id: number;
  slug: string;
  model_number: string;
  region: Region;
  device_type: DeviceType;
  formats: string[];
  year_from: number | null;
  year_to: number | null;
  about: string;
  maker_id: number;
  maker_slug: string;
  maker_name: string;
  chassis_family_id: number | null;
  chassis_slug: string | null;
  chassis_name: string | null;
  chassis_code: string | null;
  fix_count: string | number;
}

function machineQuery(knex: Knex): Knex.QueryBuilder {
  return knex('machines as m')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .leftJoin('chassis_families as c', 'c.id', 'm.chassis_family_id')
    .whereNull('m.deleted_at')
    .select(
      'm.id',
      'm.slug',
      'm.model_number',
      'm.region',
      'm.device_type',
      'm.formats',
      'm.year_from',
      'm.year_to',
      'm.about',
      'm.maker_id',
      'mk.slug as maker_slug',
      'mk.name as maker_name',
      'm.chassis_family_id',
      'c.slug as chassis_slug',
      'c.name as chassis_name',
      'c.code as chassis_code',
      knex.raw(
        `(SELECT count(*) FROM fix_machines fm JOIN fixes f ON f.id = fm.fix_id
          WHERE fm.machine_id = m.id AND f.deleted_at IS NULL AND f.hidden_at IS NULL) AS fix_count`,
      ),
    );
}

function toMachine(row: MachineRow): MachineDetail {
  return {
    id: row.id,
    slug: row.slug,
    modelNumber: row.model_number,
    region: row.region,
    deviceType: row.device_type,
    formats: row.formats,
    yearFrom: row.year_from,
    yearTo: row.year_to,
    about: row.about,
    makerId: row.maker_id,
    maker: { slug: row.maker_slug, name: row.maker_name },
    chassisId: row.chassis_family_id,
    chassis: row.chassis_slug ? { slug: row.chassis_slug, name: row.chassis_name ?? '', code: row.chassis_code ?? '' } : null,
    fixCount: Number(row.fix_count),
  };
}

export function summariseMachine(m: MachineDetail): MachineSummary {
  const { id: _id, about: _about, chassisId: _c, makerId: _m, ...summary } = m;
  return summary;
}

export async function listMachines(filter: MachineFilter): Promise<Page<MachineSummary>> {
  const knex = db();
  const base = machineQuery(knex);
  if (filter.maker) base.where('mk.slug', filter.maker);
  if (filter.deviceType) base.where('m.device_type', filter.deviceType);
  if (filter.format) base.whereRaw('? = ANY(m.formats)', [filter.format]);
  if (filter.region) base.where('m.region', filter.region);
  if (filter.chassis) base.where('c.slug', filter.chassis);
  const countRow = await knex.count<{ n: string }[]>('* as n').from(base.clone().as('q')).first();
  const rows: MachineRow[] = await base
    .orderBy([{ column: 'mk.name' }, { column: 'm.model_number' }, { column: 'm.region' }])
    .limit(filter.perPage)
    .offset((filter.page - 1) * filter.perPage);
  return toPage(
    rows.map((r) => summariseMachine(toMachine(r))),
    Number(countRow?.n ?? 0),
    filter,
  );
}

export async function getMachine(slug: string): Promise<MachineDetail | null> {
  const row: MachineRow | undefined = await machineQuery(db()).where('m.slug', slug).first();
  return row ? toMachine(row) : null;
}

export async function machinesOfChassis(chassisId: number): Promise<MachineSummary[]> {
  const rows: MachineRow[] = await machineQuery(db()).where('m.chassis_family_id', chassisId).orderBy('m.model_number');
  return rows.map((r) => summariseMachine(toMachine(r)));
}

export async function machinesOfMaker(makerId: number): Promise<MachineSummary[]> {
  const rows: MachineRow[] = await machineQuery(db()).where('m.maker_id', makerId).orderBy('m.model_number');
  return rows.map((r) => summariseMachine(toMachine(r)));
}

export interface ChassisDetail extends ChassisRef {
  id: number;
  about: string;
  deviceType: DeviceType;
  maker: MakerRef;
  makerId: number;
}

export async function getChassis(slug: string): Promise<ChassisDetail | null> {
  const row = await db()('chassis_families as c')
    .join('makers as mk', 'mk.id', 'c.maker_id')
    .whereNull('c.deleted_at')
    .where('c.slug', slug)
    .first(
      'c.id',
      'c.slug',
      'c.name',
      'c.code',
      'c.about',
      'c.device_type',
      'c.maker_id',
      'mk.slug as maker_slug',
      'mk.name as maker_name',
    );
  if (!row) return null;
  return {
    id: row.id,
    slug: row.slug,
    name: row.name,
    code: row.code,
    about: row.about,
    deviceType: row.device_type,
    makerId: row.maker_id,
    maker: { slug: row.maker_slug, name: row.maker_name },
  };
}

export interface MakerDetail extends MakerRef {
  id: number;
  country: string | null;
  about: string;
  families: (ChassisRef & { machineCount: number; deviceType: DeviceType })[];
}

export async function listMakers(): Promise<(MakerRef & { machineCount: number })[]> {
  const rows = await db()('makers as mk')
    .whereNull('mk.deleted_at')
    .select(
      'mk.slug',
      'mk.name',
      db().raw('(SELECT count(*) FROM machines m WHERE m.maker_id = mk.id AND m.deleted_at IS NULL) AS machine_count'),
    )
    .orderBy('mk.name');
  return rows.map((r) => ({ slug: r.slug, name: r.name, machineCount: Number(r.machine_count) }));
}

export async function listChassis(): Promise<(ChassisRef & { maker: MakerRef })[]> {
  const rows = await db()('chassis_families as c')
    .join('makers as mk', 'mk.id', 'c.maker_id')
    .whereNull('c.deleted_at')
    .select('c.slug', 'c.name', 'c.code', 'mk.slug as maker_slug', 'mk.name as maker_name')
    .orderBy(['mk.name', 'c.name']);
  return rows.map((r) => ({ slug: r.slug, name: r.name, code: r.code, maker: { slug: r.maker_slug, name: r.maker_name } }));
}

export async function getMaker(slug: string): Promise<MakerDetail | null> {
  const knex = db();
  const maker = await knex('makers').whereNull('deleted_at').where({ slug }).first('id', 'slug', 'name', 'country', 'about');
  if (!maker) return null;
  const families = await knex('chassis_families as c')
    .whereNull('c.deleted_at')
    .where('c.maker_id', maker.id)
    .select(
      'c.slug',
      'c.name',
      'c.code',
      'c.device_type',
      knex.raw('(SELECT count(*) FROM machines m WHERE m.chassis_family_id = c.id AND m.deleted_at IS NULL) AS machine_count'),
    )
    .orderBy('c.name');
  return {
    id: maker.id,
    slug: maker.slug,
    name: maker.name,
    country: maker.country,
    about: maker.about,
    families: families.map((f) => ({
      slug: f.slug,
      name: f.name,
      code: f.code,
      deviceType: f.device_type,
      machineCount: Number(f.machine_count),
    })),
  };
}
