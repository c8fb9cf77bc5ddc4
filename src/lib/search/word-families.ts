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
}

/** Terms keyed by their first word; longer terms first so the longest match wins. */
function indexTerms(families: readonly WordFamily[]): Map<string, IndexedTerm[]> {
  const byKey = new Map<string, IndexedTerm>();
  for (const family of families) {
    for (const term of family.terms) {
      const words = termWords(term);
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

function startsAt(words: readonly string[], at: number, candidate: readonly string[]): boolean {
  return candidate.every((w, i) => words[at + i] === w);
}

function alternativesOf(entry: IndexedTerm): string[] {
  const own = entry.words.join(' ');
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
  return alternatives;
}

/** Finds family terms among folded words, longest first and left to right; a word joins at most one span. */
export function matchFamilies(words: readonly string[], families: readonly WordFamily[]): FamilySpan[] {
  const index = indexTerms(families);
  const spans: FamilySpan[] = [];
  let at = 0;
  while (at < words.length) {
    const entry = (index.get(words[at] ?? '') ?? []).find((candidate) => startsAt(words, at, candidate.words));
    if (!entry) {
      at++;
      continue;
    }
    spans.push({
      from: at,
      to: at + entry.words.length,
      term: entry.term,
      alternatives: alternativesOf(entry),
      familyNames: [...new Set(entry.families.map((f) => f.name))],
    });
    at += entry.words.length;
  }
  return spans;
}

/** Every single word that appears in some family term: such words are never "corrected" away. */
export function familyVocabulary(families: readonly WordFamily[]): Set<string> {
  const words = new Set<string>();
  for (const family of families) for (const term of family.terms) for (const word of termWords(term)) words.add(word);
  return words;
}
