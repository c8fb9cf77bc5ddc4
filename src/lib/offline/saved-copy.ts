// The line a page served from this device's saved copies carries.

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** Why the saved copy was shown: no connection at all, or one too slow to answer in time. */
export type SavedCopyReason = 'offline' | 'slow';

const why: Record<SavedCopyReason, string> = {
  offline: 'you are offline.',
  slow: 'the connection is slow, so this may be out of date.',
};

/**
 * "Saved copy from 2 December 2026 at 16:04; you are offline." or "…; the connection is slow, so this may be out of
 * date." — the date in the reader's own time zone.
 */
export function savedCopyLine(savedAt: Date | null, reason: SavedCopyReason = 'offline'): string {
  if (savedAt === null || Number.isNaN(savedAt.getTime())) return `Saved copy; ${why[reason]}`;
  return `Saved copy from ${when.format(savedAt)}; ${why[reason]}`;
}
