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

/** Broad queries are counted this far and no further ("1000+ fixes"). */
export const COUNT_CAP = 1000;
const ORDER = 'ORDER BY s.bench_score DESC NULLS LAST, s.fix_id';

function stage(filter: Fragment, match: Fragment, limit: number): Fragment {
  return frag(`(SELECT s.fix_id FROM fix_search s WHERE (${filter.sql}) AND (${match.sql}) ${ORDER} LIMIT ${limit})`, ...filter.bindings, ...match.bindings);
}

/** Rows near the named machine get stages of their own, so a broad query cannot crowd them out. */
function nearStages(filter: Fragment, match: Fragment, machine: ResolvedMachine | null, limit: number): Fragment[] {
  if (!machine) return [];
  const near = [frag('s.machine_ids @> ARRAY[?]::int[]', machine.id), frag('s.maker_ids @> ARRAY[?]::int[]', machine.makerId)];
  if (machine.chassisId !== null) near.push(frag('s.chassis_ids @> ARRAY[?]::int[]', machine.chassisId));
  return near.map((n) => stage(filter, frag(`(${match.sql}) AND (${n.sql})`, ...match.bindings, ...n.bindings), limit));
}

async function featuresOf(knex: Knex, analysed: AnalysedQuery, stages: Fragment[], known: string, extra = frag('')): Promise<{ rows: (CandidateRow & { total?: string })[] }> {
  const union = joinFragments(stages, '\nUNION\n');
  const levels = levelsExpression(analysed, known);
  const sql = frag(
    `WITH c AS (${union.sql}) ${extra.sql}
     SELECT s.fix_id, s.bench_score, s.machine_ids, s.chassis_ids, s.maker_ids, ${levels.sql} AS levels${extra.sql ? ', (SELECT n FROM counted) AS total' : ''}
     FROM c JOIN fix_search s ON s.fix_id = c.fix_id`,
    ...union.bindings,
    ...extra.bindings,
    ...levels.bindings,
  );
  return raw(knex, sql) as unknown as Promise<{ rows: (CandidateRow & { total?: string })[] }>;
}

/** Fixes matching every hard clause: in the title and symptoms, anywhere, and near the named machine. */
export async function fullMatches(knex: Knex, analysed: AnalysedQuery, filter: Fragment, machine: ResolvedMachine | null, limit: number): Promise<{ rows: CandidateRow[]; total: number }> {
  const inSummary = allClauses(analysed, 'doc_a');
  const anywhere = allClauses(analysed, 'document');
  const stages = [stage(filter, inSummary, limit), stage(filter, anywhere, limit), ...nearStages(filter, inSummary, machine, limit), ...nearStages(filter, anywhere, machine, limit)];
  const counted = frag(
    `, counted AS (SELECT count(*) AS n FROM (SELECT 1 FROM fix_search s WHERE (${filter.sql}) AND (${anywhere.sql}) LIMIT ${COUNT_CAP + 1}) AS t)`,
    ...filter.bindings,
    ...anywhere.bindings,
  );
  // Every row here matched all hard clauses, so "found in the body" needs no second look at the document.
  const { rows } = await featuresOf(knex, analysed, stages, 'TRUE', counted);
  const total = rows.length ? Number(rows[0]?.total ?? 0) : 0;
  return { rows, total };
}

/** Fixes matching all hard clauses but one, then any clause at all: shown after the full matches. */
export async function partialMatches(knex: Knex, analysed: AnalysedQuery, filter: Fragment, limit: number): Promise<CandidateRow[]> {
  const clauses: ({ text: CompiledTextClause } | { code: CodeClause })[] = [...analysed.hardText.map((text) => ({ text })), ...analysed.codes.map((code) => ({ code }))];
  const stages: Fragment[] = [];
  if (clauses.length >= 2 && clauses.length <= 6) {
    clauses.forEach((_, skip) => {
      const rest = clauses.filter((_c, i) => i !== skip);
      const text = rest.flatMap((c) => ('text' in c ? [c.text] : []));
      const codes = rest.flatMap((c) => ('code' in c ? [c.code] : []));
      stages.push(stage(filter, allClauses(analysed, 'document', text, codes), limit));
    });
  }
  stages.push(stage(filter, anyClause(analysed), limit));
  const { rows } = await featuresOf(knex, analysed, stages, 'FALSE');
  return rows;
}
