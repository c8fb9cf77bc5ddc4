// Revisions as the writing side reads them: full content with labels, for the editor, the desk and comparisons.
import type { Knex } from 'knex';
import type { FixDraft, HeldFields } from '@/lib/schemas/fix-draft';
import type { RevisionState } from '@/lib/schemas/revision';
import type { BodyDoc } from '@/lib/tiptap/allowlist';
import { photoRefColumns, toPhotoRef, type PhotoRef, type PhotoRow } from '../photos/photo-refs';

export interface LabelledRef {
  id: number;
  /** The catalogue address, so the editor can ask about the machine or family (e.g. for similar fixes). */
  slug: string;
  label: string;
}

/** A revision with everything the editor, the proofing desk and the compare page need. */
export interface RevisionRecord {
  id: number;
  number: number;
  state: RevisionState;
  fixId: number;
  /** The fix's public address; null while the fix has never been proofed (its first revision is in the works). */
  fixSlug: string | null;
  liveRevisionId: number | null;
  fixLocked: boolean;
  fixHidden: boolean;
  baseRevisionId: number | null;
  baseRevisionNumber: number | null;
  amendsRevisionId: number | null;
  authorId: number;
  authorName: string;
  prooferName: string | null;
  note: string | null;
  createdAt: string;
  updatedAt: string;
  submittedAt: string | null;
  proofedAt: string | null;
  values: FixDraft;
  /** Fields a draft holds as typed until they pass their checks (always empty past draft). */
  held: HeldFields;
  machines: LabelledRef[];
  chassis: LabelledRef[];
  photos: PhotoRef[];
}

const iso = (d: Date | null): string | null => (d ? new Date(d).toISOString() : null);

/**
 * What a revision applies to and its photos, as JSON arrays beside its row, so a revision loads in one query (the
 * editor's autosave answers with it every few seconds). Labels read as writers read them: "Orvane DR-410 (PAL)",
 * "Orvane deck mechanism DM-3".
 */
const linkedColumns = `
  COALESCE((SELECT json_agg(json_build_object('id', m.id, 'slug', m.slug,
                   'label', mk.name || ' ' || m.model_number || ' (' || m.region || ')')
                   ORDER BY mk.name, m.model_number, m.region)
              FROM revision_machines rm JOIN machines m ON m.id = rm.machine_id JOIN makers mk ON mk.id = m.maker_id
             WHERE rm.revision_id = r.id), '[]') AS linked_machines,
  COALESCE((SELECT json_agg(json_build_object('id', c.id, 'slug', c.slug, 'label', c.name || ' ' || c.code) ORDER BY c.name)
              FROM revision_chassis rc JOIN chassis_families c ON c.id = rc.chassis_family_id
             WHERE rc.revision_id = r.id), '[]') AS linked_chassis,
  COALESCE((SELECT json_agg(json_build_object(${photoRefColumns.map((c) => `'${c.slice(2)}', ${c}`).join(', ')}) ORDER BY rp.position)
              FROM revision_photos rp JOIN photos p ON p.id = rp.photo_id
             WHERE rp.revision_id = r.id AND p.deleted_at IS NULL), '[]') AS linked_photos`;

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a raw revisions row from Knex
function valuesOf(row: Record<string, any>, machineIds: number[], chassisIds: number[], photoIds: number[]): FixDraft {
  return {
    title: row.title,
    symptoms: row.symptoms,
    errorCodes: row.error_codes,
    cause: row.cause,
    body: row.body as BodyDoc,
    parts: row.parts,
    readings: row.readings,
    cautions: row.cautions,
    difficulty: row.difficulty,
    timeMinutes: row.time_minutes,
    editSummary: row.edit_summary,
    machineIds,
    chassisIds,
    photoIds,
  };
}

