// Editors add, change, retire and restore word families; every change is audited with its before and after.
import type { Knex } from 'knex';
import { can, type SessionUser } from '@/lib/permissions';
import { wordFamilyFormSchema, type WordFamilyForm } from '@/lib/search/word-family-schema';
import { writeAudit } from '../core/audit';
import { fieldErrors } from '../http/responses';
import { invalid, redirectTo, refused, type FormOutcome } from '../auth/form-outcome';
import { queueSynonymsSync } from './sync-queue';

export interface WordFamilyRow {
  id: number;
  name: string;
  terms: string[];
  updatedAt: Date;
  retiredAt: Date | null;
}

export async function listWordFamilies(knex: Knex): Promise<WordFamilyRow[]> {
  const rows = await knex('word_families')
    .select('id', 'name', 'terms', 'updated_at', 'retired_at')
    .orderByRaw('retired_at IS NOT NULL, lower(name), id');
  return rows.map((r) => ({ id: r.id, name: r.name, terms: r.terms, updatedAt: r.updated_at, retiredAt: r.retired_at }));
}

type Snapshot = { name: string; terms: string[]; retired: boolean } | null;

function snapshot(row: { name: string; terms: string[]; retired_at: Date | null } | undefined): Snapshot {
  return row ? { name: row.name, terms: row.terms, retired: row.retired_at !== null } : null;
}

async function nameTaken(trx: Knex.Transaction, name: string, exceptId?: number): Promise<boolean> {
  const q = trx('word_families').whereRaw('lower(name) = lower(?)', [name]);
  if (exceptId !== undefined) q.whereNot('id', exceptId);
  return Boolean(await q.first('id'));
}

/** Applies one form inside a transaction; 'missing' and 'taken' come back as values for the page to explain. */
async function apply(
  trx: Knex.Transaction,
  actor: SessionUser,
  form: WordFamilyForm,
): Promise<'missing' | 'taken' | { id: number; notice: string }> {
  if (form.intent === 'create') {
    if (await nameTaken(trx, form.name)) return 'taken';
    const [row] = await trx('word_families')
      .insert({ name: form.name, terms: form.terms, created_by: actor.id })
      .returning(['id', 'name', 'terms', 'retired_at']);
    await writeAudit(
      {
        actorId: actor.id,
        action: 'word_family.create',
        subjectType: 'word_family',
        subjectId: row.id,
        detail: { before: null, after: snapshot(row) },
      },
      trx,
    );
    return { id: row.id, notice: 'added' };
  }
  const before = await trx('word_families').where({ id: form.id }).forUpdate().first('id', 'name', 'terms', 'retired_at');
  if (!before) return 'missing';
  let changes: Record<string, unknown>;
  if (form.intent === 'update') {
    if (await nameTaken(trx, form.name, form.id)) return 'taken';
    changes = { name: form.name, terms: form.terms };
  } else {
    changes = { retired_at: form.intent === 'retire' ? trx.fn.now() : null };
  }
  const [after] = await trx('word_families')
    .where({ id: form.id })
    .update({ ...changes, updated_at: trx.fn.now() })
    .returning(['id', 'name', 'terms', 'retired_at']);
  await writeAudit(
    {
      actorId: actor.id,
      action: `word_family.${form.intent}`,
      subjectType: 'word_family',
      subjectId: form.id,
      detail: { before: snapshot(before), after: snapshot(after) },
    },
    trx,
  );
  return { id: form.id, notice: form.intent === 'update' ? 'saved' : form.intent === 'retire' ? 'retired' : 'restored' };
}

export async function handleWordFamilyForm(knex: Knex, actor: SessionUser, fields: Record<string, string>): Promise<FormOutcome> {
  if (!can(actor, 'manage_word_families')) return refused(403, 'Word families are kept by editors, moderators and admins.');
  const parsed = wordFamilyFormSchema.safeParse(fields);
  if (!parsed.success) return invalid(fieldErrors(parsed.error));
  const outcome = await knex.transaction(async (trx) => {
    const applied = await apply(trx, actor, parsed.data);
    if (typeof applied !== 'string') await queueSynonymsSync(trx);
    return applied;
  });
  if (outcome === 'missing') return refused(404, 'That word family no longer exists.');
  if (outcome === 'taken') return invalid({ name: ['Another family already has that name.'] });
  return redirectTo(`/admin/word-families?notice=${outcome.notice}#family-${outcome.id}`);
}
