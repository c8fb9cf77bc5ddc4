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

/** A code with the leading zeros of each digit run dropped: "f07" → "f7", "e005" → "e5", "f10" stays. */
export function zeroless(code: string): string {
  return code.replace(/\d+/g, (run) => run.replace(/^0+(?=\d)/, ''));
}

const MAX_PADDED_RUNS = 3;

/**
 * Every stored digits key a typed code may stand for: each run as typed, without its leading zeros, and
 * padded with one or two zeros ("f7" → "7", "07", "007"), so "F7" finds F-07 but never F-17 or F-70.
 */
export function digitKeysOf(code: string): string[] {
  const runs = (code.match(/\d+/g) ?? []).map((run) => run.replace(/^0+(?=\d)/, ''));
  if (runs.length === 0) return [];
  if (runs.length > MAX_PADDED_RUNS) return [digitsOf(code)];
  let keys: string[] = [''];
  for (const run of runs) {
    const forms = [run, `0${run}`, `00${run}`];
    keys = keys.flatMap((key) => forms.map((form) => (key === '' ? form : `${key}.${form}`)));
  }
  return [...new Set([digitsOf(code), ...keys])];
}

export type CodeMatchQuality = 'exact' | 'variant';

/**
 * Whether a stored code answers what was typed. Digits must be the same digits in the same runs: a code
 * for one machine never matches its neighbour's ("kx45n" is not "kx44n"). Letters may be left off at the
 * end (a region or feature suffix: "dr4120" finds "dr4120k"), left out entirely when at least two digits
 * were typed ("4120" finds "dr4120"), or carry one slip when the letters run to three or more. Leading
 * zeros of a digit run do not count: "f7", "f-7" and "f 07" all find "f07", never "f17" or "f70".
 */
export function codeMatchQuality(typedCode: string, storedCode: string): CodeMatchQuality | null {
  if (typedCode === storedCode) return 'exact';
  // Leading zeros are how a display pads a code, not part of it: "f7" and "f07" are one code.
  const typed = zeroless(typedCode);
  const stored = zeroless(storedCode);
  if (!typed || digitsOf(typed) === '' || digitsOf(typed) !== digitsOf(stored)) return null;
  if (typed === stored) return 'variant';
  const typedLetters = lettersOf(typed);
  if (typedLetters === '') return typedCode.length >= 2 ? 'variant' : null;
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
