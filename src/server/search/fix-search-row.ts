// Rewrites a fix's row in fix_search from its live revision: what the PostgreSQL provider searches.
import type { Knex } from 'knex';
import { normaliseCode } from '@/lib/schemas/catalogue';
import { bodyPlainText } from '@/lib/tiptap/allowlist';
import type { Caution, PartRow } from '@/lib/schemas/revision';

export async function refreshFixSearchRow(knex: Knex, fixId: number): Promise<void> {
  const fix = await knex('fixes').where({ id: fixId }).first('id', 'current_revision_id', 'deleted_at', 'hidden_at');
  if (!fix || !fix.current_revision_id || fix.deleted_at || fix.hidden_at) {
    await knex('fix_search').where({ fix_id: fixId }).delete();
    return;
  }
  const rev = await knex('revisions').where({ id: fix.current_revision_id }).first();
  const machines = await knex('fix_machines as fm')
    .join('machines as m', 'm.id', 'fm.machine_id')
    .where('fm.fix_id', fixId)
    .select('m.id', 'm.maker_id', 'm.model_code', 'm.chassis_family_id', 'm.device_type', 'm.formats');
  const chassis = await knex('fix_chassis as fc')
    .join('chassis_families as c', 'c.id', 'fc.chassis_family_id')
    .where('fc.fix_id', fixId)
    .select('c.id', 'c.maker_id', 'c.code', 'c.device_type');
  const photoCount = await knex('revision_photos').where({ revision_id: rev.id }).count<{ n: string }[]>('* as n').first();

  const parts = rev.parts as PartRow[];
  const cautions = rev.cautions as Caution[];
  const codes = new Set<string>([
    ...machines.map((m) => m.model_code as string),
    ...chassis.map((c) => normaliseCode(c.code)),
    ...(rev.error_codes as string[]).map(normaliseCode),
    ...parts.map((p) => normaliseCode(p.ref)).filter(Boolean),
  ]);
  const unique = <T>(xs: T[]) => [...new Set(xs)];
  const row = {
    fix_id: fixId,
    revision_id: rev.id,
    title: rev.title,
    symptoms: (rev.symptoms as string[]).join(' . '),
    cause: rev.cause,
    remedy: bodyPlainText(rev.body),
    parts: parts.map((p) => [p.ref, p.value, p.rating, p.notes].filter(Boolean).join(' ')).join(' . '),
    codes: [...codes].filter(Boolean).join(' '),
    maker_ids: unique([...machines.map((m) => m.maker_id), ...chassis.map((c) => c.maker_id)]),
    machine_ids: unique(machines.map((m) => m.id)),
    chassis_ids: unique([...chassis.map((c) => c.id), ...machines.map((m) => m.chassis_family_id).filter((x) => x !== null)]),
    device_types: unique([...machines.map((m) => m.device_type), ...chassis.map((c) => c.device_type)]),
    formats: unique(machines.flatMap((m) => m.formats as string[])),
    caution_kinds: unique(cautions.map((c) => c.kind)),
    has_photos: Number(photoCount?.n ?? 0) > 0,
    proofed_at: rev.proofed_at,
  };
  await knex('fix_search').insert(row).onConflict('fix_id').merge();
}
