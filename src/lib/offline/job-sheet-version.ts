// The job sheet's version on the wire, and which fields a posted job sheet form actually carried.

/**
 * `If-Match: "v3"` (or W/"v3") names version 3; no header means "write whatever the sheet is now";
 * anything else is unreadable, and the caller says how to write it.
 */
export function versionFromIfMatch(header: string | null): number | undefined | 'unreadable' {
  if (header === null || header.trim() === '') return undefined;
  const match = /^(?:W\/)?"v([1-9]\d{0,9})"$/.exec(header.trim());
  return match ? Number(match[1]) : 'unreadable';
}

export function ifMatchFor(version: number): string {
  return `"v${version}"`;
}

/**
 * A form read into the job sheet's shape fills every field (blank when absent); a PATCH from a form changes only the
 * fields the form sent, so a field the technician chose to leave as the other device wrote it stays untouched.
 */
export function presentFormFields(sheet: Record<string, unknown>, sentNames: readonly string[]): Record<string, unknown> {
  const sent = new Set(sentNames.map((name) => (name.startsWith('parts.') ? 'partsUsed' : name)));
  return Object.fromEntries(Object.entries(sheet).filter(([field]) => sent.has(field)));
}
