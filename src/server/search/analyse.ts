// Reads a query against the database's vocabulary and word families, and compiles its clauses to tsqueries.
import type { Knex } from 'knex';
import { parseQuery } from '@/lib/search/tokens';
import { NEGATIONS, buildPlan, planTerms, type CodeClause, type SearchPlan, type TextClause } from '@/lib/search/plan';
import { compiledWordFamilies } from './word-families';
import { lookupVocabulary } from './vocabulary';
import { lexemeQuery, phraseQuery } from '@/lib/search/tsquery-text';
import { termWords } from '@/lib/search/word-families';
import type { HighlightQuery } from './hydrate';

export interface CompiledTextClause {
  clause: TextClause;
  /** tsquery text of the terms as typed; '' when they are stop words only. */
  typed: string;
  /** tsquery text of the family alternatives; '' when there are none. */
  alternatives: string;
  /** typed OR alternatives. */
  any: string;
  /** The alternatives that keep their meaning in the English index: what counts as the concept found. */
  meantAlternatives: string;
  /** The content words typed in a family phrase, all found ("power" in "wont power on"); '' for one word. */
  literal: string;
  /** 'simple' tsquery finding, as written, the clause's terms the English index cannot search as meant; '' when none. */
  asWritten: string;
  /** What highlights mark as typed: the typed terms, and what was typed when negated terms stand for it. */
  shownTyped: string;
  /** What highlights mark as the concept, with the terms' words for lining up phrases. */
  shownAlternatives: string;
  alternativeTerms: string[];
}

export interface AnalysedQuery {
  plan: SearchPlan;
  /** Clauses every full match must satisfy. */
  hardText: CompiledTextClause[];
  /** Clauses that only rank ("will not": stop words whose family has real words). */
  softText: CompiledTextClause[];
  codes: CodeClause[];
  /** tsquery text of the excluded words OR-ed; '' when none. */
  excluded: string;
  /** True when there is something to search for. */
  searchable: boolean;
}

/** The lexemes of a tsquery text as we write it: 'tray' <-> 'open' → tray, open. */
export const lexemesOf = (tsquery: string): string[] =>
  [...tsquery.matchAll(/'((?:[^']|'')*)'/g)].map((m) => (m[1] ?? '').replace(/''/g, "'"));

export const orQuery = (parts: string[]): string =>
  parts
    .filter(Boolean)
    .map((p) => `(${p})`)
    .join(' | ');
export const andQuery = (parts: string[]): string =>
  parts
    .filter(Boolean)
    .map((p) => `(${p})`)
    .join(' & ');

/**
 * tsquery text for every term of the plan, from what the lookups returned: family terms compiled by
 * websearch_to_tsquery with the families, words from their stems, phrases and literal codes from their
 * pieces. No term needs another round trip.
 */
