// Reads a query against the database's vocabulary and word families, and compiles its clauses to tsqueries.
import type { Knex } from 'knex';
import { parseQuery } from '@/lib/search/tokens';
import { buildPlan, planTerms, type CodeClause, type SearchPlan, type TextClause } from '@/lib/search/plan';
import { activeWordFamilies } from './word-families';
import { lookupVocabulary } from './vocabulary';
import { pgArray } from './sql-fragment';

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

/** websearch_to_tsquery for many terms at once; the map holds '' for terms of stop words only. */
async function compileTerms(knex: Knex, terms: string[]): Promise<Map<string, string>> {
  if (terms.length === 0) return new Map();
  const { rows } = await knex.raw<{ rows: { term: string; q: string }[] }>(
    `SELECT term, websearch_to_tsquery('english', benchlore_unaccent(term))::text AS q FROM unnest(?::text[]) AS term`,
    [pgArray(terms)],
  );
  return new Map(rows.map((r) => [r.term, r.q]));
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
  const [vocabulary, families] = await Promise.all([lookupVocabulary(knex, parsed), activeWordFamilies(knex)]);
  const plan = buildPlan(parsed, vocabulary, families);
  const compiled = await compileTerms(knex, planTerms(plan));
  const textClauses = plan.clauses.filter((c): c is TextClause => c.kind === 'text').map((c) => compileClause(c, compiled));
  const hardText = textClauses.filter((c) => c.any !== '' && !(c.clause.soft || c.typed === ''));
  const softText = textClauses.filter((c) => c.any !== '' && (c.clause.soft || c.typed === ''));
  const codes = plan.clauses.filter((c): c is CodeClause => c.kind === 'code');
  const excluded = orQuery(plan.excluded.map((w) => compiled.get(w) ?? ''));
  return { plan, hardText, softText, codes, excluded, searchable: hardText.length + codes.length > 0 };
}
