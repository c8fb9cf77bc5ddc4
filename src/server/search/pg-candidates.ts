// Candidate fixes for a query, capped per stage and taken best bench score first, with the features ranking needs.
import type { Knex } from 'knex';
import type { CodeClause } from '@/lib/search/plan';
import type { SearchScope } from '@/lib/search/query-schema';
import { allClauses, anyClause, codeCondition, levelsExpression, matchQuery } from './pg-conditions';
import type { AnalysedQuery, CompiledTextClause } from './analyse';
import type { ResolvedMachine } from './context';
import { anyOf, frag, joinFragments, raw, type Fragment } from './sql-fragment';

export interface CandidateRow {
  fix_id: number;
  bench_score: number | null;
  report_count: number;
  machine_ids: number[];
  chassis_ids: number[];
  maker_ids: number[];
  device_types: string[];
  formats: string[];
  caution_kinds: string[];
  has_photos: boolean;
  /** Clause levels: hard text clauses, then codes, then soft clauses. */
  levels: number[];
}

/**
 * Two ways to read the best-scored matches. `walk` follows the bench-score index and tests each fix: quick
 * when matches are dense (a broad word), slow when they are rare, so it reads a bounded number of fixes.
 * `collect` gathers the matches through the text index and sorts them: quick when they are few. The
 * expression in collect's order only keeps PostgreSQL from walking the index.
 */
export type ReadWay = 'walk' | 'collect';
const WALK_ORDER = 'ORDER BY s.bench_score DESC NULLS LAST, s.fix_id';
const COLLECT_ORDER = 'ORDER BY coalesce(s.bench_score, -1) DESC, s.fix_id';
/** A first walk reads this many fixes: enough to finish a broad query, and a sample of how dense the matches are. */
export const PROBE = 400;
/** No walk of whole documents reads more than this (some 40 ms on a 2-core machine): past it, collecting is cheaper. */
export const MAX_WALK = 8000;
/** A walk of titles and symptoms reads them from the bench-order index, forty to a page: it may read further. */
export const MAX_SUMMARY_WALK = 32000;
/** Partial matches are a courtesy after the full ones: their walks stop early. */
const PARTIAL_WALK = 1500;
const SUMMARY_STAGE = 0;
/** The stage whose size tells how many fixes match in all: every match, best bench score first. */
const ANYWHERE_STAGE = 1;
const NEAR_STAGE = 2;

/** A stage's test, or a test per way when a walk applies it differently (title and symptoms from the index). */
type StageMatch = Fragment | Record<ReadWay, Fragment>;

function stage(filter: Fragment, matches: StageMatch, limit: number, way: ReadWay, number = NEAR_STAGE, budget = PROBE): Fragment {
  const match = 'sql' in matches ? matches : matches[way];
  if (way === 'collect') {
    return frag(
      `(SELECT s.fix_id, ${number} AS stage FROM fix_search s WHERE (${filter.sql}) AND (${match.sql}) ${COLLECT_ORDER} LIMIT ${limit})`,
      ...filter.bindings,
      ...match.bindings,
    );
  }
  // The match is a column of the bounded walk, tested row by row as the outer LIMIT pulls; rows come
  // out in the walk's order.
  return frag(
    `(SELECT w.fix_id, ${number} AS stage FROM (SELECT s.fix_id, (${match.sql}) AS hit FROM fix_search s WHERE (${filter.sql}) ${WALK_ORDER} LIMIT ${budget}) AS w WHERE w.hit LIMIT ${limit})`,
    ...match.bindings,
    ...filter.bindings,
  );
}

/** How each stage is read, from the estimated share of fixes matching in the summary and anywhere. */
export interface ReadPlan {
  summary: ReadWay;
  anywhere: ReadWay;
  /** For partial matches: each "all clauses but this one" stage, then the "any clause" stage. */
  allButOne: ReadWay[];
  anyClause: ReadWay;
  /** The hard clauses (text, then codes) matching fewest fixes, rarest first: the query's telling concepts. */
  rareClauses?: number[];
  /** Fixes in the search table (an estimate), to tell a walk that ran out from one that saw everything. */
  tableRows: number;
  /** Shares of matching fixes from which walking beats collecting, for the two main stages. */
  summaryWalkShare: number;
  anywhereWalkShare: number;
  /** The text clauses alone may match a large share of all fixes. */
  textBroad: boolean;
  /** The scope or a filter already narrows the search to few fixes (one machine, one chassis family). */
  narrowed: boolean;
}

