// The one long date format of the site ("2 December 2026", UTC). One formatter for the process: building an
// Intl formatter per call (what toLocaleDateString does) was a measurable part of rendering a fix page.
const longDateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/** "2 December 2026"; an empty string for no date. */
export function longDate(date: Date | null): string {
  return date ? longDateFormat.format(date) : '';
}
