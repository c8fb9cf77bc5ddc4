// The blind search evaluation: loads the cases, runs them through a provider, and measures recall and reciprocal rank.
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Knex } from 'knex';
import type { SearchProvider } from '@/server/search/provider-types';
import type { SearchScope } from '@/lib/search/query-schema';

const here = (name: string) => fileURLToPath(new URL(name, import.meta.url));

interface QueryRow {
  id: string;
  query: string;
  /** "Maker MODEL" as the query writer saw it, or null when the technician named no machine. */
  machine: string | null;
  kind: string;
}

export interface EvalCase {
  /** Description id (d01…) and the place of the query among the file's queries, for messages. */
  id: string;
  n: number;
  query: string;
  machineLabel: string | null;
  kind: string;
  /** Slug of the fix the description was written from. */
  expect: string;
}

/**
 * The two sets of blind queries over the same descriptions: "tuned" (queries.json, the set search was tuned
 * against: its failures were read while choosing word families) and "held out" (queries-holdout.json, written
 * later by another blind writer; never looked at while search was first tuned, its failures were then read to
 * choose the general changes of the third round, so it is no longer an untouched figure: see the README), and
 * "fresh" (queries-fresh.json, a third blind writer's, written while that round was under way; whoever changes
 * search never reads its cases or its failures).
 */
export const querySets = {
  tuned: { file: './queries.json', dropped: './dropped.json', label: 'tuned set (search was tuned against it)' },
  holdout: { file: './queries-holdout.json', dropped: null, label: 'held-out set (second blind writer; read from the third round on)' },
  fresh: { file: './queries-fresh.json', dropped: null, label: 'fresh set (third blind writer; never read while changing search)' },
} as const;
export type QuerySet = keyof typeof querySets;

/** Every case of a query set joined to key.json, minus the ones dropped in its dropped list (see README). */
export function loadCases(set: QuerySet = 'tuned'): EvalCase[] {
  const files = querySets[set];
  const queries = JSON.parse(readFileSync(here(files.file), 'utf8')) as QueryRow[];
  const key = JSON.parse(readFileSync(here('./key.json'), 'utf8')) as Record<string, string>;
  const dropped = files.dropped ? (JSON.parse(readFileSync(here(files.dropped), 'utf8')) as { n: number; why: string }[]) : [];
  const droppedAt = new Set(dropped.map((d) => d.n));
  return queries.flatMap((q, n) => {
    const expect = key[q.id];
    if (!expect) throw new Error(`${files.file} case ${n} names description ${q.id}, which key.json lacks.`);
    return droppedAt.has(n) ? [] : [{ id: q.id, n, query: q.query, machineLabel: q.machine, kind: q.kind, expect }];
  });
}

/** The figures the regression test holds: top-3 recall per group, only ever raised. */
export interface SetFloor {
  noMachine: number;
  machineNamed: number;
}
/** The tuned set's floor at the top level (as first committed), the other sets' under their names. */
export interface Floor extends SetFloor {
  holdout: SetFloor;
  fresh: SetFloor;
}
export function readFloor(): Floor {
  return JSON.parse(readFileSync(here('./floor.json'), 'utf8')) as Floor;
}
export function floorOf(set: QuerySet, floor: Floor = readFloor()): SetFloor {
  return set === 'tuned' ? floor : floor[set];
}

export const goals = { noMachine: 0.9, machineNamed: 0.97 } as const;

/**
 * The machine slug for a case. The writer saw "Maker MODEL" without the region; when the model comes in
 * several regions, the region the fix was written for is taken (the technician has that unit on the bench).
 */
export async function machineSlugs(knex: Knex, cases: EvalCase[]): Promise<Map<string, string>> {
  const rows: { slug: string; label: string; fixes: string[] }[] = (
    await knex.raw(`
      SELECT m.slug, mk.name || ' ' || m.model_number AS label,
             ARRAY(SELECT f.slug FROM fix_machines fm JOIN fixes f ON f.id = fm.fix_id WHERE fm.machine_id = m.id) AS fixes
      FROM machines m JOIN makers mk ON mk.id = m.maker_id WHERE m.deleted_at IS NULL ORDER BY m.slug`)
  ).rows;
  const slugs = new Map<string, string>();
  for (const c of cases) {
    if (!c.machineLabel) continue;
    const candidates = rows.filter((r) => r.label.toLowerCase() === c.machineLabel!.toLowerCase());
    const chosen = candidates.find((r) => r.fixes.includes(c.expect)) ?? candidates[0];
    if (chosen) slugs.set(`${c.n}`, chosen.slug);
  }
  return slugs;
}

export type Group = 'noMachine' | 'machineNamed';

export interface CaseResult {
  case: EvalCase;
  group: Group;
  scope: SearchScope | null;
  /** 1-based rank of the intended fix in the first ten hits; null when it is not there. */
  rank: number | null;
  top: string[];
}

