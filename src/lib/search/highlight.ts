// Highlighted text that is safe to put in a page: everything escaped, only <mark> added by us.

/** Markers an engine puts around matched words; control characters no fix text contains after cleaning. */
export const MARK_START = '\u0002';
export const MARK_END = '\u0003';

const escapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => escapes[c] ?? c);
}

/**
 * Turns engine output with MARK_START/MARK_END around matches into HTML with <mark>. The text is
 * escaped first, stray or nested markers are dropped, and no other tag can ever come out.
 */
export function markedHtml(marked: string): string {
  let html = '';
  let open = false;
  // eslint-disable-next-line no-control-regex -- the markers are control characters on purpose
  for (const part of marked.split(/([\u0002\u0003])/)) {
    if (part === MARK_START) {
      if (!open) html += '<mark>';
      open = true;
    } else if (part === MARK_END) {
      if (open) html += '</mark>';
      open = false;
    } else {
      // eslint-disable-next-line no-control-regex -- other control characters are dropped from the text
      html += escapeHtml(part.replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, ''));
    }
  }
  return open ? `${html}</mark>` : html;
}

/** Removes the markers from text that will be used as plain text. */
export function stripMarks(text: string): string {
  // eslint-disable-next-line no-control-regex -- the markers are control characters on purpose
  return text.replace(/[\u0002\u0003]/g, '');
}
