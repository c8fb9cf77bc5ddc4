// Where a revision is opened for writing: the live fix's edit page, or the new-fix page with its draft.
import type { RevisionRecord } from './revisions';

export function editorPath(revision: Pick<RevisionRecord, 'id' | 'fixSlug'>): string {
  return revision.fixSlug ? `/fixes/${revision.fixSlug}/edit` : `/write?draft=${revision.id}`;
}
