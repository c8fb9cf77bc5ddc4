// Small builders so the demo fixes read as prose; they emit only the agreed Tiptap body vocabulary.
import type { Caution, CautionKind, Difficulty, PartKind, PartRow, Reading } from '@/lib/schemas/revision';
import type { DemoIllustration, DemoRevision, TiptapDoc, TiptapNode } from '../types';

/** The deference every caution carries: the fix says what to watch, the reader's codes decide how. */
const DEFERENCE: Record<CautionKind, string> = {
  mains: 'Follow your local electrical codes and licensed practice for work on mains equipment.',
  stored_charge: 'Measure the voltage, do not assume the capacitor is empty; follow your local electrical codes and licensed practice.',
  laser: 'Never look into the lens while the unit is powered; follow your local electrical codes and licensed practice.',
  heat: 'Let parts cool before you touch them; follow your local electrical codes and licensed practice.',
  sharp_edges: 'Wear cut-resistant gloves; follow your local electrical codes and licensed practice.',
  spring: 'Wear eye protection; follow your local electrical codes and licensed practice.',
};

export type Inline = string | TiptapNode;

export function bold(text: string): TiptapNode {
  return { type: 'text', text, marks: [{ type: 'bold' }] };
}
export function italic(text: string): TiptapNode {
  return { type: 'text', text, marks: [{ type: 'italic' }] };
}
export function code(text: string): TiptapNode {
  return { type: 'text', text, marks: [{ type: 'code' }] };
}

