// Bench score per fix from its bench reports: counts by outcome and the Wilson lower bound over them.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { benchScore } from '@/lib/bench/bench-score';

export interface BenchScoreView {
  /** Wilson lower bound at 95 %, or null when no report counts yet. Never shown without `counted`. */
  score: number | null;
  /** Reports that count (the fix author's own are shown but not counted). */
  counted: number;
  fixed: number;
  partly: number;
  notFixed: number;
  cameBack: number;
  onCurrentRevision: number;
  onOlderRevisions: number;
  ownReports: number;
}

export function emptyBenchScore(): BenchScoreView {
  return {
    score: null,
    counted: 0,
    fixed: 0,
    partly: 0,
    notFixed: 0,
    cameBack: 0,
    onCurrentRevision: 0,
    onOlderRevisions: 0,
    ownReports: 0,
  };
}

interface CountRow {
  fix_id: number;
  outcome: 'fixed' | 'partly' | 'not_fixed' | 'came_back';
  on_current: boolean;
  own: boolean;
  n: string;
}

/** `knex` defaults to the app's connection; the seed passes its own. */
export async function benchScoresFor(fixIds: number[], knex: Knex = db()): Promise<Map<number, BenchScoreView>> {
  const scores = new Map<number, BenchScoreView>();
  if (fixIds.length === 0) return scores;
  const rows: CountRow[] = await knex('bench_reports as b')
    .join('fixes as f', 'f.id', 'b.fix_id')
    .whereIn('b.fix_id', fixIds)
    .groupBy('b.fix_id', 'b.outcome', 'on_current', 'own')
    .select(
      'b.fix_id',
      'b.outcome',
      knex.raw('(b.revision_id = f.current_revision_id) AS on_current'),
      knex.raw('(b.member_id = f.created_by) AS own'),
      knex.raw('count(*) AS n'),
    );
  const tallies = new Map<number, { view: BenchScoreView; current: Counts; older: Counts }>();
  for (const row of rows) {
    let t = tallies.get(row.fix_id);
    if (!t) tallies.set(row.fix_id, (t = { view: emptyBenchScore(), current: zero(), older: zero() }));
    const n = Number(row.n);
    if (row.own) {
      t.view.ownReports += n;
      continue;
    }
    const key = ({ fixed: 'fixed', partly: 'partly', not_fixed: 'notFixed', came_back: 'cameBack' } as const)[row.outcome];
    t.view[key] += n;
    t.view.counted += n;
    (row.on_current ? t.current : t.older)[key] += n;
    if (row.on_current) t.view.onCurrentRevision += n;
    else t.view.onOlderRevisions += n;
  }
  for (const [fixId, t] of tallies) {
    const result = benchScore({ current: t.current, older: t.older });
    // The counts come from the database and are always valid input; a failure would be a bug, shown as no score.
    t.view.score = result.ok ? result.value.score : null;
    scores.set(fixId, t.view);
  }
  return scores;
}

interface Counts {
  fixed: number;
  partly: number;
  notFixed: number;
  cameBack: number;
}
const zero = (): Counts => ({ fixed: 0, partly: 0, notFixed: 0, cameBack: 0 });

export interface RevisionBenchCounts {
  revisionNumber: number;
  isCurrent: boolean;
  fixed: number;
  partly: number;
  notFixed: number;
  cameBack: number;
  /** Reports by the fix's author on this revision: shown, not counted. */
  ownReports: number;
}

/** Counts per proofed revision a report was made on, newest revision first; the public breakdown of a score. */
export async function benchCountsByRevision(fixId: number): Promise<RevisionBenchCounts[]> {
  const rows: (CountRow & { number: number })[] = await db()('bench_reports as b')
    .join('fixes as f', 'f.id', 'b.fix_id')
    .join('revisions as r', 'r.id', 'b.revision_id')
    .where('b.fix_id', fixId)
    .groupBy('r.number', 'b.outcome', 'on_current', 'own')
    .select(
      'r.number',
      'b.outcome',
      db().raw('(b.revision_id = f.current_revision_id) AS on_current'),
      db().raw('(b.member_id = f.created_by) AS own'),
      db().raw('count(*) AS n'),
    )
    .orderBy('r.number', 'desc');
  const byNumber = new Map<number, RevisionBenchCounts>();
  for (const row of rows) {
    let counts = byNumber.get(row.number);
    if (!counts)
      byNumber.set(
        row.number,
        (counts = { revisionNumber: row.number, isCurrent: row.on_current, fixed: 0, partly: 0, notFixed: 0, cameBack: 0, ownReports: 0 }),
      );
    const n = Number(row.n);
    if (row.own) counts.ownReports += n;
    else counts[outcomeKey[row.outcome]] += n;
  }
  return [...byNumber.values()];
}

const outcomeKey = { fixed: 'fixed', partly: 'partly', not_fixed: 'notFixed', came_back: 'cameBack' } as const;
