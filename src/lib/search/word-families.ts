// Word families in a query: a term of a family found in the words is searched together with its family's other terms.
import { foldText, piecesOf } from './tokens';

export interface WordFamily {
  id: number;
  name: string;
  terms: string[];
}

/** A stretch of the query's words that is a term of one or more families. */
export interface FamilySpan {
  /** Word positions [from, to) in the list given to `matchFamilies`. */
  from: number;
  to: number;
  /** The family term as the family spells it ("won't" for a typed "wont"). */
  term: string;
  /** The other terms of every family holding that term, without repeats. */
  alternatives: string[];
  familyNames: string[];
}

/** A family term as the words it folds to: "Won't" → ["wont"], "e-cap" → ["e", "cap"]. */
export function termWords(term: string): string[] {
  return piecesOf(foldText(term)).map((p) => p.text);
}

interface IndexedTerm {
  words: string[];
  term: string;
  families: WordFamily[];
  /** The other terms of its families, worked out once per family list (see `lookupOf`). */
  alternatives?: string[];
}

/** Stands for any way of saying "not" when family terms are matched by meaning ("no spin" as "won't spin"). */
const NEGATED = '¬';
const NEGATING_WORDS = new Set([
  'no',
  'not',
  'never',
  'wont',
  'dont',
  'doesnt',
  'didnt',
  'cant',
  'cannot',
  'isnt',
  'wasnt',
  'wouldnt',
  'aint',
]);
/** Two-word ways of saying "not", as folded words. */
const NEGATING_PAIRS = new Set(['will not', 'does not', 'do not', 'did not', 'is not', 'can not', 'would not', 'fails to', 'fail to']);

/** Words with every way of saying "not" as one token, each token with the place of its first word. */
export function negationTokens(words: readonly string[]): { token: string; at: number; length: number }[] {
  const tokens: { token: string; at: number; length: number }[] = [];
  for (let i = 0; i < words.length; i++) {
    const pair = `${words[i]} ${words[i + 1] ?? ''}`;
    if (NEGATING_PAIRS.has(pair)) tokens.push({ token: NEGATED, at: i++, length: 2 });
    else tokens.push({ token: NEGATING_WORDS.has(words[i] ?? '') ? NEGATED : (words[i] ?? ''), at: i, length: 1 });
  }
  return tokens;
}

/** Terms keyed by their first word; longer terms first so the longest match wins. */
function indexTerms(families: readonly WordFamily[], keyOf: (words: string[]) => string[]): Map<string, IndexedTerm[]> {
  const byKey = new Map<string, IndexedTerm>();
  for (const family of families) {
    for (const term of family.terms) {
      const words = keyOf(termWords(term));
      if (words.length === 0) continue;
      const key = words.join(' ');
      const entry = byKey.get(key) ?? { words, term, families: [] };
      entry.families.push(family);
      byKey.set(key, entry);
    }
  }
  const byFirst = new Map<string, IndexedTerm[]>();
  for (const entry of byKey.values()) {
    const first = entry.words[0] ?? '';
    byFirst.set(first, [...(byFirst.get(first) ?? []), entry]);
  }
  for (const list of byFirst.values()) list.sort((a, b) => b.words.length - a.words.length || a.term.localeCompare(b.term));
  return byFirst;
}

const asNegationTokens = (words: string[]) => negationTokens(words).map((t) => t.token);

function startsAt(words: readonly string[], at: number, candidate: readonly string[]): boolean {
  return candidate.every((w, i) => words[at + i] === w);
}

function alternativesOf(entry: IndexedTerm): string[] {
  if (entry.alternatives) return entry.alternatives;
  const own = termWords(entry.term).join(' ');
  const seen = new Set<string>([own]);
  const alternatives: string[] = [];
  for (const family of entry.families) {
    for (const term of family.terms) {
      const key = termWords(term).join(' ');
      if (key === '' || seen.has(key)) continue;
      seen.add(key);
      alternatives.push(term);
    }
  }
  entry.alternatives = alternatives;
  return alternatives;
}

interface FamilyLookup {
  index: Map<string, IndexedTerm[]>;
  byMeaning: Map<string, IndexedTerm[]>;
  vocabulary: Set<string>;
}

/**
 * The indexes of one list of families, built on its first search and kept while that list lives: the server
 * keeps one compiled list until an editor changes a family, so every search after the first reuses them.
 */
const lookups = new WeakMap<readonly WordFamily[], FamilyLookup>();

function lookupOf(families: readonly WordFamily[]): FamilyLookup {
  let lookup = lookups.get(families);
  if (!lookup) {
    const vocabulary = new Set<string>();
    for (const family of families) for (const term of family.terms) for (const word of termWords(term)) vocabulary.add(word);
    lookup = { index: indexTerms(families, (w) => w), byMeaning: indexTerms(families, asNegationTokens), vocabulary };
    lookups.set(families, lookup);
  }
  return lookup;
}

/**
 * Finds family terms among folded words, longest first and left to right; a word joins at most one span.
 * A stretch no term spells as typed may still say a term with another "not" ("no spin", "does not spin"
 * for "won't spin"): it matches by meaning, and the family's spelling stands for it.
 */
export function matchFamilies(words: readonly string[], families: readonly WordFamily[]): FamilySpan[] {
  const { index, byMeaning } = lookupOf(families);
  const tokens = negationTokens(words);
  const tokenAt = new Map(tokens.map((t, i) => [t.at, i]));
  const tokenTexts = tokens.map((t) => t.token);
  const spans: FamilySpan[] = [];
  let at = 0;
  while (at < words.length) {
    let entry = (index.get(words[at] ?? '') ?? []).find((candidate) => startsAt(words, at, candidate.words));
    let length = entry?.words.length ?? 0;
    const k = tokenAt.get(at);
    if (!entry && k !== undefined) {
      entry = (byMeaning.get(tokenTexts[k] ?? '') ?? []).find((candidate) => startsAt(tokenTexts, k, candidate.words));
      const last = entry ? tokens[k + entry.words.length - 1] : undefined;
      length = last ? last.at + last.length - at : 0;
    }
    if (!entry) {
      at++;
      continue;
    }
    spans.push({
      from: at,
      to: at + length,
      term: entry.term,
      alternatives: alternativesOf(entry),
      familyNames: [...new Set(entry.families.map((f) => f.name))],
    });
    at += length;
  }
  return spans;
}

/** Every single word that appears in some family term: such words are never "corrected" away. */
export function familyVocabulary(families: readonly WordFamily[]): ReadonlySet<string> {
  return lookupOf(families).vocabulary;
}
