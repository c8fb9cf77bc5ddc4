// Where a revision is opened for writing: the live fix's edit page, or the new-fix page with its draft.
import type { RevisionRecord } from './revisions';

export function editorPath(revision: Pick<RevisionRecord, 'id' | 'fixSlug'>): string {
  return revision.fixSlug ? `/fixes/${revision.fixSlug}/edit` : `/write?draft=${revision.id}`;
}

/** Only our own paths are followed after a form post, never another site. */
export function safeBack(value: unknown, fallback: string): string {
  return typeof value === 'string' && /^\/(?!\/)[\w\-./?=&%#]*$/.test(value) ? value : fallback;
}
