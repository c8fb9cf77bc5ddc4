// Which revisions of a fix a reader may see in its history and compare: proofed ones by anyone, the rest past draft by their author and moderators.
import { can, type Actor } from './permissions';
import type { RevisionState } from './schemas/revision';

export interface RevisionFacts {
  state: RevisionState;
  authorId: number;
  /** When it went to proofing; null for a revision that never did. */
  submittedAt: Date | string | null;
}

/**
 * True once a revision has been sent for proofing. A discarded draft is kept as "withdrawn" but was never
 * submitted: it stays as private as a draft.
 */
export function isPastDraft(revision: Pick<RevisionFacts, 'state' | 'submittedAt'>): boolean {
  if (revision.state === 'draft') return false;
  if (revision.state === 'withdrawn') return revision.submittedAt !== null;
  return true;
}

/** May this reader see the revision in the history and compare it? */
export function mayReadRevision(viewer: Actor, revision: RevisionFacts): boolean {
  if (!isPastDraft(revision)) return false;
  if (revision.state === 'proofed') return can(viewer, 'read');
  return can(viewer, 'read_unproofed_revision', { authorId: revision.authorId });
}
