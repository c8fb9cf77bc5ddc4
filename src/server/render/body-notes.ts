// The cautions and readings a fix body carries in its remedy, so the page can show each of them once.
import { sanitiseBody, type BodyNode } from '@/lib/tiptap/allowlist';
import { isCautionKind, type CautionKind } from '@/lib/tiptap/nodes/caution-kind';
import { readingAttrsOf, type ReadingAttrs } from '@/lib/tiptap/nodes/reading';

export interface BodyCaution {
  kind: CautionKind;
  /** The caution's own words, paragraphs joined by blank lines. */
  text: string;
}

export interface BodyNotes {
  cautions: BodyCaution[];
  readings: ReadingAttrs[];
}

function textOf(node: BodyNode): string {
  if (node.text !== undefined) return node.text;
  const inner = (node.content ?? []).map(textOf);
  return node.type === 'doc' || node.type === 'caution' ? inner.filter((t) => t.trim() !== '').join('\n\n') : inner.join('');
}

/** Cautions and readings in the order the body has them; an unreadable body has none. */
export function bodyNotes(json: unknown): BodyNotes {
  const notes: BodyNotes = { cautions: [], readings: [] };
  const sanitised = sanitiseBody(json);
  if ('error' in sanitised) return notes;
  const visit = (node: BodyNode): void => {
    const kind = node.attrs?.kind;
    if (node.type === 'caution' && isCautionKind(kind)) {
      notes.cautions.push({ kind, text: textOf(node).trim() });
      return;
    }
    if (node.type === 'reading') {
      notes.readings.push(readingAttrsOf(node.attrs));
      return;
    }
    for (const child of node.content ?? []) visit(child);
  };
  visit(sanitised.doc);
  return notes;
}

const squeeze = (text: string): string => text.replace(/\s+/g, ' ').trim().toLowerCase();

/** Whether two readings are the same measurement (same test point and expected value, spacing and case aside). */
export function sameReading(a: Pick<ReadingAttrs, 'testPoint' | 'expected'>, b: Pick<ReadingAttrs, 'testPoint' | 'expected'>): boolean {
  return squeeze(a.testPoint) === squeeze(b.testPoint) && squeeze(a.expected) === squeeze(b.expected);
}

/** Whether a caution's words already say what another's do (so the page shows them once). */
export function sameWords(a: string, b: string): boolean {
  return squeeze(a) === squeeze(b);
}
