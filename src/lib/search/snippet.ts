// The snippet under a search hit: whole symptoms (or whole sentences of a long one), cuts marked "…", matches highlighted.
import { MARK_END, MARK_START, escapeHtml } from './highlight';

/** How symptoms are joined in the text given to `buildSnippet`. */
export const SYMPTOM_SEPARATOR = ' · ';
/** A snippet stops adding symptoms past this many characters; one symptom is always shown, however long. */
export const SNIPPET_BUDGET = 170;
/** A single symptom longer than this is shown by its sentences that matched, not whole. */
const LONG_SYMPTOM = 220;

type Range = readonly [number, number];

/** Text with MARK_START/MARK_END markers read into plain text and the ranges that were marked. */
export function readMarks(marked: string): { text: string; ranges: Range[] } {
  let text = '';
  let open = -1;
  const ranges: Range[] = [];
  for (const part of marked.split(new RegExp(`([${MARK_START}${MARK_END}])`))) {
    if (part === MARK_START) open = open < 0 ? text.length : open;
    else if (part === MARK_END) {
      if (open >= 0 && text.length > open) ranges.push([open, text.length]);
      open = -1;
    } else text += part;
  }
  if (open >= 0 && text.length > open) ranges.push([open, text.length]);
  return { text, ranges };
}

/** A word found through a word family or a related word rather than as typed: "drawer" found as "tray". */
export interface ConceptMarks {
  /** What the reader typed, as the plan reads it ("drawer", "will not shut"). */
  label: string;
  /** The same text as the typed marks, marked where the concept's other terms matched. */
  marked: string;
  /** The concept's other terms as folded words: a phrase's words count only where the whole phrase stands. */
  terms: readonly (readonly string[])[];
}

