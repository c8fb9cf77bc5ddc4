// Drafts: the one open revision a writer keeps per fix, created on the first save and saved in place until submitted.
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { can } from '@/lib/permissions';
import { splitDraft, type FixDraft, type HeldFields } from '@/lib/schemas/fix-draft';
import { db } from '../core/db';
import { refuse, succeed, type Outcome, type Writer } from '../http/result';
import { loadRevision, type RevisionRecord } from './revisions';

export interface DraftSaved {
  revision: RevisionRecord;
  /** The fix went live with another revision since this draft's base: submitting will answer 409. */
  baseIsStale: boolean;
}

/** What a draft save stores: the values that pass their checks, and the fields held as typed until they are fixed. */
export interface DraftContent {
  values: FixDraft;
  held: HeldFields;
}

/** A draft keeps whatever the writer typed; only what no person types (the remedy's structure) can refuse a save. */
export function parseDraftValues(raw: unknown): Outcome<DraftContent> {
  const split = splitDraft(raw);
  if (!split.ok) return refuse('bad_request', `Nothing was saved: ${split.message}`, split.fields);
  return succeed({ values: split.values, held: split.held });
}

/** Machines, chassis families and photos named by a draft must exist; photos must be the writer's or already public. */
async function checkReferences(knex: Knex, writer: Writer, values: FixDraft): Promise<Record<string, string[]> | null> {
  const fields: Record<string, string[]> = {};
  const count = async (q: Knex.QueryBuilder) => Number((await q.count<{ n: string }[]>('* as n').first())?.n ?? 0);
  const machines = new Set(values.machineIds);
  if (
    machines.size &&
    (await count(
      knex('machines')
        .whereIn('id', [...machines])
        .whereNull('deleted_at'),
    )) !== machines.size
  ) {
    fields.machineIds = ['One of the machines is not in the catalogue (any more); pick it again.'];
  }
  const chassis = new Set(values.chassisIds);
  if (
    chassis.size &&
    (await count(
      knex('chassis_families')
        .whereIn('id', [...chassis])
        .whereNull('deleted_at'),
    )) !== chassis.size
  ) {
    fields.chassisIds = ['One of the chassis families is not in the catalogue (any more); pick it again.'];
  }
  const photos = new Set(values.photoIds);
  if (photos.size) {
    const usable = await count(
      knex('photos as p')
        .whereIn('p.id', [...photos])
        .whereNull('p.deleted_at')
        .where((q) =>
          q
            .where('p.owner_id', writer.id)
            .orWhereExists(
              knex('revision_photos as rp')
                .join('revisions as r', 'r.id', 'rp.revision_id')
                .whereRaw('rp.photo_id = p.id')
                .whereNot('r.state', 'draft'),
            ),
        ),
    );
    if (usable !== photos.size) fields.photoIds = ['One of the photos is not yours or no longer exists; upload it again.'];
  }
  return Object.keys(fields).length ? fields : null;
}

/** Writes a draft's content, the fields it holds as typed, and what it applies to. */
export async function writeRevisionContent(
  trx: Knex.Transaction,
  revisionId: number,
  values: FixDraft,
  held: HeldFields = {},
): Promise<void> {
  await trx('revisions')
    .where({ id: revisionId })
    .update({
      title: values.title,
      body: JSON.stringify(values.body),
      symptoms: values.symptoms,
      error_codes: values.errorCodes,
      cause: values.cause,
      parts: JSON.stringify(values.parts),
      readings: JSON.stringify(values.readings),
      cautions: JSON.stringify(values.cautions),
      difficulty: values.difficulty,
      time_minutes: values.timeMinutes,
      edit_summary: values.editSummary,
      held_fields: JSON.stringify(held),
      updated_at: trx.fn.now(),
    });
  // What the draft applies to and the photos it holds are written afresh; the three old lists go in one statement
  // (an autosave comes every few seconds while a writer types, and each statement is a round trip).
  await trx.raw(
    `WITH machines AS (DELETE FROM revision_machines WHERE revision_id = :id),
          chassis AS (DELETE FROM revision_chassis WHERE revision_id = :id)
     DELETE FROM revision_photos WHERE revision_id = :id`,
    { id: revisionId },
  );
  const unique = (ids: number[]) => [...new Set(ids)];
  if (values.machineIds.length)
    await trx('revision_machines').insert(unique(values.machineIds).map((machine_id) => ({ revision_id: revisionId, machine_id })));
  if (values.chassisIds.length)
    await trx('revision_chassis').insert(
      unique(values.chassisIds).map((chassis_family_id) => ({ revision_id: revisionId, chassis_family_id })),
    );
  if (values.photoIds.length)
    await trx('revision_photos').insert(
      unique(values.photoIds).map((photo_id, position) => ({ revision_id: revisionId, photo_id, position })),
    );
}