/** Loads one revision with its fix, labels and photos; null when there is none. */
export async function loadRevision(knex: Knex, revisionId: number): Promise<RevisionRecord | null> {
  const row = await knex('revisions as r')
    .join('fixes as f', 'f.id', 'r.fix_id')
    .join('users as a', 'a.id', 'r.author_id')
    .leftJoin('users as p', 'p.id', 'r.proofer_id')
    .leftJoin('revisions as base', 'base.id', 'r.parent_revision_id')
    .where('r.id', revisionId)
    .whereNull('f.deleted_at')
    .first(
      'r.*',
      'f.slug as fix_slug',
      'f.current_revision_id',
      'f.locked_at',
      'f.hidden_at',
      'a.name as author_name',
      'p.name as proofer_name',
      'base.number as base_number',
      knex.raw(linkedColumns),
    )
    // Named: PostgreSQL keeps its plan per connection instead of planning the joins on every autosave's answer.
    .options({ name: 'load-revision' });
  if (!row) return null;
  const machines: LabelledRef[] = row.linked_machines;
  const chassis: LabelledRef[] = row.linked_chassis;
  const photos = (row.linked_photos as PhotoRow[]).map(toPhotoRef);
  return {
    id: row.id,
    number: row.number,
    state: row.state,
    fixId: row.fix_id,
    fixSlug: row.current_revision_id ? row.fix_slug : null,
    liveRevisionId: row.current_revision_id,
    fixLocked: row.locked_at !== null,
    fixHidden: row.hidden_at !== null,
    baseRevisionId: row.parent_revision_id,
    baseRevisionNumber: row.base_number ?? null,
    amendsRevisionId: row.amends_revision_id,
    authorId: row.author_id,
    authorName: row.author_name ?? 'a former member',
    prooferName: row.proofer_name,
    note: row.proof_note,
    createdAt: iso(row.created_at)!,
    updatedAt: iso(row.updated_at)!,
    submittedAt: iso(row.submitted_at),
    proofedAt: iso(row.proofed_at),
    values: valuesOf(
      row,
      machines.map((m) => m.id),
      chassis.map((c) => c.id),
      photos.map((p) => p.id),
    ),
    held: (row.held_fields ?? {}) as HeldFields,
    machines,
    chassis,
    photos,
  };
}

/** Where to tell an author about their revision; kept out of RevisionRecord, which writers and moderators are sent. */
export async function authorEmailOf(knex: Knex, authorId: number): Promise<string | null> {
  const row = await knex('users').where({ id: authorId }).whereNull('deleted_at').first('email');
  return row?.email ?? null;
}

/** The revision number of a fix by id, or null. */
export async function revisionIdByNumber(knex: Knex, fixId: number, number: number): Promise<number | null> {
  const row = await knex('revisions').where({ fix_id: fixId, number }).first('id');
  return row?.id ?? null;
}

export interface MyRevision {
  id: number;
  number: number;
  state: RevisionState;
  title: string;
  fixSlug: string | null;
  note: string | null;
  updatedAt: string;
  /** True when a later revision by the same author already continues this returned one. */
  amended: boolean;
}

/** A writer's own revisions, newest first: drafts to resume, submissions waiting, returned ones with their notes. */
export async function listMyRevisions(knex: Knex, authorId: number): Promise<MyRevision[]> {
  const rows = await knex('revisions as r')
    .join('fixes as f', 'f.id', 'r.fix_id')
    .where('r.author_id', authorId)
    .whereNull('f.deleted_at')
    .orderBy('r.updated_at', 'desc')
    .limit(200)
    .select(
      'r.id',
      'r.number',
      'r.state',
      'r.title',
      'r.proof_note',
      'r.updated_at',
      'f.slug',
      'f.current_revision_id',
      knex.raw('EXISTS (SELECT 1 FROM revisions n WHERE n.amends_revision_id = r.id AND n.author_id = r.author_id) AS amended'),
    );
  return rows.map((r) => ({
    id: r.id,
    number: r.number,
    state: r.state,
    title: r.title,
    fixSlug: r.current_revision_id ? r.slug : null,
    note: r.proof_note,
    updatedAt: iso(r.updated_at)!,
    amended: r.amended,
  }));
}
