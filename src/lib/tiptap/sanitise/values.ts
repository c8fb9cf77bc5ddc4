// Readers for single attribute values: bounded strings and clamped integers.

/** C0/C1 control characters other than tab and newline. */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL_CHARACTERS = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/g;

export function withoutControlCharacters(text: string): string {
  return text.replace(CONTROL_CHARACTERS, '');
}

/** A string attribute: strings and finite numbers are accepted, control characters removed, length capped. */
export function boundedString(value: unknown, maxLength: number, label: string, note: (message: string) => void): string {
  if (value === undefined || value === null) return '';
  if (typeof value !== 'string' && !(typeof value === 'number' && Number.isFinite(value))) {
    note(`${label}: not text, left empty`);
    return '';
  }
  const text = withoutControlCharacters(String(value)).trim();
  if (text.length <= maxLength) return text;
  note(`${label}: shortened to ${maxLength} characters`);
  return text.slice(0, maxLength);
}

/** An integer attribute clamped into [min, max]; missing or unreadable values take the fallback. */
export function clampedInteger(
  value: unknown,
  range: { min: number; max: number; fallback: number },
  label: string,
  note: (message: string) => void,
): number {
  if (value === undefined || value === null) return range.fallback;
  const parsed = typeof value === 'number' ? value : typeof value === 'string' ? Number(value) : Number.NaN;
  if (!Number.isFinite(parsed)) {
    note(`${label}: not a number, set to ${range.fallback}`);
    return range.fallback;
  }
  const clamped = Math.min(range.max, Math.max(range.min, Math.trunc(parsed)));
  if (clamped !== parsed) note(`${label}: ${String(parsed)} changed to ${clamped}`);
  return clamped;
}
