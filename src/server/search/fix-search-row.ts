// Rewrites a fix's row in fix_search from its live revision: what the PostgreSQL provider searches.
import type { Knex } from 'knex';
import { deviceTypeLabels, normaliseCode, type DeviceType } from '@/lib/schemas/catalogue';
import { bodyPlainText } from '@/lib/tiptap/allowlist';
import type { Caution, PartRow } from '@/lib/schemas/revision';
import { addFixToVocabulary } from './vocabulary';
import { queueSearchSync } from './sync-queue';

interface MachineRow {
  id: number;
  maker_id: number;
  maker_name: string;
  model_number: string;
  model_code: string;
  chassis_family_id: number | null;
  chassis_code: string | null;
  device_type: DeviceType;
  formats: string[];
}

interface ChassisRow {
  id: number;
  maker_id: number;
  maker_name: string;
  code: string;
  device_type: DeviceType;
}

const unique = <T>(xs: T[]): T[] => [...new Set(xs)];

async function appliesTo(knex: Knex, fixId: number): Promise<{ machines: MachineRow[]; chassis: ChassisRow[] }> {
  const [machines, chassis] = await Promise.all([
    knex('fix_machines as fm')
      .join('machines as m', 'm.id', 'fm.machine_id')
      .join('makers as mk', 'mk.id', 'm.maker_id')
      .leftJoin('chassis_families as c', 'c.id', 'm.chassis_family_id')
      .where('fm.fix_id', fixId)
      .select(
        'm.id',
        'm.maker_id',
        'mk.name as maker_name',
        'm.model_number',
        'm.model_code',
        'm.chassis_family_id',
        'c.code as chassis_code',
        'm.device_type',
        'm.formats',
      ),
    knex('fix_chassis as fc')
      .join('chassis_families as c', 'c.id', 'fc.chassis_family_id')
      .join('makers as mk', 'mk.id', 'c.maker_id')
      .where('fc.fix_id', fixId)
      .select('c.id', 'c.maker_id', 'mk.name as maker_name', 'c.code', 'c.device_type'),
  ]);
  return { machines, chassis };
}

/** Maker names, model numbers, chassis codes, device types and media ("vhs won't eject"): the words typed beside a symptom. */
function machinesText(machines: MachineRow[], chassis: ChassisRow[]): string {
  return unique([
    ...machines.flatMap((m) => [m.maker_name, m.model_number, m.chassis_code ?? '', deviceTypeLabels[m.device_type], ...m.formats]),
    ...chassis.flatMap((c) => [c.maker_name, c.code, deviceTypeLabels[c.device_type]]),
  ])
    .filter(Boolean)
    .join(' . ');
}

export async function refreshFixSearchRow(knex: Knex, fixId: number): Promise<void> {
  const fix = await knex('fixes').where({ id: fixId }).first('id', 'current_revision_id', 'deleted_at', 'hidden_at');
  if (!fix || !fix.current_revision_id || fix.deleted_at || fix.hidden_at) {
    await knex('fix_search').where({ fix_id: fixId }).delete();
    await queueSearchSync(knex, fixId);
    return;
  }
  const rev = await knex('revisions').where({ id: fix.current_revision_id }).first();
  const { machines, chassis } = await appliesTo(knex, fixId);
  // A photo counts once its renditions exist and it is not deleted.
  const photoCount = await knex('revision_photos as rp')
    .join('photos as p', 'p.id', 'rp.photo_id')
    .where('rp.revision_id', rev.id)
    .whereNull('p.deleted_at')
    .whereRaw(`jsonb_array_length(p.renditions) > 0`)
    .count<{ n: string }[]>('* as n')
    .first();

  const parts = rev.parts as PartRow[];
  const cautions = rev.cautions as Caution[];
  const codes = new Set<string>([
    ...machines.map((m) => m.model_code),
    ...machines.map((m) => (m.chassis_code ? normaliseCode(m.chassis_code) : '')),
    ...chassis.map((c) => normaliseCode(c.code)),
    ...(rev.error_codes as string[]).map(normaliseCode),
    ...parts.map((p) => normaliseCode(p.ref)),
  ]);
  codes.delete('');
  const row = {
    fix_id: fixId,
    revision_id: rev.id,
    title: rev.title,
    symptoms: (rev.symptoms as string[]).join(' . '),
    cause: rev.cause,
    remedy: bodyPlainText(rev.body),
    parts: parts.map((p) => [p.ref, p.value, p.rating, p.notes].filter(Boolean).join(' ')).join(' . '),
    codes: [...codes].join(' '),
    machines_text: machinesText(machines, chassis),
    maker_ids: unique([...machines.map((m) => m.maker_id), ...chassis.map((c) => c.maker_id)]),
    machine_ids: unique(machines.map((m) => m.id)),
    chassis_ids: unique([...chassis.map((c) => c.id), ...machines.map((m) => m.chassis_family_id).filter((x): x is number => x !== null)]),
    direct_chassis_ids: unique(chassis.map((c) => c.id)),
    device_types: unique([...machines.map((m) => m.device_type), ...chassis.map((c) => c.device_type)]),
    formats: unique(machines.flatMap((m) => m.formats)),
    caution_kinds: unique(cautions.map((c) => c.kind)),
    has_photos: Number(photoCount?.n ?? 0) > 0,
    proofed_at: rev.proofed_at,
  };
  // xmax = 0 on the returned row means it was inserted, not updated: a fix new to search.
  const [written] = await knex('fix_search').insert(row).onConflict('fix_id').merge().returning(knex.raw('(xmax = 0) AS inserted'));
  await addFixToVocabulary(knex, fixId, Boolean(written?.inserted));
  await queueSearchSync(knex, fixId);
}
