// Chooses how the PostgreSQL provider reads candidates, from how many fixes its clauses are expected to match.
import type { Knex } from 'knex';
import { estimateMatches, estimateShare } from '@/lib/search/estimate';
import type { AnalysedQuery } from './analyse';
import type { ReadPlan, ReadWay } from './pg-candidates';
import { lexemeStats, type LexemeStats } from './vocabulary';

/**
 * Walking the bench-score index reads about limit ÷ share fixes; collecting reads every match. Walking
 * wins once one fix in fifty matches: at 100,000 fixes that is 2,000 matches against some 5,000 fixes
 * read for the first hundred.
 */
export const WALK_SHARE = 0.02;

const lexemesOf = (tsquery: string): string[] => [...tsquery.matchAll(/'((?:[^']|'')*)'/g)].map((m) => (m[1] ?? '').replace(/''/g, "'"));

/** Estimated matches per hard clause (text clauses, then codes), anywhere and in the summary. */
function clauseCounts(analysed: AnalysedQuery, stats: LexemeStats): { summary: number[]; anywhere: number[] } {
  const codeCounts = analysed.codes.map((c) => [...c.exact, ...c.variants].reduce((sum, code) => sum + stats.code(code), 0));
  return {
    anywhere: [...analysed.hardText.map((c) => estimateMatches(c.any, stats.anywhere)), ...codeCounts],
    summary: [...analysed.hardText.map((c) => estimateMatches(c.any, stats.summary)), ...codeCounts],
  };
}

const wayFor = (share: number): ReadWay => (share >= WALK_SHARE ? 'walk' : 'collect');

/** One small query for the counts of the query's lexemes and codes. */
export async function readPlan(knex: Knex, analysed: AnalysedQuery): Promise<ReadPlan> {
  const lexemes = [...new Set([...analysed.hardText, ...analysed.softText].flatMap((c) => lexemesOf(c.any)))];
  const codes = analysed.codes.flatMap((c) => [...c.exact, ...c.variants]);
  const stats = await lexemeStats(knex, lexemes, codes);
  const counts = clauseCounts(analysed, stats);
  const anyShare = Math.min(1, counts.anywhere.reduce((a, b) => a + b, 0) / Math.max(1, stats.total));
  return {
    summary: wayFor(estimateShare(counts.summary, stats.total)),
    anywhere: wayFor(estimateShare(counts.anywhere, stats.total)),
    allButOne: counts.anywhere.map((_, skip) => wayFor(estimateShare(counts.anywhere.filter((_c, i) => i !== skip), stats.total))),
    anyClause: wayFor(anyShare),
  };
}
