// Turns a parsed query into search clauses: codes, literal codes, corrected words and word-family groups.
import { codeGroups, resolveCodeGroup, type CodeGroup } from './code-match';
import { allowedEdits, editDistance } from './edit-distance';
import { familyVocabulary, matchFamilies, type WordFamily } from './word-families';
import type { ParsedQuery } from './tokens';

/** What the database knows about the query's words and codes, looked up before planning. */
export interface Vocabulary {
  /** Words found in live fixes (as written, or through their stem). */
  known: ReadonlySet<string>;
  /** Words the English dictionary ignores ("the", "will", "not"). */
  stopwords: ReadonlySet<string>;
  /** For each unknown word, stored words that look like it, with how many fixes use them. */
  candidates: ReadonlyMap<string, readonly { word: string; ndoc: number }[]>;
  /** Stored codes sharing digits with some window of the query. */
  codes: readonly string[];
  /** Typed words an English dictionary knows: a real word is never "corrected" into another ("gobbles", "lace"). */
  english?: ReadonlySet<string>;
  /** For typed words no fix uses, dictionary synonyms and broader words that the fixes do use ("gobble" → "eat"). */
  related?: ReadonlyMap<string, readonly string[]>;
  /** Typed words that are two stored words run together: "takeup" → "take up", "autoreverse" → "auto reverse". */
  compounds?: ReadonlyMap<string, string>;
  /** Typed words no fix uses whose dictionary base form a fix uses: "skiping" → "skip", "cds" → "cd". */
  inflections?: ReadonlyMap<string, string>;
}

/** Words that only negate: alone they name no fault, so they rank (beside the word they negate) but never exclude. */
export const NEGATIONS: ReadonlySet<string> = new Set([
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
  'nor',
]);

/** One requirement of the query, matched through full-text search. */
export interface TextClause {
  kind: 'text';
  /** What the reader typed (after any correction), for messages and highlighting. */
  label: string;
  /** Terms standing for what was typed; multi-word terms are phrases. */
  terms: string[];
  /** Other terms of the word families the typed term belongs to. */
  alternatives: string[];
  /** A clause of stop words only ("will not"): it ranks, it never excludes. */
  soft: boolean;
  /** A quoted phrase or a code no fix carries: matched as written, never loosened. */
  exact: boolean;
  /** The alternatives come from the dictionary (synonyms, broader words), not a word family: they rank lower. */
  dictionary?: boolean;
  /** Order among the query's words, for the side-by-side bonus. */
  position: number;
}

/** A code the query spells, matched against the codes of each fix. */
export interface CodeClause {
  kind: 'code';
  label: string;
  exact: string[];
  variants: string[];
}

export type Clause = TextClause | CodeClause;

export interface SearchPlan {
  clauses: Clause[];
  excluded: string[];
  corrections: { from: string; to: string }[];
  /** Words left out because nothing like them is in any fix. */
  ignored: string[];
}

/**
 * Best stored word for an unknown one: fewest slips, then a word of some word family (the trade's own
 * vocabulary: "drawr" is "drawer", not "draw"), then the most used, then alphabetical.
 */
export function correctWord(
  word: string,
  candidates: readonly { word: string; ndoc: number }[],
  preferred: ReadonlySet<string> = new Set(),
): string | null {
  const limit = allowedEdits(word.length);
  if (limit === 0) return null;
  const key = (c: { word: string; distance: number; ndoc: number }): [number, number, number] => [
    c.distance,
    preferred.has(c.word) ? 0 : 1,
    -c.ndoc,
  ];
  let best: { word: string; distance: number; ndoc: number } | null = null;
  for (const candidate of candidates) {
    const distance = editDistance(word, candidate.word, limit);
    if (distance > limit) continue;
    const scored = { word: candidate.word, distance, ndoc: candidate.ndoc };
    if (!best || compareKeys(key(scored), key(best)) < 0 || (compareKeys(key(scored), key(best)) === 0 && scored.word < best.word))
      best = scored;
  }
  return best?.word ?? null;
}

function compareKeys(a: readonly number[], b: readonly number[]): number {
  for (let i = 0; i < a.length; i++) if ((a[i] ?? 0) !== (b[i] ?? 0)) return (a[i] ?? 0) - (b[i] ?? 0);
  return 0;
}

interface Word {
  text: string;
  stop: boolean;
  /** Dictionary relatives of a word no fix uses. */
  related?: readonly string[];
}

/** Maximal runs of a group's pieces that no stored code took, with stop words trimmed from their ends. */
function leftoverStretches(group: CodeGroup, consumed: ReadonlySet<number>, stopwords: ReadonlySet<string>): number[][] {
  const stretches: number[][] = [];
  let stretch: number[] = [];
  for (let i = group.start; i <= group.start + group.pieces.length; i++) {
    if (i < group.start + group.pieces.length && !consumed.has(i)) {
      stretch.push(i);
      continue;
    }
    if (stretch.length) stretches.push(stretch);
    stretch = [];
  }
  const isStop = (i: number | undefined) => i !== undefined && stopwords.has(group.pieces[i - group.start] ?? '');
  return stretches.map((s) => {
    const trimmed = [...s];
    while (isStop(trimmed[0])) trimmed.shift();
    while (isStop(trimmed[trimmed.length - 1])) trimmed.pop();
    return trimmed;
  });
}

