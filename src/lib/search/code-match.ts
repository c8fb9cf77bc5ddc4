// Model numbers, chassis codes, error codes and part references typed loosely: which stored code a query means.
import type { Piece } from './tokens';
import { editDistance } from './edit-distance';

/** The runs of digits of a code joined by dots: "dr4120k" → "4120", "c1204" → "1204", "lderr3" → "3". */
export function digitsOf(code: string): string {
  return (code.match(/\d+/g) ?? []).join('.');
}

function lettersOf(code: string): string {
  return code.replace(/\d+/g, '');
}

export type CodeMatchQuality = 'exact' | 'variant';

/**
 * Whether a stored code answers what was typed. Digits must be the same digits in the same runs: a code
 * for one machine never matches its neighbour's ("kx45n" is not "kx44n"). Letters may be left off at the
 * end (a region or feature suffix: "dr4120" finds "dr4120k"), left out entirely when at least two digits
 * were typed ("4120" finds "dr4120"), or carry one slip when the letters run to three or more.
 */
export function codeMatchQuality(typed: string, stored: string): CodeMatchQuality | null {
  if (typed === stored) return 'exact';
  if (!typed || digitsOf(typed) === '' || digitsOf(typed) !== digitsOf(stored)) return null;
  const typedLetters = lettersOf(typed);
  if (typedLetters === '') return typed.length >= 2 ? 'variant' : null;
  if (stored.startsWith(typed) && /^[a-z]{1,2}$/.test(stored.slice(typed.length))) return 'variant';
  const storedLetters = lettersOf(stored);
  if (typedLetters.length >= 3 && typed.length === stored.length && editDistance(typedLetters, storedLetters) <= 1) {
    // Same shape, one slip in the letters: the digits are already known to be identical.
    return sameShape(typed, stored) ? 'variant' : null;
  }
  return null;
}

/** Letters and digits in the same places: "lderr3" and "ldeer3" share a shape, "ld3err" does not. */
function sameShape(a: string, b: string): boolean {
  const shape = (s: string) => s.replace(/[a-z]/g, 'a').replace(/\d/g, '0');
  return shape(a) === shape(b);
}

/** A run of pieces that may spell a code: it holds a digit, and its letter-only pieces are short. */
export interface CodeGroup {
  /** Index of the group's first piece in the query's pieces. */
  start: number;
  pieces: string[];
  /** For each piece, whether a dash, dot or slash bound it to the one before ("E-22"): such a pair is never split. */
  tight: boolean[];
}

const MAX_CODE_LETTERS_PIECE = 3;
const MAX_WINDOW_PIECES = 4;

/** Groups of adjacent pieces that could be a code: "tray dr 4120 k" → one group ["dr", "4120", "k"]. */
export function codeGroups(pieces: Piece[]): CodeGroup[] {
  const groups: CodeGroup[] = [];
  let current: CodeGroup | null = null;
  const flush = () => {
    if (current && current.pieces.some((p) => /\d/.test(p))) groups.push(current);
    current = null;
  };
  pieces.forEach((piece, index) => {
    const fits = piece.hasDigit || piece.text.length <= MAX_CODE_LETTERS_PIECE;
    if (!fits || (current && !piece.joinsPrevious)) flush();
    if (!fits) return;
    current ??= { start: index, pieces: [], tight: [] };
    current.pieces.push(piece.text);
    current.tight.push(current.pieces.length > 1 && piece.tight);
  });
  flush();
  return groups;
}

/** A window may not cut between two pieces a dash bound together: "E-22" is never read as "22". */
function keepsTightPairs(group: CodeGroup, from: number, to: number): boolean {
  return !group.tight[from] && !group.tight[to];
}

/** Every joined window of a group that holds a digit: the strings looked up among stored codes. */
export function codeWindows(group: CodeGroup): string[] {
  const windows = new Set<string>();
  for (let from = 0; from < group.pieces.length; from++) {
    for (let to = from + 1; to <= Math.min(group.pieces.length, from + MAX_WINDOW_PIECES); to++) {
      if (!keepsTightPairs(group, from, to)) continue;
      const joined = group.pieces.slice(from, to).join('');
      if (/\d/.test(joined) && joined.length <= 16) windows.add(joined);
    }
  }
  return [...windows];
}

export interface CodeSpan {
  /** Piece indexes (in the whole query) the code took up. */
  from: number;
  to: number;
  typed: string;
  exact: string[];
  variants: string[];
}

/** Stored codes that answer a window, split into exact and variant matches. */
function matchesFor(typed: string, stored: readonly string[]): { exact: string[]; variants: string[] } {
  const exact: string[] = [];
  const variants: string[] = [];
  for (const code of stored) {
    const quality = codeMatchQuality(typed, code);
    if (quality === 'exact') exact.push(code);
    else if (quality === 'variant') variants.push(code);
  }
  return { exact, variants: variants.sort() };
}

/**
 * The codes a group spells, longest window first, left to right; pieces no code took stay words.
 * `stored` holds the candidate codes the database returned for the group's windows.
 */
export function resolveCodeGroup(group: CodeGroup, stored: readonly string[]): CodeSpan[] {
  const spans: CodeSpan[] = [];
  let from = 0;
  while (from < group.pieces.length) {
    let found: CodeSpan | null = null;
    for (let to = Math.min(group.pieces.length, from + MAX_WINDOW_PIECES); to > from && !found; to--) {
      const typed = group.pieces.slice(from, to).join('');
      if (!/\d/.test(typed) || !keepsTightPairs(group, from, to)) continue;
      const { exact, variants } = matchesFor(typed, stored);
      if (exact.length + variants.length > 0) found = { from: group.start + from, to: group.start + to, typed, exact, variants };
    }
    if (found) {
      spans.push(found);
      from = found.to - group.start;
    } else {
      from++;
    }
  }
  return spans;
}