/** Inserts an empty draft revision numbered after every revision of the fix (the fix row is locked meanwhile). */
export async function insertDraftRow(
  trx: Knex.Transaction,
  fields: { fixId: number; authorId: number; baseRevisionId: number | null; amendsRevisionId: number | null },
): Promise<number> {
  await trx('fixes').where({ id: fields.fixId }).forUpdate().first('id');
  const top = await trx('revisions').where({ fix_id: fields.fixId }).max<{ n: number | null }[]>('number as n').first();
  const [{ id }] = await trx('revisions')
    .insert({
      fix_id: fields.fixId,
      number: (top?.n ?? 0) + 1,
      parent_revision_id: fields.baseRevisionId,
      amends_revision_id: fields.amendsRevisionId,
      author_id: fields.authorId,
      title: '',
      body: JSON.stringify({ type: 'doc', content: [] }),
      state: 'draft',
    })
    .returning('id');
  return id;
}

function isOneDraftViolation(error: unknown): boolean {
  const e = error as { code?: string; constraint?: string };
  return e.code === '23505' && e.constraint === 'revisions_one_draft_idx';
}

export interface CreateDraftInput {
  /** The live fix being edited; absent for a new fix. */
  fixId?: number | null;
  values: unknown;
}

/** Creates the writer's draft: of a new fix (and the fix row that holds it), or of a live fix on top of its live revision. */
export async function createDraft(writer: Writer, input: CreateDraftInput): Promise<Outcome<DraftSaved>> {
  const values = parseDraftValues(input.values);
  if (!values.ok) return values;
  const knex = db();
  const refs = await checkReferences(knex, writer, values.value.values);
  if (refs) return refuse('bad_request', 'Some fields of the draft are not valid; nothing was saved.', refs);
  let revisionId: number;
  try {
    const created = await knex.transaction(async (trx): Promise<Outcome<number>> => {
      let fixId = input.fixId ?? null;
      let baseRevisionId: number | null = null;
      if (fixId !== null) {
        const fix = await trx('fixes').where({ id: fixId }).whereNull('deleted_at').first('id', 'current_revision_id', 'locked_at');
        if (!fix?.current_revision_id) return refuse('not_found', 'There is no such fix to edit.');
        if (!can(writer, 'write_fix', { locked: fix.locked_at !== null }))
          return refuse('forbidden', 'This fix is locked by a moderator and takes no new revisions for now.');
        baseRevisionId = fix.current_revision_id;
      } else {
        const [row] = await trx('fixes')
          .insert({ slug: `draft-${randomBytes(6).toString('hex')}`, created_by: writer.id })
          .returning('id');
        fixId = row.id as number;
      }
      const id = await insertDraftRow(trx, { fixId, authorId: writer.id, baseRevisionId, amendsRevisionId: null });
      await writeRevisionContent(trx, id, values.value.values, values.value.held);
      return succeed(id);
    });
    if (!created.ok) return created;
    revisionId = created.value;
  } catch (error) {
    if (isOneDraftViolation(error))
      return refuse('conflict', 'You already have a draft of this fix; it was opened instead of starting another.');
    throw error;
  }
  return saved(knex, revisionId);
}