function codeClauses(parsed: ParsedQuery, vocabulary: Vocabulary, consumed: Set<number>, plan: SearchPlan): Clause[] {
  const clauses: Clause[] = [];
  for (const group of codeGroups(parsed.pieces)) {
    for (const span of resolveCodeGroup(group, vocabulary.codes)) {
      for (let i = span.from; i < span.to; i++) consumed.add(i);
      clauses.push({ kind: 'code', label: span.typed, exact: span.exact, variants: span.variants });
    }
    for (const stretch of leftoverStretches(group, consumed, vocabulary.stopwords)) {
      const texts = stretch.map((i) => parsed.pieces[i]?.text ?? '');
      if (!texts.some((t) => /\d/.test(t))) continue;
      stretch.forEach((i) => consumed.add(i));
      if (!texts.some((t) => /\p{L}/u.test(t))) {
        // A bare number ("20 minutes", "1995") names no code; it is left out rather than guessed at.
        plan.ignored.push(texts.join(' '));
        continue;
      }
      // A code no fix carries: it must be found as written, never as a neighbour's code.
      clauses.push({
        kind: 'text',
        label: texts.join(' '),
        terms: [texts.join(''), `"${texts.join(' ')}"`],
        alternatives: [],
        soft: false,
        exact: true,
        position: -1,
      });
    }
  }
  return clauses;
}

function wordsOf(
  parsed: ParsedQuery,
  vocabulary: Vocabulary,
  families: readonly WordFamily[],
  consumed: ReadonlySet<number>,
  plan: SearchPlan,
): Word[] {
  const familyWords = familyVocabulary(families);
  const words: Word[] = [];
  parsed.pieces.forEach((piece, i) => {
    if (consumed.has(i)) return;
    const text = piece.text;
    if (vocabulary.stopwords.has(text)) return words.push({ text, stop: true });
    if (vocabulary.known.has(text) || familyWords.has(text)) return words.push({ text, stop: false });
    const compound = vocabulary.compounds?.get(text);
    if (compound) return compound.split(' ').forEach((part) => words.push({ text: part, stop: vocabulary.stopwords.has(part) }));
    const base = vocabulary.inflections?.get(text);
    if (base) {
      plan.corrections.push({ from: text, to: base });
      return words.push({ text: base, stop: false });
    }
    if (vocabulary.english?.has(text)) {
      // A real word no fix uses: searched through its dictionary relatives the fixes use, or left out.
      const related = vocabulary.related?.get(text) ?? [];
      if (related.length > 0) return words.push({ text, stop: false, related });
      plan.ignored.push(text);
      return;
    }
    // Family words are candidates too, even where no fix uses them yet: they lead to their family.
    const familyCandidates = [...familyWords].filter((w) => w.length > 2).map((w) => ({ word: w, ndoc: 0 }));
    const corrected = correctWord(text, [...(vocabulary.candidates.get(text) ?? []), ...familyCandidates], familyWords);
    if (corrected) {
      plan.corrections.push({ from: text, to: corrected });
      return words.push({ text: corrected, stop: false });
    }
    plan.ignored.push(text);
  });
  return words;
}

export function buildPlan(parsed: ParsedQuery, vocabulary: Vocabulary, families: readonly WordFamily[]): SearchPlan {
  const plan: SearchPlan = { clauses: [], excluded: parsed.excluded, corrections: [], ignored: [] };
  const consumed = new Set<number>();
  const codes = codeClauses(parsed, vocabulary, consumed, plan);
  const words = wordsOf(parsed, vocabulary, families, consumed, plan);
  const spans = matchFamilies(
    words.map((w) => w.text),
    families,
  );
  let next = 0;
  const textClauses: TextClause[] = [];
  const plainWord = (w: Word, position: number) => {
    if (w.stop) return;
    const related = w.related ?? [];
    textClauses.push({
      kind: 'text',
      label: w.text,
      terms: [w.text],
      alternatives: related.map(quoteMultiWord),
      soft: NEGATIONS.has(w.text),
      exact: false,
      position,
      ...(related.length ? { dictionary: true } : {}),
    });
  };
  const plainWords = (from: number, to: number) => words.slice(from, to).forEach((w, i) => plainWord(w, from + i));
  for (const span of spans) {
    plainWords(next, span.from);
    const typed = words.slice(span.from, span.to);
    // "won't", "will not", "doesn't": a negation alone ranks beside its verb but never decides a match.
    const allStop = typed.every((w) => w.stop || NEGATIONS.has(w.text));
    textClauses.push({
      kind: 'text',
      label: typed.map((w) => w.text).join(' '),
      terms: [quoteMultiWord(span.term)],
      alternatives: span.alternatives.map(quoteMultiWord),
      soft: allStop,
      exact: false,
      position: span.from,
    });
    next = span.to;
  }
  plainWords(next, words.length);
  for (const phrase of parsed.phrases)
    textClauses.push({ kind: 'text', label: phrase, terms: [`"${phrase}"`], alternatives: [], soft: false, exact: true, position: -1 });
  plan.clauses = [...textClauses, ...codes];
  return plan;
}

/** Multi-word terms are searched as phrases: "fast forward", not "fast" and "forward" anywhere. */
export function quoteMultiWord(term: string): string {
  return /\s/.test(term.trim()) ? `"${term.replace(/"/g, '')}"` : term;
}

/** Every term string a plan needs compiled to a text-search query, without repeats. */
export function planTerms(plan: SearchPlan): string[] {
  const terms = new Set<string>();
  for (const clause of plan.clauses) if (clause.kind === 'text') for (const t of [...clause.terms, ...clause.alternatives]) terms.add(t);
  for (const word of plan.excluded) terms.add(word);
  return [...terms];
}
