// Chooses how the PostgreSQL provider reads candidates, from how many fixes its clauses are expected to match.
import type { Knex } from 'knex';
import { estimateMatches, estimateShare, walkThreshold } from '@/lib/search/estimate';
import { lexemesOf, type AnalysedQuery } from './analyse';
import type { ReadPlan, ReadWay } from './pg-candidates';
import { lexemeStats, type LexemeStats } from './vocabulary';

/**
 * Costs per fix read in µs, measured with EXPLAIN ANALYZE on the bench:search database (2 cores): testing
 * the title-and-symptoms vector while walking, about 0.25 since the bench-order index carries it (an
 * index-only scan, some forty fixes a page; it was about 1 read from the table, more when the table is
 * not in memory); testing the whole document (stored compressed), about 4. Collecting through the index costs about 1 per match, unless the query holds a
 * phrase ("disc tray"): then each match is read back and rechecked, about 2.6 for the small vector and 7
 * for the whole document.
 */
const COSTS = {
  summary: { walk: 0.25, collect: 1, collectPhrase: 2.6 },
  anywhere: { walk: 4, collect: 1, collectPhrase: 7 },
} as const;

/** Estimated matches per hard clause (text clauses, then codes), anywhere and in the summary. */
function clauseCounts(analysed: AnalysedQuery, stats: LexemeStats): { summary: number[]; anywhere: number[] } {
  const codeCounts = analysed.codes.map((c) => [...c.exact, ...c.variants].reduce((sum, code) => sum + stats.code(code), 0));
  return {
    anywhere: [...analysed.hardText.map((c) => estimateMatches(c.any, stats.anywhere)), ...codeCounts],
    summary: [...analysed.hardText.map((c) => estimateMatches(c.any, stats.summary)), ...codeCounts],
  };
}

const wayFor = (share: number, threshold: number): ReadWay => (share >= threshold ? 'walk' : 'collect');

/** One small query for the counts of the query's lexemes and codes. */
/** A text whose upper-bound share reaches this is tested on rows found by a code or narrow scope, not index-scanned. */
const BROAD_TEXT_SHARE = 0.01;
/** A clause matching under this share of all fixes is rare enough to gather partial matches by. */
const RARE_SHARE = 0.05;

export async function readPlan(knex: Knex, analysed: AnalysedQuery, limit: number, narrowed: boolean): Promise<ReadPlan> {
  const lexemes = [...new Set([...analysed.hardText, ...analysed.softText].flatMap((c) => lexemesOf(c.any)))];
  const codes = analysed.codes.flatMap((c) => [...c.exact, ...c.variants]);
  const stats = await lexemeStats(knex, lexemes, codes);
  const counts = clauseCounts(analysed, stats);
  const anyShare = Math.min(1, counts.anywhere.reduce((a, b) => a + b, 0) / Math.max(1, stats.total));
  const phrase = analysed.hardText.some((c) => /<\d*-?>/.test(c.any));
  const summaryAt = walkThreshold(limit, stats.total, COSTS.summary.walk, phrase ? COSTS.summary.collectPhrase : COSTS.summary.collect);
  const anywhereAt = walkThreshold(limit, stats.total, COSTS.anywhere.walk, phrase ? COSTS.anywhere.collectPhrase : COSTS.anywhere.collect);
  // The estimates are upper bounds: "collect" is certain to be right; "walk" is tried on a short probe first.
  return {
    summary: wayFor(estimateShare(counts.summary, stats.total), summaryAt),
    anywhere: wayFor(estimateShare(counts.anywhere, stats.total), anywhereAt),
    summaryWalkShare: summaryAt,
    anywhereWalkShare: anywhereAt,
    allButOne: counts.anywhere.map((_, skip) =>
      wayFor(
        estimateShare(
          counts.anywhere.filter((_c, i) => i !== skip),
          stats.total,
        ),
        anywhereAt,
      ),
    ),
    anyClause: wayFor(anyShare, anywhereAt),
    // Rare enough to collect cheaply, and telling: the two clauses matching fewest fixes.
    rareClauses: counts.anywhere
      .map((count, i) => ({ count, i }))
      // Before the table was ever analysed its size reads 0: the broadest clause then stands for the whole.
      .filter((c) => c.count / Math.max(1, stats.total || Math.max(...counts.anywhere)) < RARE_SHARE)
      .sort((a, b) => a.count - b.count || a.i - b.i)
      .slice(0, 2)
      .map((c) => c.i),
    tableRows: stats.total,
    textBroad: estimateShare(counts.anywhere.slice(0, analysed.hardText.length), stats.total) >= BROAD_TEXT_SHARE,
    narrowed,
  };
}
