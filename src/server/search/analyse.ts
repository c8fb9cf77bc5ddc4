// Reads a query against the database's vocabulary and word families, and compiles its clauses to tsqueries.
import type { Knex } from 'knex';
import { parseQuery } from '@/lib/search/tokens';
import { buildPlan, planTerms, type CodeClause, type SearchPlan, type TextClause } from '@/lib/search/plan';
import { compiledWordFamilies } from './word-families';
import { lookupVocabulary } from './vocabulary';
import { lexemeQuery, phraseQuery } from '@/lib/search/tsquery-text';

export interface CompiledTextClause {
  clause: TextClause;
  /** tsquery text of the terms as typed; '' when they are stop words only. */
  typed: string;
  /** tsquery text of the family alternatives; '' when there are none. */
  alternatives: string;
  /** typed OR alternatives. */
  any: string;
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

function compileClause(clause: TextClause, compiled: Map<string, string>): CompiledTextClause {
  const typedQueries = [...new Set(clause.terms.map((t) => compiled.get(t) ?? ''))];
  // "rewinds" and "rewinding" stem to the typed "rewind": search each distinct query once.
  const alternativeQueries = [...new Set(clause.alternatives.map((t) => compiled.get(t) ?? ''))].filter((q) => !typedQueries.includes(q));
  const typed = orQuery(typedQueries);
  const alternatives = orQuery(alternativeQueries);
  return { clause, typed, alternatives, any: orQuery([typed, alternatives]) };
}

export async function analyseQuery(knex: Knex, text: string): Promise<AnalysedQuery> {
  const parsed = parseQuery(text);
  const [{ vocabulary, stems }, { families, termQueries }] = await Promise.all([
    lookupVocabulary(knex, parsed),
    compiledWordFamilies(knex),
  ]);
  const plan = buildPlan(parsed, vocabulary, families);
  const compiled = compileTerms(plan, termQueries, stems);
  const textClauses = plan.clauses.filter((c): c is TextClause => c.kind === 'text').map((c) => compileClause(c, compiled));
  const hardText = textClauses.filter((c) => c.any !== '' && !(c.clause.soft || c.typed === ''));
  const softText = textClauses.filter((c) => c.any !== '' && (c.clause.soft || c.typed === ''));
  const codes = plan.clauses.filter((c): c is CodeClause => c.kind === 'code');
  const excluded = orQuery(plan.excluded.map((w) => compiled.get(w) ?? ''));
  return { plan, hardText, softText, codes, excluded, searchable: hardText.length + codes.length > 0 };
}