/**
 * Rows near the named machine get stages of their own, so a broad query cannot crowd them out: matches in
 * the title or symptoms on the machine, its chassis family and its maker, and matches anywhere on the
 * machine itself. (A fix found only in the remedy of a sibling machine ranks below those anyway.) A
 * machine holds few fixes, so its stages are collected; a family's or maker's share may be large.
 */
function nearStages(
  filter: Fragment,
  inSummary: Fragment,
  anywhere: Fragment,
  near: NearMachine | null,
  limit: number,
  plan: ReadPlan,
): Fragment[] {
  // Scoped to the machine, every candidate is already its own or its family-wide fix: nothing to add.
  if (!near || near.scope === 'machine') return [];
  const { machine } = near;
  const within = (match: Fragment, level: Fragment, way: ReadWay) =>
    stage(filter, frag(`(${match.sql}) AND (${level.sql})`, ...match.bindings, ...level.bindings), limit, way);
  const onMachine = frag('s.machine_ids @> ARRAY[?]::int[]', machine.id);
  // Against a broad text, the machine's few fixes are read through its own index and tested one by one:
  // "IS TRUE" keeps PostgreSQL from also scanning the text index for tens of thousands of matches.
  const tested = (match: Fragment, way: ReadWay) => (way === 'walk' ? frag(`(${match.sql}) IS TRUE`, ...match.bindings) : match);
  const stages = [
    within(tested(inSummary, plan.summary), onMachine, 'collect'),
    within(tested(anywhere, plan.anywhere), onMachine, 'collect'),
  ];
  if (near.scope === 'family') return stages;
  stages.push(within(inSummary, frag('s.maker_ids @> ARRAY[?]::int[]', machine.makerId), plan.summary));
  if (machine.chassisId !== null) stages.push(within(inSummary, frag('s.chassis_ids @> ARRAY[?]::int[]', machine.chassisId), plan.summary));
  return stages;
}

/** The machine the reader named, with how widely the search reaches around it. */
export interface NearMachine {
  machine: ResolvedMachine;
  scope: SearchScope;
}

