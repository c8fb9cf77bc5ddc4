// The line a page served from this device's saved copies carries.

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', hour: '2-digit', minute: '2-digit' });

/** "Saved copy from 2 December 2026 at 16:04; you are offline." — the date in the reader's own time zone. */
export function savedCopyLine(savedAt: Date | null): string {
  if (savedAt === null || Number.isNaN(savedAt.getTime())) return 'Saved copy; you are offline.';
  return `Saved copy from ${when.format(savedAt)}; you are offline.`;
}