const fold = (word: string) =>
  word
    .normalize('NFKD')
    .replace(/\p{M}+/gu, '')
    .toLowerCase()
    .replace(/['’]/g, '');
/** A word without its regular endings ("drawers", "spinning", "closes" → "drawer", "spin", "clos"), not "loader" → "load". */
function bare(word: string): string {
  const cut = word.replace(/(ing|ed|es|s)$/, '');
  const single = /([b-df-hj-np-tv-z])\1$/.test(cut) ? cut.slice(0, -1) : cut;
  return single.length > 2 ? single.replace(/e$/, '') : word;
}
/** Two forms of one word as far as a highlight needs: the stemmer already matched them. */
const sameStart = (a: string, b: string) => bare(a) === bare(b);

/**
 * Concept marks joined into runs of neighbouring words, kept only where the run is one whole term: the
 * engine marks each word of a phrase wherever it stands, so "disc" alone is not "disc drawer".
 */
function conceptRuns(text: string, ranges: readonly Range[], terms: ConceptMarks['terms']): Range[] {
  const runs: [number, number][] = [];
  for (const [start, end] of [...ranges].sort((a, b) => a[0] - b[0])) {
    const last = runs[runs.length - 1];
    if (last && /^[\s-]*$/.test(text.slice(last[1], start))) last[1] = end;
    else runs.push([start, end]);
  }
  return runs.filter(([start, end]) => {
    const words = (text.slice(start, end).match(/[\p{L}\p{N}'’]+/gu) ?? []).map(fold);
    return terms.some((t) => t.length === words.length && t.every((w, i) => sameStart(w, words[i] ?? '')));
  });
}

export interface Snippet {
  html: string;
  /** "drawer ≈ tray" for each concept match shown, in order of appearance, without repeats. */
  matched: string[];
}

interface Piece {
  start: number;
  end: number;
}

/** Stretches of `text` between separators, with their offsets. */
function split(text: string, separator: RegExp, from = 0, to = text.length): Piece[] {
  const pieces: Piece[] = [];
  let start = from;
  const slice = text.slice(from, to);
  for (const match of slice.matchAll(separator)) {
    const at = from + (match.index ?? 0);
    pieces.push({ start, end: at });
    start = at + match[0].length;
  }
  pieces.push({ start, end: to });
  return pieces.filter((p) => text.slice(p.start, p.end).trim() !== '');
}

const touches = (piece: Piece, ranges: readonly Range[]) => ranges.some(([a, b]) => a < piece.end && b > piece.start);

/** The symptoms to show: those with most matches first, within the budget, in their own order; the first ones when none matched. */
function chooseSymptoms(symptoms: Piece[], ranges: readonly Range[]): Piece[] {
  const hits = (s: Piece) => ranges.filter(([a, b]) => a < s.end && b > s.start).length;
  const matched = symptoms.filter((s) => hits(s) > 0);
  const pool = matched.length > 0 ? [...matched].sort((a, b) => hits(b) - hits(a) || a.start - b.start) : symptoms;
  const chosen: Piece[] = [];
  let used = 0;
  for (const symptom of pool) {
    const length = symptom.end - symptom.start;
    if (chosen.length > 0 && used + length > SNIPPET_BUDGET) continue;
    chosen.push(symptom);
    used += length + SYMPTOM_SEPARATOR.length;
  }
  return chosen.sort((a, b) => a.start - b.start);
}

/** A long symptom by its whole sentences: the ones with a match, else the first. */
function sentencesOf(text: string, symptom: Piece, ranges: readonly Range[]): Piece[] {
  if (symptom.end - symptom.start <= LONG_SYMPTOM) return [symptom];
  const sentences = split(text, /(?<=[.!?;])\s+/g, symptom.start, symptom.end);
  if (sentences.length < 2) return [symptom];
  const matched = sentences.filter((s) => touches(s, ranges));
  return matched.length > 0 ? matched : sentences.slice(0, 1);
}

function highlighted(text: string, piece: Piece, typed: readonly Range[], concepts: readonly { label: string; range: Range }[]): string {
  type Mark = { start: number; end: number; label: string | null };
  const marks: Mark[] = [
    ...typed.map(([start, end]) => ({ start, end, label: null })),
    ...concepts
      .filter((c) => !typed.some(([a, b]) => a < c.range[1] && b > c.range[0]))
      .map((c) => ({ start: c.range[0], end: c.range[1], label: c.label })),
  ]
    .filter((m) => m.start >= piece.start && m.end <= piece.end)
    .sort((a, b) => a.start - b.start);
  let html = '';
  let at = piece.start;
  for (const mark of marks) {
    if (mark.start < at) continue;
    html += escapeHtml(text.slice(at, mark.start));
    const word = text.slice(mark.start, mark.end);
    html +=
      mark.label === null
        ? `<mark>${escapeHtml(word)}</mark>`
        : `<mark class="concept" title="${escapeHtml(`matched: ${mark.label} ≈ ${word.toLowerCase()}`)}">${escapeHtml(word)}</mark>`;
    at = mark.end;
  }
  return html + escapeHtml(text.slice(at, piece.end));
}

/**
 * Builds the snippet from the symptoms marked where the typed words matched, and the same text marked
 * per concept. It shortens only by leaving out whole symptoms or whole sentences, never words inside
 * one, so "no rewind" can never read "rewind"; every cut is shown as "…".
 */
export function buildSnippet(typedMarked: string, concepts: readonly ConceptMarks[] = []): Snippet {
  const { text, ranges: typed } = readMarks(typedMarked);
  const conceptRanges = concepts.flatMap((c) => {
    const read = readMarks(c.marked);
    // Marks only line up when both texts are the same; a mismatch drops the concept marks, never the text.
    return read.text === text ? conceptRuns(text, read.ranges, c.terms).map((range) => ({ label: c.label, range })) : [];
  });
  const all = [...typed, ...conceptRanges.map((c) => c.range)];
  const symptoms = split(text, / · /g);
  if (symptoms.length === 0) return { html: '', matched: [] };
  const shown = chooseSymptoms(symptoms, all).flatMap((s) => sentencesOf(text, s, all));
  let html = '';
  let last: Piece | null = null;
  for (const piece of shown) {
    const gap = text.slice(last ? last.end : 0, piece.start);
    // Adjacent symptoms join with their separator; anything else left out between is a cut.
    if (last === null) html += gap.trim() === '' ? '' : '… ';
    else html += gap.trim() === '·' || gap.trim() === '' ? (gap.includes('·') ? SYMPTOM_SEPARATOR : ' ') : ' … ';
    html += highlighted(text, piece, typed, conceptRanges);
    last = piece;
  }
  if (last && text.slice(last.end).trim() !== '') html += ' …';
  const matched = [
    ...new Set(
      conceptRanges
        .filter((c) => shown.some((p) => c.range[0] >= p.start && c.range[1] <= p.end))
        .filter((c) => !typed.some(([a, b]) => a < c.range[1] && b > c.range[0]))
        .sort((a, b) => a.range[0] - b.range[0])
        .map((c) => `${c.label} ≈ ${text.slice(c.range[0], c.range[1]).toLowerCase()}`),
    ),
  ];
  return { html, matched };
}