function compileTerms(plan: SearchPlan, termQueries: Map<string, string>, stems: Map<string, string>): Map<string, string> {
  const compiled = new Map<string, string>();
  const wordQuery = (word: string) => {
    const stem = stems.get(word);
    // A piece no lookup saw (a literal code's piece) stands for itself.
    return stem === undefined ? lexemeQuery(word) : stem === '' ? '' : lexemeQuery(stem);
  };
  for (const term of planTerms(plan)) {
    const family = termQueries.get(term);
    if (family !== undefined) compiled.set(term, family);
    else if (term.startsWith('"'))
      compiled.set(
        term,
        phraseQuery(
          term
            .replace(/"/g, '')
            .split(' ')
            .map((w) => stems.get(w) ?? w),
        ),
      );
    else compiled.set(term, wordQuery(term));
  }
  return compiled;
}

/** Negations the English dictionary drops from the index: a term holding one cannot be searched as meant. */
const UNINDEXED_NEGATIONS = new Set(['no', 'not', 'nor']);

/**
 * An alternative term that loses its negation when compiled ("no power" → power, "will not turn on" → turn)
 * would find the opposite of what its family means: it is left out of other terms' alternatives.
 */
const keepsItsMeaning = (term: string) => !termWords(term.replace(/"/g, '')).some((w) => UNINDEXED_NEGATIONS.has(w));

/**
 * A phrase holding a word the clause already searches alone adds no match ("disc tray" beside "tray"), but
 * costs a recheck of every candidate's positions: such phrases are left out.
 */
function withoutSubsumed(typed: string[], alternatives: string[]): string[] {
  const single = /^'(?:[^']|'')*'$/;
  const alone = new Set([...typed, ...alternatives].filter((q) => single.test(q)).flatMap(lexemesOf));
  return alternatives.filter((q) => single.test(q) || !lexemesOf(q).some((l) => alone.has(l)));
}

const NEGATING = new Set([...NEGATIONS, 'fails']);
const keepsANegation = (term: string) => termWords(term.replace(/"/g, '')).some((w) => NEGATING.has(w) && !UNINDEXED_NEGATIONS.has(w));

/**
 * A family phrase is searched through its family, where "dead" finds as much as "won't power on"; the
 * content words typed ("power"), found in the title or symptoms, then rank a fix above one that only shares
 * the concept.
 */
function literalWords(clause: TextClause, stems: Map<string, string>): string {
  const words = clause.label.split(' ');
  if (clause.exact || words.length < 2) return '';
  const content = words.filter((w) => !NEGATIONS.has(w) && (stems.get(w) ?? '') !== '');
  // A phrase of content words only ("disc tray") already ranks as typed, through its own phrase.
  if (content.length === 0 || content.length === words.length) return '';
  return andQuery(content.map((w) => lexemeQuery(stems.get(w) ?? w)));
}

function compileClause(
  clause: TextClause,
  compiled: Map<string, string>,
  asWrittenOf: Map<string, string>,
  stems: Map<string, string>,
): CompiledTextClause {
  let terms = clause.terms;
  let alternatives = clause.alternatives.filter(keepsItsMeaning);
  // "will not open" is searched as open, which also finds "opens then closes": its family's terms that
  // keep their negation ("won't open") stand for what was typed, and the bare word ranks as a family term.
  const negated = alternatives.filter(keepsANegation);
  if (!terms.some(keepsItsMeaning) && negated.length > 0) {
    alternatives = [...terms, ...alternatives.filter((t) => !negated.includes(t))];
    terms = negated;
  }
  const typedQueries = [...new Set(terms.map((t) => compiled.get(t) ?? ''))];
  // "rewinds" and "rewinding" stem to the typed "rewind": search each distinct query once.
  const alternativeQueries = withoutSubsumed(
    typedQueries,
    [...new Set(alternatives.map((t) => compiled.get(t) ?? ''))].filter((q) => !typedQueries.includes(q)),
  );
  const typed = orQuery(typedQueries);
  const alternativeText = orQuery(alternativeQueries);
  // "switches off" searched as switch would count "mode switch" as the concept: such terms count only as written.
  const lossy = new Set([...clause.terms, ...clause.alternatives].filter((t) => asWrittenOf.has(t)));
  // Subsumption is judged among these alone: "can't record" searched as record must not hide "record fails".
  const meantQueries = withoutSubsumed(
    typedQueries,
    [...new Set(alternatives.filter((t) => !lossy.has(t)).map((t) => compiled.get(t) ?? ''))].filter(
      (q) => q !== '' && !typedQueries.includes(q),
    ),
  );
  const asTyped = clause.terms.map((t) => compiled.get(t) ?? '');
  const shownAlternatives = alternatives.filter((t) => !clause.terms.includes(t));
  return {
    clause,
    typed,
    alternatives: alternativeText,
    any: orQuery([typed, alternativeText]),
    meantAlternatives: orQuery(meantQueries),
    asWritten: orQuery([...lossy].map((t) => asWrittenOf.get(t) ?? '')),
    literal: literalWords(clause, stems),
    shownTyped: orQuery([...new Set([...typedQueries, ...asTyped])]),
    shownAlternatives: orQuery(
      [...new Set(shownAlternatives.map((t) => compiled.get(t) ?? ''))].filter((q) => !asTyped.includes(q) && !typedQueries.includes(q)),
    ),
    alternativeTerms: shownAlternatives,
  };
}

export async function analyseQuery(knex: Knex, text: string): Promise<AnalysedQuery> {
  const parsed = parseQuery(text);
  const [{ vocabulary, stems, relatedCandidates }, { families, termQueries, asWritten }] = await Promise.all([
    lookupVocabulary(knex, parsed),
    compiledWordFamilies(knex),
  ]);
  // Dictionary relatives count only where they are the trade's words: a word of some word family (by stem).
  const tradeLexemes = new Set([...termQueries.values()].flatMap(lexemesOf));
  const related = new Map(
    [...relatedCandidates].map(([word, list]) => [
      word,
      list.filter((r) => r.word.split(' ').every((part) => tradeLexemes.has(stems.get(part) ?? part))).map((r) => r.word),
    ]),
  );
  const plan = buildPlan(parsed, { ...vocabulary, related }, families);
  const compiled = compileTerms(plan, termQueries, stems);
  const textClauses = plan.clauses
    .filter((c): c is TextClause => c.kind === 'text')
    .map((c) => compileClause(c, compiled, asWritten, stems));
  const hardText = textClauses.filter((c) => c.any !== '' && !(c.clause.soft || c.typed === ''));
  const softText = textClauses.filter((c) => c.any !== '' && (c.clause.soft || c.typed === ''));
  const codes = plan.clauses.filter((c): c is CodeClause => c.kind === 'code');
  const excluded = orQuery(plan.excluded.map((w) => compiled.get(w) ?? ''));
  return { plan, hardText, softText, codes, excluded, searchable: hardText.length + codes.length > 0 };
}

/** What the hits highlight: all matches in titles; typed terms and each clause's family terms apart in symptoms. */
export function highlightQuery(analysed: AnalysedQuery): HighlightQuery {
  const clauses = [...analysed.hardText, ...analysed.softText];
  return {
    any: orQuery(clauses.map((c) => c.any)),
    typed: orQuery(clauses.map((c) => c.shownTyped)),
    concepts: clauses
      .filter((c) => c.shownAlternatives !== '')
      .map((c) => ({
        label: c.clause.label,
        query: c.shownAlternatives,
        terms: c.alternativeTerms.map((t) => termWords(t.replace(/"/g, ''))),
      })),
  };
}
