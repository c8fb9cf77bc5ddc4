// Drafts: the one open revision a writer keeps per fix, created on the first save and saved in place until submitted.
import { randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { can } from '@/lib/permissions';
import { splitDraft, type FixDraft, type HeldFields } from '@/lib/schemas/fix-draft';
import { db } from '../core/db';
import { refuse, succeed, type Outcome, type Writer } from '../http/result';
import { loadRevision, revisionColumns, revisionJoins, toRevisionRecord, type LinkSources, type RevisionRecord } from './revisions';

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

/** The machines, chassis families and photos a draft names, each id once (a repeated id keeps its first place). */
interface DraftLinks {
  machines: number[];
  chassis: number[];
  photos: number[];
}

function linksOf(values: FixDraft): DraftLinks {
  const unique = (ids: number[]) => [...new Set(ids)];
  return { machines: unique(values.machineIds), chassis: unique(values.chassisIds), photos: unique(values.photoIds) };
}

/**
 * Whether a draft may name what it names, as one row: every machine and chassis family is in the catalogue, and
 * every photo is the writer's own or already public (on a revision past draft). Takes :machines, :chassis, :photos
 * (each id once) and :writer.
 */
const referencesSql = `
  SELECT (SELECT count(*) FROM machines WHERE id = ANY (CAST(:machines AS int[])) AND deleted_at IS NULL)
           = cardinality(CAST(:machines AS int[])) AS machines_ok,
         (SELECT count(*) FROM chassis_families WHERE id = ANY (CAST(:chassis AS int[])) AND deleted_at IS NULL)
           = cardinality(CAST(:chassis AS int[])) AS chassis_ok,
         (SELECT count(*) FROM photos p
           WHERE p.id = ANY (CAST(:photos AS int[])) AND p.deleted_at IS NULL
             AND (p.owner_id = :writer OR EXISTS (
                   SELECT 1 FROM revision_photos rp JOIN revisions r ON r.id = rp.revision_id
                    WHERE rp.photo_id = p.id AND r.state <> 'draft')))
           = cardinality(CAST(:photos AS int[])) AS photos_ok`;

interface ReferencesRow {
  machines_ok: boolean;
  chassis_ok: boolean;
  photos_ok: boolean;
}

/** What the writer is told for each reference that failed its check; null when every one passed. */
function refusedReferences(row: ReferencesRow): Record<string, string[]> | null {
  const fields: Record<string, string[]> = {};
  if (!row.machines_ok) fields.machineIds = ['One of the machines is not in the catalogue (any more); pick it again.'];
  if (!row.chassis_ok) fields.chassisIds = ['One of the chassis families is not in the catalogue (any more); pick it again.'];
  if (!row.photos_ok) fields.photoIds = ['One of the photos is not yours or no longer exists; upload it again.'];
  return Object.keys(fields).length ? fields : null;
}

async function checkReferences(knex: Knex, writer: Writer, values: FixDraft): Promise<Record<string, string[]> | null> {
  const result = await knex
    .raw<{ rows: ReferencesRow[] }>(`WITH refs AS (${referencesSql}) SELECT * FROM refs`, { ...linksOf(values), writer: writer.id })
    .options({ name: 'draft-references' });
  return refusedReferences(result.rows[0]!);
}

/** The link lists that are plain sets (photos also keep an order): binding name, table, column. */
const plainLinks = [
  ['machines', 'revision_machines', 'machine_id'],
  ['chassis', 'revision_chassis', 'chassis_family_id'],
] as const;

/**
 * What a draft applies to and the photos it holds, brought to the given lists, as statements of a WITH clause for the
 * revision `idSql` names: links no longer listed are removed, new ones added, a photo that moved gets its new
 * position, and links that stay are not touched (an autosave comes every few seconds while a writer types). Every
 * part works on rows the others leave alone, so their order inside the statement does not matter. Takes :machines,
 * :chassis and :photos (each id once).
 */
function linksSql(idSql: string): string {
  const plain = plainLinks.map(
    ([list, table, column]) => `
    ${list}_out AS (
      DELETE FROM ${table}
       WHERE revision_id IN (${idSql}) AND ${column} <> ALL (CAST(:${list} AS int[]))),
    ${list}_in AS (
      INSERT INTO ${table} (revision_id, ${column})
      SELECT rev.id, x FROM (${idSql}) AS rev (id), unnest(CAST(:${list} AS int[])) AS x
      ON CONFLICT DO NOTHING),`,
  );
  return `${plain.join('')}
    photos_out AS (
      DELETE FROM revision_photos
       WHERE revision_id IN (${idSql}) AND photo_id <> ALL (CAST(:photos AS int[]))),
    photos_in AS (
      INSERT INTO revision_photos (revision_id, photo_id, position)
      SELECT rev.id, p, o - 1 FROM (${idSql}) AS rev (id), unnest(CAST(:photos AS int[])) WITH ORDINALITY AS t (p, o)
      ON CONFLICT (revision_id, photo_id) DO UPDATE SET position = EXCLUDED.position
      WHERE revision_photos.position <> EXCLUDED.position)`;
}

/** A draft's columns as the writer's values and the fields it holds as typed set them. */
function contentColumns(values: FixDraft, held: HeldFields) {
  return {
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
  };
}

/**
 * Writes a draft's content, the fields it holds as typed, and what it applies to, inside a transaction that holds the
 * revision (just inserted, or locked): the links statement then sees every save committed before it.
 */
export async function writeRevisionContent(
  trx: Knex.Transaction,
  revisionId: number,
  values: FixDraft,
  held: HeldFields = {},
): Promise<void> {
  await trx('revisions')
    .where({ id: revisionId })
    .update({ ...contentColumns(values, held), updated_at: trx.fn.now() });
  await trx.raw(`WITH ${linksSql('SELECT CAST(:id AS int)')} SELECT 1`, { id: revisionId, ...linksOf(values) });
}

/**
 * An autosave in one statement, with no transaction around it: the references are checked, the row is written only
 * while it is the writer's draft and all references pass, the links follow, and the answer is the revision as saved. The statement sees the database as
 * it was when it began; a save of the same draft that committed after that (another window) would leave links this
 * statement cannot see, so the row is written only if it is still the version the statement began with (its xmin):
 * otherwise nothing is written and `saved` is false with the row still an open draft, and the caller runs it again.
 */
const autosaveSql = (columns: string[]) => `
  WITH seen AS (SELECT author_id, state, xmin AS version FROM revisions WHERE id = :id),
       refs AS (${referencesSql}),
       saved AS (
         UPDATE revisions r SET ${columns.map((c) => `${c} = :${c}`).join(', ')}, updated_at = now()
           FROM seen, refs
          WHERE r.id = :id AND r.author_id = :writer AND r.state = 'draft' AND r.xmin = seen.version
            AND refs.machines_ok AND refs.chassis_ok AND refs.photos_ok
         RETURNING r.*),
       ${linksSql('SELECT id FROM saved')}
  SELECT refs.*, seen.author_id AS seen_author, seen.state AS seen_state, EXISTS (SELECT 1 FROM saved) AS saved, answer.*
    FROM refs LEFT JOIN seen ON true
    LEFT JOIN (SELECT ${revisionColumns(writtenLinks)} FROM saved r ${revisionJoins}) AS answer ON true`;

/** The lists the autosave writes, as `revisionColumns` reads links: its answer is the revision as saved. */
const writtenLinks: LinkSources = {
  machines: 'SELECT m AS id FROM unnest(CAST(:machines AS int[])) AS m',
  chassis: 'SELECT c AS id FROM unnest(CAST(:chassis AS int[])) AS c',
  photos: 'SELECT p AS id, o AS place FROM unnest(CAST(:photos AS int[])) WITH ORDINALITY AS t (p, o)',
};

interface AutosaveRow extends ReferencesRow {
  seen_author: number | null;
  seen_state: string | null;
  saved: boolean;
  /** The revision as saved, a row of `revisionColumns` (null when nothing was saved). */
  id: number | null;
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
  return draftRefusal(row, writer) ?? succeed({ id: row.id, fixId: row.fix_id, parentId: row.parent_revision_id });
}

/** Why a revision row cannot be changed by this writer as their draft, or null when it can. */
function draftRefusal(row: { author_id: number; state: string } | undefined, writer: Writer): Outcome<never> | null {
  if (!row || row.author_id !== writer.id) return refuse('not_found', 'There is no such draft among yours.');
  if (row.state !== 'draft')
    return refuse(
      'conflict',
      `This revision is ${row.state} and can no longer change. Your text is still in this browser; start a new revision to carry it on.`,
    );
  return null;
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
  if (input.baseRevisionId !== undefined) return moveAndSave(knex, writer, revisionId, input.baseRevisionId, values.value);
  const columns = contentColumns(values.value.values, values.value.held);
  const sql = autosaveSql(Object.keys(columns)); // the same text every time: PostgreSQL plans it once per connection
  const bindings = { id: revisionId, writer: writer.id, ...linksOf(values.value.values), ...columns };
  // A second try only follows a save of the same draft from elsewhere in the same moment; a third is rarer still.
  for (let attempt = 0; attempt < 3; attempt++) {
    const result = await knex.raw<{ rows: AutosaveRow[] }>(sql, bindings).options({ name: 'draft-autosave' });
    const row = result.rows[0]!;
    const refused = refusedReferences(row);
    if (refused) return refuse('bad_request', 'Some fields of the draft are not valid; nothing was saved.', refused);
    if (row.saved) {
      if (row.id === null) return refuse('not_found', 'The draft disappeared while it was saved.');
      const revision = toRevisionRecord(row);
      return succeed({ revision, baseIsStale: revision.baseRevisionId !== revision.liveRevisionId });
    }
    const why = draftRefusal(row.seen_author === null ? undefined : { author_id: row.seen_author, state: row.seen_state! }, writer);
    if (why) return why;
  }
  return refuse('conflict', 'This draft was being saved from another window at the same moment; nothing was saved. Save again.');
}

/** Moves a draft onto the fix's live revision (how a writer carries their text over) and saves it, in one transaction. */
async function moveAndSave(
  knex: Knex,
  writer: Writer,
  revisionId: number,
  baseRevisionId: number | null,
  content: DraftContent,
): Promise<Outcome<DraftSaved>> {
  const refs = await checkReferences(knex, writer, content.values);
  if (refs) return refuse('bad_request', 'Some fields of the draft are not valid; nothing was saved.', refs);
  const outcome = await knex.transaction(async (trx): Promise<Outcome<null>> => {
    const draft = await ownDraft(trx, writer, revisionId, { lock: true });
    if (!draft.ok) return draft;
    if (baseRevisionId !== draft.value.parentId) {
      const fix = await trx('fixes').where({ id: draft.value.fixId }).first('current_revision_id');
      if (baseRevisionId !== fix?.current_revision_id)
        return refuse('conflict', 'A draft can only be moved onto the live revision of its fix.');
      await trx('revisions').where({ id: revisionId }).update({ parent_revision_id: baseRevisionId });
    }
    await writeRevisionContent(trx, revisionId, content.values, content.held);
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