/** Plain strings may use **bold** and `code` spans; they become marked text nodes. */
function inlineNodes(parts: Inline[]): TiptapNode[] {
  const nodes: TiptapNode[] = [];
  for (const part of parts) {
    if (typeof part !== 'string') {
      nodes.push(part);
      continue;
    }
    for (const piece of part.split(/(\*\*[^*]+\*\*|`[^`]+`)/)) {
      if (piece === '') continue;
      if (piece.startsWith('**') && piece.endsWith('**')) nodes.push(bold(piece.slice(2, -2)));
      else if (piece.startsWith('`') && piece.endsWith('`')) nodes.push(code(piece.slice(1, -1)));
      else nodes.push({ type: 'text', text: piece });
    }
  }
  return nodes;
}

export function p(...parts: Inline[]): TiptapNode {
  return { type: 'paragraph', content: inlineNodes(parts) };
}

export function h(level: 2 | 3 | 4, text: string): TiptapNode {
  return { type: 'heading', attrs: { level }, content: inlineNodes([text]) };
}

function listItem(item: Inline | Inline[]): TiptapNode {
  const parts = Array.isArray(item) ? item : [item];
  return { type: 'listItem', content: [p(...parts)] };
}

/** An ordered list of remedy steps; each step is one paragraph. */
export function steps(...items: (Inline | Inline[])[]): TiptapNode {
  return { type: 'orderedList', attrs: { start: 1 }, content: items.map(listItem) };
}

export function bullets(...items: (Inline | Inline[])[]): TiptapNode {
  return { type: 'bulletList', content: items.map(listItem) };
}

export function quote(...paragraphs: string[]): TiptapNode {
  return { type: 'blockquote', content: paragraphs.map((text) => p(text)) };
}

/** A caution box: the fix-specific warning, then the standard deference to local codes. */
export function caution(kind: CautionKind, detail: string): TiptapNode {
  return { type: 'caution', attrs: { kind }, content: [p(detail), p(DEFERENCE[kind])] };
}

export function reading(fields: { testPoint: string; expected: string; measured?: string; note?: string }): TiptapNode {
  return {
    type: 'reading',
    attrs: { testPoint: fields.testPoint, expected: fields.expected, measured: fields.measured ?? '', note: fields.note ?? '' },
  };
}

/** A table whose first row is the header row. */
export function table(header: string[], ...rows: string[][]): TiptapNode {
  const row = (cells: string[], cellType: 'tableHeader' | 'tableCell'): TiptapNode => ({
    type: 'tableRow',
    content: cells.map((cell) => ({ type: cellType, attrs: { colspan: 1, rowspan: 1 }, content: [p(cell)] })),
  });
  return { type: 'table', content: [row(header, 'tableHeader'), ...rows.map((cells) => row(cells, 'tableCell'))] };
}

export function doc(...blocks: TiptapNode[]): TiptapDoc {
  return { type: 'doc', content: blocks };
}

export function part(
  kind: PartKind,
  value: string,
  extra: { ref?: string; rating?: string; quantity?: number; notes?: string } = {},
): PartRow {
  return { ref: extra.ref ?? '', kind, value, rating: extra.rating ?? '', quantity: extra.quantity ?? 1, notes: extra.notes ?? '' };
}

/** Shorthand for the commonest row: an electrolytic capacitor with its reference, value and rating. */
export function cap(ref: string, value: string, rating: string, notes = '', quantity = 1): PartRow {
  return part('capacitor', value, { ref, rating, quantity, notes });
}

function walk(node: TiptapNode, visit: (n: TiptapNode) => void): void {
  visit(node);
  for (const child of node.content ?? []) walk(child, visit);
}

function textOf(node: TiptapNode): string {
  const texts: string[] = [];
  walk(node, (n) => {
    if (n.type === 'text' && n.text) texts.push(n.text);
  });
  return texts.join('');
}

/** The Cautions field mirrors the caution boxes in the body, so the two can never disagree. */
export function cautionsOf(body: TiptapDoc): Caution[] {
  const found = new Map<CautionKind, string>();
  walk(body, (n) => {
    if (n.type !== 'caution') return;
    const kind = n.attrs?.kind as CautionKind;
    if (!found.has(kind)) found.set(kind, (n.content ?? []).map(textOf).join(' '));
  });
  return [...found].map(([kind, detail]) => ({ kind, detail }));
}

/** The Readings field mirrors the reading nodes in the body. */
export function readingsOf(body: TiptapDoc): Reading[] {
  const found: Reading[] = [];
  walk(body, (n) => {
    if (n.type !== 'reading' || !n.attrs) return;
    const a = n.attrs as Record<string, string>;
    found.push({ testPoint: a.testPoint ?? '', expected: a.expected ?? '', measured: a.measured ?? '', note: a.note ?? '' });
  });
  return found;
}

export interface RevisionInput {
  title: string;
  symptoms: string[];
  errorCodes?: string[];
  cause: string;
  body: TiptapDoc;
  parts?: PartRow[];
  difficulty: Difficulty;
  timeMinutes: number;
  editSummary: string;
  author: string;
  proofer: string;
  illustrations?: DemoIllustration[];
}

export function rev(input: RevisionInput): DemoRevision {
  const { errorCodes = [], parts = [], illustrations, ...rest } = input;
  const revision: DemoRevision = {
    ...rest,
    errorCodes,
    parts,
    readings: readingsOf(input.body),
    cautions: cautionsOf(input.body),
  };
  if (illustrations) revision.illustrations = illustrations;
  return revision;
}

/** A later revision: starts from the earlier one and replaces what the editor changed. */
export function revise(
  base: DemoRevision,
  changes: Partial<RevisionInput> & Pick<RevisionInput, 'editSummary' | 'author' | 'proofer'>,
): DemoRevision {
  const baseInput: RevisionInput = {
    title: base.title,
    symptoms: base.symptoms,
    errorCodes: base.errorCodes,
    cause: base.cause,
    body: base.body,
    parts: base.parts,
    difficulty: base.difficulty,
    timeMinutes: base.timeMinutes,
    editSummary: base.editSummary,
    author: base.author,
    proofer: base.proofer,
  };
  if (base.illustrations) baseInput.illustrations = base.illustrations;
  return rev({ ...baseInput, ...changes });
}

export function figure(drawing: string, alt: string, caption: string): DemoIllustration {
  return { drawing, alt, caption };
}
