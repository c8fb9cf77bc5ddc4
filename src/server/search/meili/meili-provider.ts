// The Meilisearch provider: the same query analysis as PostgreSQL, Meilisearch for text matching, our order on top.
import type { Knex } from 'knex';
import { MAX_PAGE, type SearchQuery } from '@/lib/search/query-schema';
import { compareRanked, proximityOf, relevanceFromScore, type Rankable } from '@/lib/search/ranking';
import type { SearchResult } from '@/lib/search/result-types';
import type { TextClause } from '@/lib/search/plan';
import { analyseQuery, highlightQuery, type AnalysedQuery } from '../analyse';
import { resolveContext, type ResolvedMachine } from '../context';
import { hydrateHits } from '../hydrate';
import { emptyResult } from '../pg-provider';
import type { SearchProvider } from '../provider-types';
import { sendSearchSync } from '../sync-queue';
import { buildFilter } from './filter';
import { facetsFromDistribution } from './meili-facets';
import type { MeiliIndex } from './index-client';
import type { MeiliFixDocument } from './documents';

/** Hits fetched beyond the page so our own order (closeness, bench score) has room to work. */
const RERANK_MARGIN = 50;
const MAX_HITS = 1000;

/** The words sent to Meilisearch: corrected words and family terms as typed; exact clauses quoted. */
export function meiliQueryText(analysed: AnalysedQuery): string {
  const clause = (c: TextClause) => (c.exact ? `"${c.label}"` : c.label);
  return [...analysed.hardText, ...analysed.softText].map((c) => clause(c.clause)).join(' ');
}

type Hit = MeiliFixDocument & { _rankingScore?: number };

function proximityFor(hit: Hit, machine: ResolvedMachine | null) {
  const target = machine
    ? { machineId: machine.named.slug, chassisId: machine.named.chassis?.slug ?? null, makerId: machine.makerSlug }
    : null;
  return proximityOf({ machineIds: hit.machines, chassisIds: hit.chassis, makerIds: hit.makers }, target);
}

export class MeiliSearchProvider implements SearchProvider {
  readonly name = 'meilisearch' as const;
  constructor(
    private readonly knex: Knex,
    private readonly meili: MeiliIndex,
  ) {}

  async search(query: SearchQuery): Promise<SearchResult> {
    const [analysed, context] = await Promise.all([analyseQuery(this.knex, query.text), resolveContext(this.knex, query)]);
    const browsing = query.text.trim() === '' && (query.machine !== undefined || Object.keys(query.filters).length > 0);
    const base = { ...emptyResult(query, context, analysed), provider: 'meilisearch' as const };
    if (!analysed.searchable && !browsing) return base;
    if (context.machineMissing || context.makerId === null || context.chassisId === null) return base;

    const window = query.page * query.perPage;
    const response = await this.meili.index.search<Hit>(meiliQueryText(analysed), {
      filter: buildFilter(query, context.machine?.named ?? null, analysed.codes),
      facets: ['makers', 'chassis', 'deviceTypes', 'formats', 'cautions', 'hasPhotos'],
      limit: Math.min(MAX_HITS, window + RERANK_MARGIN),
      offset: 0,
      showRankingScore: true,
      attributesToRetrieve: ['id', 'machines', 'chassis', 'makers', 'benchScore', 'reportCount'],
      // Relaxation as PostgreSQL's: when not every word matches, the commonest words are dropped first, so the
      // rarer concepts decide. A quoted phrase or a code no fix carries must be found, never dropped.
      matchingStrategy: analysed.hardText.some((c) => c.clause.exact) ? 'all' : 'frequency',
    });
    // The engine's score stands for the share of the query's concepts found, as PostgreSQL counts them.
    const concepts = analysed.hardText.length + analysed.codes.length;
    const ranked = response.hits
      .map((hit) => ({
        fixId: hit.id,
        relevance: relevanceFromScore(hit._rankingScore ?? 0, concepts),
        proximity: proximityFor(hit, context.machine),
        benchScore: hit.benchScore,
        benchReports: hit.reportCount,
        matchedAll: true,
        hit,
      }))
      .sort((a: Rankable, b: Rankable) => compareRanked(a, b));
    const pageRows = ranked.slice((query.page - 1) * query.perPage, window);
    const total = response.estimatedTotalHits ?? response.hits.length;
    const [hits, facets] = await Promise.all([
      // Highlights come from the same analysis as PostgreSQL's, so snippets keep whole symptoms with either provider.
      hydrateHits(this.knex, pageRows, highlightQuery(analysed)),
      facetsFromDistribution(this.knex, response.facetDistribution ?? {}),
    ]);
    return {
      ...base,
      hits,
      total: Math.min(total, MAX_HITS),
      totalIsLowerBound: total > MAX_HITS,
      totalMatchingAll: Math.min(total, MAX_HITS),
      pageCount: Math.max(1, Math.min(MAX_PAGE, Math.ceil(Math.min(total, MAX_HITS) / query.perPage))),
      facets,
    };
  }

  /** Queued, not sent: the worker applies it when Meilisearch answers, however long that takes. */
  async index(fixId: number): Promise<void> {
    await sendSearchSync(this.knex, { fixId });
  }

  async remove(fixId: number): Promise<void> {
    await sendSearchSync(this.knex, { fixId });
  }
}
