// Live fixes that look like a symptom about to be written up, for the machine or its chassis family.
import type { Knex } from 'knex';
import { clauseLevel, relevanceOf, proximityOf, CODE_WEIGHT, WORD_WEIGHT } from '@/lib/search/ranking';
import { foldText } from '@/lib/search/tokens';
import type { SearchQuery } from '@/lib/search/query-schema';
import type { SimilarFix } from '@/lib/search/result-types';
import { analyseQuery } from './analyse';
import { proximityTarget, type ResolvedChassis, type ResolvedMachine } from './context';
import { fullMatches, partialMatches } from './pg-candidates';
import { filterCondition } from './pg-conditions';
import { pgArray } from './sql-fragment';

/**
 * A duplicate shows in the title and symptoms: a clause found there counts fully, one found only in the
 * cause or remedy counts a quarter.
 */
function summaryShare(levels: number[], weights: number[]): number {
  return levels.reduce(
    (sum, level, i) => sum + (weights[i] ?? 1) * (level >= clauseLevel.summaryAlternative ? 1 : level === clauseLevel.body ? 0.25 : 0),
    0,
  );
}

/** Below this a fix is only vaguely like the symptom, and warning about it would be noise. */
const LIKENESS_FLOOR = 0.5;
const MAX_SIMILAR = 5;

/** Like fixes for a machine (its own and its family's), or for a chassis family (any fix in the family). */
export async function similarFixes(knex: Knex, symptom: string, about: ResolvedMachine | ResolvedChassis): Promise<SimilarFix[]> {
  const analysed = await analyseQuery(knex, symptom);
  if (!analysed.searchable) return [];
  const machine = 'named' in about ? about : null;
  const query: SearchQuery = {
    text: symptom,
    ...(machine ? { machine: machine.named.slug } : {}),
    scope: machine?.chassisId === null ? 'machine' : 'family',
    filters: {},
    page: 1,
    perPage: MAX_SIMILAR,
  };
  const chassisId = 'named' in about ? undefined : about.chassisId;
  const filter = filterCondition(query, { machine, machineMissing: false, makerId: undefined, chassisId }, analysed);
  const full = await fullMatches(knex, analysed, filter, machine ? { machine, scope: query.scope } : null, 50, {
    summary: 'collect',
    anywhere: 'collect',
    allButOne: [],
    anyClause: 'collect',
    tableRows: 0,
    summaryWalkShare: 1,
    anywhereWalkShare: 1,
    textBroad: false,
    narrowed: true,
  });
  const rows =
    full.rows.length >= MAX_SIMILAR
      ? full.rows
      : [
          ...full.rows,
          ...(await partialMatches(knex, analysed, filter, 50, { allButOne: [], anyClause: 'collect' })).filter(
            (r) => !full.rows.some((f) => f.fix_id === r.fix_id),
          ),
        ];
  if (rows.length === 0) return [];
  const weights = [...analysed.hardText.map(() => WORD_WEIGHT), ...analysed.codes.map(() => CODE_WEIGHT)];
  const fullWeight = weights.reduce((a, b) => a + b, 0) || 1;
  const target = proximityTarget(machine);
  const details = await knex.raw<{
    rows: {
      fix_id: number;
      slug: string;
      title: string;
      symptoms: string;
      bench_score: number | null;
      report_count: number;
      likeness: number;
      machines: string[];
    }[];
  }>(
    `SELECT s.fix_id, f.slug, s.title, s.symptoms, s.bench_score, s.report_count,
       greatest(similarity(s.title, ?), word_similarity(?, s.symptoms)) AS likeness,
       ARRAY(SELECT mk.name || ' ' || m.model_number || ' (' || m.region || ')' FROM machines m JOIN makers mk ON mk.id = m.maker_id
             WHERE m.id = ANY(s.machine_ids) ORDER BY mk.name, m.model_number, m.region) AS machines
     FROM fix_search s JOIN fixes f ON f.id = s.fix_id WHERE s.fix_id = ANY(?::int[])`,
    [foldText(symptom), foldText(symptom), pgArray(rows.map((r) => r.fix_id))],
  );
  const byId = new Map(details.rows.map((d) => [d.fix_id, d]));
  return rows
    .flatMap((row) => {
      const d = byId.get(row.fix_id);
      if (!d) return [];
      const found = summaryShare(row.levels.slice(0, weights.length), weights) / fullWeight;
      // Between equally alike fixes, the closer wording first: typed words over family terms, side by side.
      const bonus = relevanceOf(row.levels.slice(0, weights.length), row.levels.slice(weights.length)).quality;
      const proximity = proximityOf({ machineIds: row.machine_ids, chassisIds: row.chassis_ids, makerIds: row.maker_ids }, target);
      return [
        {
          slug: d.slug,
          title: d.title,
          symptoms: d.symptoms.split(' . ').filter(Boolean),
          machines: d.machines,
          sameMachine: proximity === 3,
          likeness: Math.round(Math.max(found, Number(d.likeness)) * 100) / 100,
          benchScore: { score: d.bench_score, reports: d.report_count },
          bonus,
        },
      ];
    })
    .filter((f) => f.likeness >= LIKENESS_FLOOR)
    .sort(
      (a, b) =>
        b.likeness - a.likeness || b.bonus - a.bonus || Number(b.sameMachine) - Number(a.sameMachine) || a.slug.localeCompare(b.slug),
    )
    .slice(0, MAX_SIMILAR)
    .map(({ bonus: _bonus, ...fix }) => fix);
}
