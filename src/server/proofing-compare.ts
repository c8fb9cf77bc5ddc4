// Comparisons of revisions: a waiting revision against the live one (the desk), any two proofed ones (the compare page).
import { comparableFrom, diffRevisions, emptyComparable, type ComparableRevision, type RevisionDiff } from '@/lib/diff';
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

/** Two proofed revisions of one fix by number, in the order given; null when either is not a proofed revision. */
export async function compareProofed(fixId: number, numberA: number, numberB: number): Promise<Comparison | null> {
  const knex = db();
  const [idA, idB] = await Promise.all([revisionIdByNumber(knex, fixId, numberA), revisionIdByNumber(knex, fixId, numberB)]);
  if (!idA || !idB) return null;
  const [a, b] = await Promise.all([loadRevision(knex, idA), loadRevision(knex, idB)]);
  if (!a || !b || a.state !== 'proofed' || b.state !== 'proofed') return null;
  return { a, b, diff: diffRevisions(comparableOf(a), comparableOf(b)) };
}