async function saved(knex: Knex, revisionId: number): Promise<Outcome<DraftSaved>> {
  const revision = await loadRevision(knex, revisionId);
  if (!revision) return refuse('not_found', 'The draft disappeared while it was saved.');
  return succeed({ revision, baseIsStale: revision.baseRevisionId !== revision.liveRevisionId });
}

/**
 * The writer's own draft, or why it cannot be changed. `lock` (inside a transaction) holds the revision row until it
 * ends, read in the same statement, so a save or a submission of the same draft waits its turn.
 */
export async function ownDraft(
  knex: Knex,
  writer: Writer,
  revisionId: number,
  options: { lock?: boolean } = {},
): Promise<Outcome<{ id: number; fixId: number; parentId: number | null }>> {
  const query = knex('revisions').where({ id: revisionId });
  if (options.lock) void query.forUpdate();
  const row = await query.first('id', 'fix_id', 'author_id', 'state', 'parent_revision_id');
  if (!row || row.author_id !== writer.id) return refuse('not_found', 'There is no such draft among yours.');
  if (row.state !== 'draft')
    return refuse(
      'conflict',
      `This revision is ${row.state} and can no longer change. Your text is still in this browser; start a new revision to carry it on.`,
    );
  return succeed({ id: row.id, fixId: row.fix_id, parentId: row.parent_revision_id });
}

/**
 * Saves the writer's draft in place. `baseRevisionId` may move the base to the fix's live revision only: that is how
 * a writer carries their text over after the fix changed under them.
 */
export async function saveDraft(
  writer: Writer,
  revisionId: number,
  input: { values: unknown; baseRevisionId?: number | null },
): Promise<Outcome<DraftSaved>> {
  const values = parseDraftValues(input.values);
  if (!values.ok) return values;
  const knex = db();
  const refs = await checkReferences(knex, writer, values.value.values);
  if (refs) return refuse('bad_request', 'Some fields of the draft are not valid; nothing was saved.', refs);
  const outcome = await knex.transaction(async (trx): Promise<Outcome<null>> => {
    const draft = await ownDraft(trx, writer, revisionId, { lock: true });
    if (!draft.ok) return draft;
    if (input.baseRevisionId !== undefined && input.baseRevisionId !== draft.value.parentId) {
      const fix = await trx('fixes').where({ id: draft.value.fixId }).first('current_revision_id');
      if (input.baseRevisionId !== fix?.current_revision_id)
        return refuse('conflict', 'A draft can only be moved onto the live revision of its fix.');
      await trx('revisions').where({ id: revisionId }).update({ parent_revision_id: input.baseRevisionId });
    }
    await writeRevisionContent(trx, revisionId, values.value.values, values.value.held);
    return succeed(null);
  });
  if (!outcome.ok) return outcome;
  return saved(knex, revisionId);
}

/** Gives up a draft, however empty: it is kept, withdrawn, so nothing is ever deleted. */
export async function discardDraft(writer: Writer, revisionId: number): Promise<Outcome<null>> {
  const knex = db();
  const draft = await ownDraft(knex, writer, revisionId);
  if (!draft.ok) return draft;
  await knex('revisions')
    .where({ id: revisionId })
    .update({ state: 'withdrawn', withdrawn_at: knex.fn.now(), proof_note: 'Discarded by its author.' });
  return succeed(null);
}

/** The writer's open draft of a fix, if any: the editor resumes it instead of starting from the live text. */
export async function openDraftOf(writer: Writer, fixId: number): Promise<RevisionRecord | null> {
  const knex = db();
  const row = await knex('revisions').where({ fix_id: fixId, author_id: writer.id, state: 'draft' }).first('id');
  return row ? loadRevision(knex, row.id) : null;
}
