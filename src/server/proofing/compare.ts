// Comparisons of revisions: a waiting revision against the live one (the desk), any two past draft (the compare page).
import { comparableFrom, diffRevisions, emptyComparable, type ComparableRevision, type RevisionDiff } from '@/lib/diff';
import type { Actor } from '@/lib/permissions';
import { mayReadRevision } from '@/lib/revision-visibility';
import { db } from '../core/db';
import { loadRevision, revisionIdByNumber, type RevisionRecord } from '../writing/revisions';

export function comparableOf(record: RevisionRecord): ComparableRevision {
  return comparableFrom(record);
}

export interface Review {
  revision: RevisionRecord;
  /** The live revision it is compared with; null for a new fix. */
  live: RevisionRecord | null;
  diff: RevisionDiff;
  /**
   * The revision this one continues (a returned one its author answers, or a waiting one amended) with the diff from
   * it, so the moderator sees whether the changes asked for were made; null when it continues none.
   */
  answers: { revision: RevisionRecord; diff: RevisionDiff } | null;
}

/** A revision on the desk with its diff against the fix's live revision and against the revision it answers. */
export async function reviewOf(revisionId: number): Promise<Review | null> {
  const knex = db();
  const revision = await loadRevision(knex, revisionId);
  if (!revision) return null;
  const [live, earlier] = await Promise.all([
    revision.liveRevisionId ? loadRevision(knex, revision.liveRevisionId) : null,
    revision.amendsRevisionId ? loadRevision(knex, revision.amendsRevisionId) : null,
  ]);
  return {
    revision,
    live,
    diff: diffRevisions(live ? comparableOf(live) : emptyComparable, comparableOf(revision)),
    answers: earlier ? { revision: earlier, diff: diffRevisions(comparableOf(earlier), comparableOf(revision)) } : null,
  };
}

export interface Comparison {
  a: RevisionRecord;
  b: RevisionRecord;
  diff: RevisionDiff;
}

/**
 * Two revisions of one fix by number, in the order given; null when either is a draft, is not there, or is not
 * proofed and the viewer is neither its author nor a moderator (the page answers 404 alike, so nothing leaks).
 */
export async function compareRevisions(fixId: number, numberA: number, numberB: number, viewer: Actor): Promise<Comparison | null> {
  const knex = db();
  const [idA, idB] = await Promise.all([revisionIdByNumber(knex, fixId, numberA), revisionIdByNumber(knex, fixId, numberB)]);
  if (!idA || !idB) return null;
  const [a, b] = await Promise.all([loadRevision(knex, idA), loadRevision(knex, idB)]);
  if (!a || !b || !mayReadRevision(viewer, a) || !mayReadRevision(viewer, b)) return null;
  return { a, b, diff: diffRevisions(comparableOf(a), comparableOf(b)) };
}
