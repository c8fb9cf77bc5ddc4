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
 * Where a revision's links are read from, as SQL giving `id` rows (photos also `place`): its link tables, or the lists
 * a statement has just written (it cannot read back its own writes).
 */
export interface LinkSources {
  machines: string;
  chassis: string;
  photos: string;
}

const storedLinks: LinkSources = {
  machines: 'SELECT machine_id AS id FROM revision_machines WHERE revision_id = r.id',
  chassis: 'SELECT chassis_family_id AS id FROM revision_chassis WHERE revision_id = r.id',
  photos: 'SELECT photo_id AS id, position AS place FROM revision_photos WHERE revision_id = r.id',
};

/**
 * The columns of a revision record for a revision row `r` (with the joins of `revisionJoins`): the row, its fix, the
 * names around it, and what it applies to and its photos as JSON arrays, so a revision loads in one query (the
 * editor's autosave answers with it every few seconds). Labels read as writers read them: "Orvane DR-410 (PAL)",
 * "Orvane deck mechanism DM-3".
 */
export function revisionColumns(links: LinkSources): string {
  return `r.*, f.slug AS fix_slug, f.current_revision_id, f.locked_at, f.hidden_at,
    a.name AS author_name, pr.name AS proofer_name, base.number AS base_number,
    COALESCE((SELECT json_agg(json_build_object('id', m.id, 'slug', m.slug,
                     'label', mk.name || ' ' || m.model_number || ' (' || m.region || ')')
                     ORDER BY mk.name, m.model_number, m.region)
                FROM (${links.machines}) AS l JOIN machines m ON m.id = l.id JOIN makers mk ON mk.id = m.maker_id), '[]')
      AS linked_machines,
    COALESCE((SELECT json_agg(json_build_object('id', c.id, 'slug', c.slug, 'label', c.name || ' ' || c.code) ORDER BY c.name)
                FROM (${links.chassis}) AS l JOIN chassis_families c ON c.id = l.id), '[]') AS linked_chassis,
    COALESCE((SELECT json_agg(json_build_object(${photoRefColumns.map((c) => `'${c.slice(2)}', ${c}`).join(', ')}) ORDER BY l.place)
                FROM (${links.photos}) AS l JOIN photos p ON p.id = l.id WHERE p.deleted_at IS NULL), '[]') AS linked_photos`;
}

/** What `revisionColumns` reads beside the revision row `r`; a revision of a deleted fix is not found. */
export const revisionJoins = `
  JOIN fixes f ON f.id = r.fix_id AND f.deleted_at IS NULL
  JOIN users a ON a.id = r.author_id
  LEFT JOIN users pr ON pr.id = r.proofer_id
  LEFT JOIN revisions base ON base.id = r.parent_revision_id`;

/** Loads one revision with its fix, labels and photos; null when there is none. */
export async function loadRevision(knex: Knex, revisionId: number): Promise<RevisionRecord | null> {
  const result = await knex
    .raw(`SELECT ${revisionColumns(storedLinks)} FROM revisions r ${revisionJoins} WHERE r.id = ?`, [revisionId])
    // Named: PostgreSQL keeps its plan per connection instead of planning the joins on every load.
    .options({ name: 'load-revision' });
  const row = result.rows[0];
  return row ? toRevisionRecord(row) : null;
}

/** A row of `revisionColumns` as the editor, the desk and the API read it. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- a raw row of revisionColumns
export function toRevisionRecord(row: Record<string, any>): RevisionRecord {
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
    values: {
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
      machineIds: machines.map((m) => m.id),
      chassisIds: chassis.map((c) => c.id),
      photoIds: photos.map((p) => p.id),
    },
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
