// Comparisons of revisions: a waiting revision against the live one (the desk), any two past draft (the compare page).
import { comparableFrom, diffRevisions, emptyComparable, type ComparableRevision, type RevisionDiff } from '@/lib/diff';
import type { Actor } from '@/lib/permissions';
import { mayReadRevision } from '@/lib/revision-visibility';
import { db } from './db';
import { loadRevision, revisionIdByNumber, type RevisionRecord } from './revisions';

export function comparableOf(record: RevisionRecord): ComparableRevision {
  return comparableFrom(record);
}

export interface Review {
  revision: RevisionRecord;
  /** The live revision it is compared with; null for a new fix. */
  live: RevisionRecord | null;
  diff: RevisionDiff;
}

/** A revision on the desk with its diff against the fix's live revision. */
export async function reviewOf(revisionId: number): Promise<Review | null> {
  const knex = db();
  const revision = await loadRevision(knex, revisionId);
  if (!revision) return null;
  const live = revision.liveRevisionId ? await loadRevision(knex, revision.liveRevisionId) : null;
  return { revision, live, diff: diffRevisions(live ? comparableOf(live) : emptyComparable, comparableOf(revision)) };
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