/** The stages' rows with their features, and how many rows each stage gave. */
async function featuresOf(
  knex: Knex,
  analysed: AnalysedQuery,
  stages: Fragment[],
  known: string,
): Promise<{ rows: CandidateRow[]; byStage: Map<number, number> }> {
  const union = joinFragments(stages, '\nUNION ALL\n');
  const levels = levelsExpression(analysed, known);
  const sql = frag(
    `WITH raw AS (${union.sql}),
          c AS (SELECT DISTINCT fix_id FROM raw),
          counted AS (SELECT coalesce(json_object_agg(stage, n), '{}'::json) AS by_stage FROM (SELECT stage, count(*) AS n FROM raw GROUP BY stage) AS x)
     SELECT s.fix_id, s.bench_score, s.report_count, s.machine_ids, s.chassis_ids, s.maker_ids, s.device_types, s.formats, s.caution_kinds, s.has_photos,
            ${levels.sql} AS levels, (SELECT by_stage FROM counted) AS by_stage
     FROM c JOIN fix_search s ON s.fix_id = c.fix_id`,
    ...union.bindings,
    ...levels.bindings,
  );
  const { rows } = (await raw(knex, sql)) as unknown as { rows: (CandidateRow & { by_stage: Record<string, number> })[] };
  const byStage = new Map(Object.entries(rows[0]?.by_stage ?? {}).map(([k, v]) => [Number(k), Number(v)]));
  return { rows, byStage };
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

/** How one stage is read: its test, the way the plan chose, and when walking on beats collecting. */
interface StageRead {
  number: number;
  match: StageMatch;
  way: ReadWay;
  walkShare: number;
  maxWalk: number;
}

/**
 * Reads stages together (with any extra stages, read once), then walks on or collects each stage whose
 * probe ran out of fixes to read: its hits tell how dense the matches are. Gives the rows and the final
 * number of rows per stage.
 */
async function readStages(
  knex: Knex,
  analysed: AnalysedQuery,
  filter: Fragment,
  limit: number,
  tableRows: number,
  reads: StageRead[],
  extra: Fragment[] = [],
): Promise<{ rows: CandidateRow[]; byStage: Map<number, number> }> {
  const stages = [...reads.map((r) => stage(filter, r.match, limit, r.way, r.number)), ...extra];
  // Every row here matched all hard clauses, so "found in the body" needs no second look at the document.
  const first = await featuresOf(knex, analysed, stages, 'TRUE');
  const ranOut = (r: StageRead) => r.way === 'walk' && (first.byStage.get(r.number) ?? 0) < limit && tableRows > PROBE;
  const again = (r: StageRead): Fragment => {
    const share = (first.byStage.get(r.number) ?? 0) / PROBE;
    const budget = share > 0 ? Math.ceil((1.5 * limit) / share) : Number.POSITIVE_INFINITY;
    return share >= r.walkShare && budget <= r.maxWalk
      ? stage(filter, r.match, limit, 'walk', r.number, budget)
      : stage(filter, r.match, limit, 'collect', r.number);
  };
  const redo = reads.filter(ranOut);
  if (redo.length === 0) return first;
  const second = await featuresOf(knex, analysed, redo.map(again), 'TRUE');
  const seen = new Set(first.rows.map((r) => r.fix_id));
  const byStage = new Map(first.byStage);
  for (const r of redo) byStage.set(r.number, second.byStage.get(r.number) ?? 0);
  return { rows: [...first.rows, ...second.rows.filter((r) => !seen.has(r.fix_id))], byStage };
}

/** Fixes matching every hard clause: in the title and symptoms, anywhere, and near the named machine. */
export async function fullMatches(
  knex: Knex,
  analysed: AnalysedQuery,
  filter: Fragment,
  near: NearMachine | null,
  limit: number,
  plan: ReadPlan,
): Promise<FullMatches> {
  // A code or a narrow scope picks few fixes through its own index; a broad text is then only tested.
  const narrowed = plan.narrowed || analysed.codes.length > 0;
  const testTextOnly = narrowed && plan.textBroad;
  const inSummary = allClauses(analysed, 'doc_a', analysed.hardText, analysed.codes, testTextOnly);
  const anywhere = allClauses(analysed, 'document', analysed.hardText, analysed.codes, testTextOnly);
  if (narrowed) plan = { ...plan, summary: 'collect', anywhere: 'collect' };
  const summary: StageRead = {
    number: SUMMARY_STAGE,
    match: { collect: inSummary, walk: allClauses(analysed, 'walked summary', analysed.hardText, analysed.codes, testTextOnly) },
    way: plan.summary,
    walkShare: plan.summaryWalkShare,
    maxWalk: MAX_SUMMARY_WALK,
  };
  const inDocument: StageRead = {
    number: ANYWHERE_STAGE,
    match: anywhere,
    way: plan.anywhere,
    walkShare: plan.anywhereWalkShare,
    maxWalk: MAX_WALK,
  };
  const read = (reads: StageRead[], extra: Fragment[] = []) => readStages(knex, analysed, filter, limit, plan.tableRows, reads, extra);
  if (near === null) {
    // With no machine named, a fix holding every clause in its title or symptoms always ranks above one that
    // holds some only in the body: when those fill the candidates, the bodies (large, read from the table's
    // side storage) are not read at all.
    const bySummary = await read([summary]);
    const found = bySummary.byStage.get(SUMMARY_STAGE) ?? 0;
    if (found >= limit) return { rows: bySummary.rows, total: found, lowerBound: true };
    const byDocument = await read([inDocument]);
    const seen = new Set(bySummary.rows.map((r) => r.fix_id));
    const counted = byDocument.byStage.get(ANYWHERE_STAGE) ?? 0;
    return {
      rows: [...bySummary.rows, ...byDocument.rows.filter((r) => !seen.has(r.fix_id))],
      total: counted,
      lowerBound: counted >= limit,
    };
  }
  const all = await read([summary, inDocument], nearStages(filter, inSummary, anywhere, near, limit, plan));
  const counted = all.byStage.get(ANYWHERE_STAGE) ?? 0;
  return { rows: all.rows, total: counted, lowerBound: counted >= limit };
}

/** Fixes matching all hard clauses but one, then any clause at all: shown after the full matches. */
export async function partialMatches(
  knex: Knex,
  analysed: AnalysedQuery,
  filter: Fragment,
  limit: number,
  plan: Pick<ReadPlan, 'allButOne' | 'anyClause' | 'rareClauses'>,
): Promise<CandidateRow[]> {
  const clauses: ({ text: CompiledTextClause } | { code: CodeClause })[] = [
    ...analysed.hardText.map((text) => ({ text })),
    ...analysed.codes.map((code) => ({ code })),
  ];
  const stages: Fragment[] = [];
  if (clauses.length >= 2 && clauses.length <= 6) {
    clauses.forEach((_, skip) => {
      const rest = clauses.filter((_c, i) => i !== skip);
      const text = rest.flatMap((c) => ('text' in c ? [c.text] : []));
      const codes = rest.flatMap((c) => ('code' in c ? [c.code] : []));
      stages.push(
        stage(filter, allClauses(analysed, 'document', text, codes), limit, plan.allButOne[skip] ?? 'collect', NEAR_STAGE, PARTIAL_WALK),
      );
    });
  }
  // Relaxation by concepts: fixes holding one of the query's rarest clauses, however common the others are,
  // so "beta … groaning" finds the Betamax fix that stalls even when "deck", "motor" and "dies" are everywhere.
  const rare = (plan.rareClauses ?? []).flatMap((i) => {
    const c = clauses[i];
    return c ? [c] : [];
  });
  if (rare.length > 0 && clauses.length >= 3) {
    const text = rare.flatMap((c) => ('text' in c ? [frag('s.document @@ ?::tsquery', matchQuery(c.text))] : []));
    const codes = rare.flatMap((c) => ('code' in c ? [codeCondition(c.code)] : []));
    stages.push(stage(filter, anyOf([...text, ...codes]), limit, 'collect', NEAR_STAGE));
  }
  stages.push(stage(filter, anyClause(analysed), limit, plan.anyClause, NEAR_STAGE, PARTIAL_WALK));
  const { rows } = await featuresOf(knex, analysed, stages, 'FALSE');
  return rows;
}

/** Near the named machine, partial matches are read however many full matches the whole catalogue has. */
const NEAR_PARTIAL_LIMIT = 40;

/**
 * Fixes on the named machine or its chassis family that match any clause: relaxation within reach of the
 * bench, so the machine's own fix is a candidate even when strangers match every word. The machine's and
 * family's fixes are found through their own indexes and the text is only tested on them.
 */
export async function nearPartialMatches(
  knex: Knex,
  analysed: AnalysedQuery,
  filter: Fragment,
  machine: ResolvedMachine,
): Promise<CandidateRow[]> {
  const any = anyClause(analysed);
  const near =
    machine.chassisId === null
      ? frag('s.machine_ids @> ARRAY[?]::int[]', machine.id)
      : frag('(s.machine_ids @> ARRAY[?]::int[] OR s.chassis_ids @> ARRAY[?]::int[])', machine.id, machine.chassisId);
  const stage = frag(
    `(SELECT s.fix_id, ${NEAR_STAGE} AS stage FROM fix_search s WHERE (${filter.sql}) AND ${near.sql} AND (${any.sql}) IS TRUE LIMIT ${NEAR_PARTIAL_LIMIT})`,
    ...filter.bindings,
    ...near.bindings,
    ...any.bindings,
  );
  const { rows } = await featuresOf(knex, analysed, [stage], 'FALSE');
  return rows;
}
