// The history of a fix as one reader may see it: every revision past draft, newest first, filtered by who asks.
import type { Actor } from '@/lib/permissions';
import { mayReadRevision } from '@/lib/revision-visibility';
import type { RevisionState } from '@/lib/schemas/revision';
import { db } from '../core/db';

export interface HistoryEntry {
  id: number;
  number: number;
  state: Exclude<RevisionState, 'draft'>;
  authorId: number;
  authorName: string;
  /** The moderator who proofed or returned it; null while it waits, and for a withdrawn one. */
  prooferName: string | null;
  /** The proofer's note (required when returned), or why it was withdrawn. */
  proofNote: string | null;
  editSummary: string;
  submittedAt: Date | null;
  /** When it was proofed, returned or withdrawn; null while it waits. */
  decidedAt: Date | null;
}

interface HistoryRow {
  id: number;
  number: number;
  state: RevisionState;
  author_id: number;
  author_name: string | null;
  proofer_name: string | null;
  proof_note: string | null;
  edit_summary: string;
  submitted_at: Date | null;
  proofed_at: Date | null;
  returned_at: Date | null;
  withdrawn_at: Date | null;
}

const decidedAtOf = (row: HistoryRow): Date | null =>
  row.state === 'proofed'
    ? row.proofed_at
    : row.state === 'returned'
      ? row.returned_at
      : row.state === 'withdrawn'
        ? row.withdrawn_at
        : null;

/** The revisions of a fix this reader may see: proofed ones for everyone, the others for their author and moderators. */
export async function fixHistory(fixId: number, viewer: Actor): Promise<HistoryEntry[]> {
  const rows: HistoryRow[] = await db()('revisions as r')
    .join('users as a', 'a.id', 'r.author_id')
    .leftJoin('users as p', 'p.id', 'r.proofer_id')
    .where('r.fix_id', fixId)
    .whereNot('r.state', 'draft')
    .orderBy('r.number', 'desc')
    .select(
      'r.id',
      'r.number',
      'r.state',
      'r.author_id',
      'a.name as author_name',
      'p.name as proofer_name',
      'r.proof_note',
      'r.edit_summary',
      'r.submitted_at',
      'r.proofed_at',
      'r.returned_at',
      'r.withdrawn_at',
    );
  return rows
    .filter((row) => mayReadRevision(viewer, { state: row.state, authorId: row.author_id, submittedAt: row.submitted_at }))
    .map((row) => ({
      id: row.id,
      number: row.number,
      state: row.state as HistoryEntry['state'],
      authorId: row.author_id,
      authorName: row.author_name ?? 'a former member',
      prooferName: row.proofer_name,
      proofNote: row.proof_note,
      editSummary: row.edit_summary,
      submittedAt: row.submitted_at,
      decidedAt: decidedAtOf(row),
    }));
}
