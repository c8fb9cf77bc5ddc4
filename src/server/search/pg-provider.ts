// The PostgreSQL search provider: full-text clauses over fix_search, ranked by our own rules.
import type { Knex } from 'knex';
import { MAX_PAGE, type SearchQuery } from '@/lib/search/query-schema';
import { emptyFacets, type SearchResult } from '@/lib/search/result-types';
import { CODE_WEIGHT, WORD_WEIGHT, matchesAll, proximityOf, rank, relevanceOf, type Rankable } from '@/lib/search/ranking';
import { analyseQuery, highlightQuery, type AnalysedQuery } from './analyse';
import { proximityTarget, resolveContext, type SearchContext } from './context';
import { fullMatches, nearPartialMatches, partialMatches, type CandidateRow } from './pg-candidates';
import { filterCondition } from './pg-conditions';
import { readPlan } from './read-plan';
import { facetsOf } from './pg-facets';
import { hydrateHits } from './hydrate';
import { refreshFixSearchRow } from './fix-search-row';
import type { SearchProvider } from './provider-types';

interface Ranked extends Rankable {
  matchedAll: boolean;
  row: CandidateRow;
}

const CANDIDATES = 30;

/** A broad query's facets are counted over its best-ranked candidates only (the page says so). */
const FACET_SAMPLE = 200;

/** Weights of the required clauses in level order: text clauses, then codes. */
function clauseWeights(analysed: AnalysedQuery): number[] {
  return [...analysed.hardText.map(() => WORD_WEIGHT), ...analysed.codes.map(() => CODE_WEIGHT)];
}

function toRanked(rows: CandidateRow[], analysed: AnalysedQuery, context: SearchContext): Ranked[] {
  const target = proximityTarget(context.machine);
  const weights = clauseWeights(analysed);
  const hardCount = weights.length;
  return rows.map((row) => {
    // Levels past the required clauses are the soft clauses and the side-by-side bonuses.
    const relevance = relevanceOf(row.levels.slice(0, hardCount), row.levels.slice(hardCount), weights);
    return {
      fixId: row.fix_id,
      relevance,
      proximity: proximityOf({ machineIds: row.machine_ids, chassisIds: row.chassis_ids, makerIds: row.maker_ids }, target),
      benchScore: row.bench_score,
      benchReports: row.report_count,
      matchedAll: matchesAll(row.levels.slice(0, hardCount)),
      row,
    };
  });
}

export function emptyResult(query: SearchQuery, context: SearchContext | null, analysed: AnalysedQuery | null): SearchResult {
  return {
    provider: 'postgres',
    hits: [],
    total: 0,
    totalIsLowerBound: false,
    totalMatchingAll: 0,
    page: query.page,
    perPage: query.perPage,
    pageCount: 1,
    facets: emptyFacets(),
    facetsFromSample: false,
    corrections: analysed?.plan.corrections ?? [],
    ignored: analysed?.plan.ignored ?? [],
    machine: context?.machine?.named ?? null,
  };
}

export class PostgresSearchProvider implements SearchProvider {
  readonly name = 'postgres' as const;
  constructor(private readonly knex: Knex) {}

  async search(query: SearchQuery): Promise<SearchResult> {
    const [analysed, context] = await Promise.all([analyseQuery(this.knex, query.text), resolveContext(this.knex, query)]);
    const browsing = query.text.trim() === '' && (query.machine !== undefined || Object.keys(query.filters).length > 0);
    if (!analysed.searchable && !browsing) return emptyResult(query, context, analysed);

    const filter = filterCondition(query, context, analysed);
    const window = query.page * query.perPage;
    // Candidates per stage: enough for the page and a margin; counts stop here ("30+ fixes").
    const limit = Math.max(CANDIDATES, window + 20);
    const hardCount = analysed.hardText.length + analysed.codes.length;
    const narrowed = (context.machine !== null && query.scope !== 'all') || Boolean(context.chassisId);
    const plan = await readPlan(this.knex, analysed, limit, narrowed);
    const full = await fullMatches(
      this.knex,
      analysed,
      filter,
      context.machine ? { machine: context.machine, scope: query.scope } : null,
      limit,
      plan,
    );
    let rows = full.rows;
    let total = full.total;
    if (!full.lowerBound && full.total < window && hardCount > 0) {
      const partial = (await partialMatches(this.knex, analysed, filter, limit, plan)).filter(
        (r) => !rows.some((f) => f.fix_id === r.fix_id),
      );
      rows = [...rows, ...partial];
      total = full.total + partial.length;
    }
    if (context.machine && query.scope !== 'machine' && hardCount > 0) {
      const near = (await nearPartialMatches(this.knex, analysed, filter, context.machine)).filter(
        (r) => !rows.some((f) => f.fix_id === r.fix_id),
      );
      rows = [...rows, ...near];
      total += near.length;
    }
    const ranked = rank(toRanked(rows, analysed, context));
    const pageRows = ranked.slice((query.page - 1) * query.perPage, window);
    // Facets are counted over the candidates: every match when the count is exact, the best ones otherwise.
    // They describe the fixes that match the whole query; partial matches only when nothing matches in full.
    const described = full.total > 0 ? ranked.filter((r) => r.matchedAll) : ranked;
    const facetRows = (full.lowerBound ? described.slice(0, FACET_SAMPLE) : described).map((r) => r.row);
    const [hits, facets] = await Promise.all([
      hydrateHits(this.knex, pageRows, highlightQuery(analysed)),
      total > 0 ? facetsOf(this.knex, facetRows) : Promise.resolve(null),
    ]);
    return {
      ...emptyResult(query, context, analysed),
      hits,
      total,
      totalIsLowerBound: full.lowerBound,
      totalMatchingAll: full.total,
      pageCount: Math.max(1, Math.min(MAX_PAGE, Math.ceil(total / query.perPage))),
      facets: facets ?? emptyFacets(),
      facetsFromSample: full.lowerBound,
    };
  }

  async index(fixId: number): Promise<void> {
    await refreshFixSearchRow(this.knex, fixId);
  }

  async remove(fixId: number): Promise<void> {
    await this.knex('fix_search').where({ fix_id: fixId }).delete();
  }
}