export interface Figures {
  cases: number;
  at1: number;
  at3: number;
  at10: number;
  mrr: number;
}

export function figuresOf(results: readonly CaseResult[]): Figures {
  const n = results.length;
  const share = (k: number) => (n === 0 ? 0 : results.filter((r) => r.rank !== null && r.rank <= k).length / n);
  const mrr = n === 0 ? 0 : results.reduce((sum, r) => sum + (r.rank ? 1 / r.rank : 0), 0) / n;
  return { cases: n, at1: share(1), at3: share(3), at10: share(10), mrr };
}

export interface EvalRun {
  /** Machine-named cases run in each scope asked for; cases without a machine run once. */
  results: CaseResult[];
  /** Cases whose fix is not a live fix here (e.g. the fixes written for the set have not been merged yet). */
  missingFix: EvalCase[];
  /** Cases whose machine is not in the catalogue. */
  missingMachine: EvalCase[];
}

export async function runEval(
  knex: Knex,
  provider: SearchProvider,
  cases: EvalCase[],
  scopes: readonly SearchScope[] = ['machine', 'all'],
  /** When given, hits outside these fixes are skipped before ranks are counted (fixes other tests wrote). */
  onlySlugs?: ReadonlySet<string>,
): Promise<EvalRun> {
  const live = new Set<string>(await knex('fix_search as s').join('fixes as f', 'f.id', 's.fix_id').pluck('f.slug'));
  const slugs = await machineSlugs(knex, cases);
  const run: EvalRun = { results: [], missingFix: [], missingMachine: [] };
  for (const c of cases) {
    if (!live.has(c.expect)) {
      run.missingFix.push(c);
      continue;
    }
    const machine = c.machineLabel ? slugs.get(`${c.n}`) : undefined;
    if (c.machineLabel && !machine) {
      run.missingMachine.push(c);
      continue;
    }
    for (const scope of machine ? scopes : [null]) {
      const perPage = onlySlugs ? 30 : 10;
      const result = await provider.search({ text: c.query, machine, scope: scope ?? 'machine', filters: {}, page: 1, perPage });
      const top = result.hits
        .map((h) => h.slug)
        .filter((slug) => !onlySlugs || onlySlugs.has(slug))
        .slice(0, 10);
      const at = top.indexOf(c.expect);
      run.results.push({ case: c, group: machine ? 'machineNamed' : 'noMachine', scope, rank: at >= 0 ? at + 1 : null, top });
    }
  }
  return run;
}

const pct = (x: number) => `${(100 * x).toFixed(1)} %`.padStart(7);

/** The table `npm run search:eval` prints for one provider. */
export function reportLines(provider: string, run: EvalRun): string[] {
  const rows: [string, CaseResult[], number | null][] = [
    ['no machine', run.results.filter((r) => r.group === 'noMachine'), goals.noMachine],
    ['machine named, scope machine', run.results.filter((r) => r.scope === 'machine'), goals.machineNamed],
    ['machine named, scope all', run.results.filter((r) => r.scope === 'all'), goals.machineNamed],
    ['machine named, scope family', run.results.filter((r) => r.scope === 'family'), goals.machineNamed],
  ];
  const lines = [`${provider}`, `  ${'group'.padEnd(30)} cases   top-1   top-3  top-10    MRR | goal top-3`];
  for (const [label, results, goal] of rows) {
    if (results.length === 0) continue;
    const f = figuresOf(results);
    const mark = goal === null ? '' : f.at3 >= goal ? ' met' : ' NOT met';
    lines.push(
      `  ${label.padEnd(30)} ${String(f.cases).padStart(5)} ${pct(f.at1)} ${pct(f.at3)} ${pct(f.at10)} ${f.mrr.toFixed(3).padStart(6)} | ≥ ${pct(goal ?? 0).trim()}${mark}`,
    );
  }
  if (run.missingFix.length)
    lines.push(
      `  not measured: ${run.missingFix.length} cases whose fix is not in this demo world (${[...new Set(run.missingFix.map((c) => c.expect))].join(', ')})`,
    );
  if (run.missingMachine.length)
    lines.push(
      `  not measured: ${run.missingMachine.length} cases whose machine is not in the catalogue (${[...new Set(run.missingMachine.map((c) => c.machineLabel))].join(', ')})`,
    );
  const failing = run.results.filter((r) => r.rank === null || r.rank > 3);
  lines.push(`  failing (intended fix not in the top three): ${failing.length}`);
  for (const r of failing) {
    const where = r.scope ? ` [${r.case.machineLabel}, scope ${r.scope}]` : '';
    lines.push(
      `    #${r.case.n} ${r.case.id} (${r.case.kind}) "${r.case.query}"${where} → ${r.case.expect} at ${r.rank ?? '>10'}; top: ${r.top.slice(0, 3).join(', ') || 'nothing'}`,
    );
  }
  return lines;
}
