// Candidate fixes for a query, capped per stage and taken best bench score first, with the features ranking needs.
import type { Knex } from 'knex';
import type { CodeClause } from '@/lib/search/plan';
import { allClauses, anyClause, levelsExpression } from './pg-conditions';
import type { AnalysedQuery, CompiledTextClause } from './analyse';
import type { ResolvedMachine } from './context';
import { frag, joinFragments, raw, type Fragment } from './sql-fragment';

export interface CandidateRow {
  fix_id: number;
  bench_score: number | null;
  machine_ids: number[];
  chassis_ids: number[];
  maker_ids: number[];
  /** Clause levels: hard text clauses, then codes, then soft clauses. */
  levels: number[];
}

/**
 * Two ways to read the best-scored matches. `walk` follows the bench-score index and tests each fix: quick
 * when matches are dense (a broad word), ruinous when they are rare. `collect` gathers the matches through
 * the text index and sorts them: quick when they are few. The same order either way; the expression in
 * `collect` only keeps PostgreSQL from walking the index.
 */
const ORDER = { walk: 'ORDER BY s.bench_score DESC NULLS LAST, s.fix_id', collect: 'ORDER BY coalesce(s.bench_score, -1) DESC, s.fix_id' } as const;
export type ReadWay = keyof typeof ORDER;
/** The stage whose size tells how many fixes match in all: every match, best bench score first. */
const ANYWHERE_STAGE = 1;

function stage(filter: Fragment, match: Fragment, limit: number, way: ReadWay, number = 0): Fragment {
  return frag(`(SELECT s.fix_id, ${number} AS stage FROM fix_search s WHERE (${filter.sql}) AND (${match.sql}) ${ORDER[way]} LIMIT ${limit})`, ...filter.bindings, ...match.bindings);
}

/** How each stage is read, from the estimated share of fixes matching in the summary and anywhere. */
export interface ReadPlan {
  summary: ReadWay;
  anywhere: ReadWay;
  /** For partial matches: each "all clauses but this one" stage, then the "any clause" stage. */
  allButOne: ReadWay[];
  anyClause: ReadWay;
}

/**
 * Rows near the named machine get stages of their own, so a broad query cannot crowd them out. A machine
 * or a chassis family holds few fixes, so those are collected; a maker's share is large enough to walk.
 */
function nearStages(filter: Fragment, match: Fragment, machine: ResolvedMachine | null, limit: number, way: ReadWay): Fragment[] {
  if (!machine) return [];
  const near: [Fragment, ReadWay][] = [
    [frag('s.machine_ids @> ARRAY[?]::int[]', machine.id), 'collect'],
    [frag('s.maker_ids @> ARRAY[?]::int[]', machine.makerId), way],
  ];
  if (machine.chassisId !== null) near.push([frag('s.chassis_ids @> ARRAY[?]::int[]', machine.chassisId), 'collect']);
  return near.map(([n, nearWay]) => stage(filter, frag(`(${match.sql}) AND (${n.sql})`, ...match.bindings, ...n.bindings), limit, nearWay));
}

/** The stages' rows with their features; `counted` is how many rows the anywhere stage gave. */
async function featuresOf(knex: Knex, analysed: AnalysedQuery, stages: Fragment[], known: string): Promise<{ rows: (CandidateRow & { counted: string })[] }> {
  const union = joinFragments(stages, '\nUNION ALL\n');
  const levels = levelsExpression(analysed, known);
  const sql = frag(
    `WITH raw AS (${union.sql}),
          c AS (SELECT DISTINCT fix_id FROM raw),
          counted AS (SELECT count(*) AS n FROM raw WHERE stage = ${ANYWHERE_STAGE})
     SELECT s.fix_id, s.bench_score, s.machine_ids, s.chassis_ids, s.maker_ids, ${levels.sql} AS levels, (SELECT n FROM counted) AS counted
     FROM c JOIN fix_search s ON s.fix_id = c.fix_id`,
    ...union.bindings,
    ...levels.bindings,
  );
  return raw(knex, sql) as unknown as Promise<{ rows: (CandidateRow & { counted: string })[] }>;
}

export interface FullMatches {
  rows: CandidateRow[];
  /** How many fixes match every hard clause; a lower bound when `lowerBound`. */
  total: number;
  /**
   * True when there are more matches than the stage limit: a broad query is not counted to the end
   * (counting 60,000 matches costs more than ranking the best of them), and its facets come from a sample.
   */
  lowerBound: boolean;
}

/** Fixes matching every hard clause: in the title and symptoms, anywhere, and near the named machine. */
export async function fullMatches(knex: Knex, analysed: AnalysedQuery, filter: Fragment, machine: ResolvedMachine | null, limit: number, plan: ReadPlan): Promise<FullMatches> {
  const inSummary = allClauses(analysed, 'doc_a');
  const anywhere = allClauses(analysed, 'document');
  const stages = [
    stage(filter, inSummary, limit, plan.summary),
    stage(filter, anywhere, limit, plan.anywhere, ANYWHERE_STAGE),
    ...nearStages(filter, inSummary, machine, limit, plan.summary),
    ...nearStages(filter, anywhere, machine, limit, plan.anywhere),
  ];
  // Every row here matched all hard clauses, so "found in the body" needs no second look at the document.
  const { rows } = await featuresOf(knex, analysed, stages, 'TRUE');
  const counted = rows.length ? Number(rows[0]?.counted ?? 0) : 0;
  return { rows, total: counted, lowerBound: counted >= limit };
}

/** Fixes matching all hard clauses but one, then any clause at all: shown after the full matches. */
export async function partialMatches(knex: Knex, analysed: AnalysedQuery, filter: Fragment, limit: number, plan: Pick<ReadPlan, 'allButOne' | 'anyClause'>): Promise<CandidateRow[]> {
  const clauses: ({ text: CompiledTextClause } | { code: CodeClause })[] = [...analysed.hardText.map((text) => ({ text })), ...analysed.codes.map((code) => ({ code }))];
  const stages: Fragment[] = [];
  if (clauses.length >= 2 && clauses.length <= 6) {
    clauses.forEach((_, skip) => {
      const rest = clauses.filter((_c, i) => i !== skip);
      const text = rest.flatMap((c) => ('text' in c ? [c.text] : []));
      const codes = rest.flatMap((c) => ('code' in c ? [c.code] : []));
      stages.push(stage(filter, allClauses(analysed, 'document', text, codes), limit, plan.allButOne[skip] ?? 'collect'));
    });
  }
  stages.push(stage(filter, anyClause(analysed), limit, plan.anyClause));
  const { rows } = await featuresOf(knex, analysed, stages, 'FALSE');
  return rows;
}
