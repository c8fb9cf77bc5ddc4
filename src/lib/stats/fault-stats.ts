// Turns bench report counts into chart rows: outcomes in a fixed order, the most reported faults first.
import { benchOutcomeLabels, benchOutcomes, type BenchOutcome } from '@/lib/schemas/bench-report';
import type { BarDatum, BarTone } from './bar-chart';

export type OutcomeTally = Record<BenchOutcome, number>;

export function emptyOutcomeTally(): OutcomeTally {
  return { fixed: 0, partly: 0, not_fixed: 0, came_back: 0 };
}

const outcomeTones: Record<BenchOutcome, BarTone> = { fixed: 'teal', partly: 'teal-dark', not_fixed: 'brick', came_back: 'amber' };

/** Adds rows of { outcome, count } into a tally; unknown outcomes (bad data) are skipped, not counted. */
export function tallyOutcomes(rows: readonly { outcome: string; count: number | string }[]): OutcomeTally {
  const tally = emptyOutcomeTally();
  for (const row of rows) {
    if ((benchOutcomes as readonly string[]).includes(row.outcome)) tally[row.outcome as BenchOutcome] += Number(row.count) || 0;
  }
  return tally;
}

export function totalOf(tally: OutcomeTally): number {
  return benchOutcomes.reduce((sum, outcome) => sum + tally[outcome], 0);
}

/** One bar per outcome, always all four and always in the same order, so charts compare at a glance. */
export function outcomeBars(tally: OutcomeTally): BarDatum[] {
  return benchOutcomes.map((outcome) => ({ label: benchOutcomeLabels[outcome], value: tally[outcome], tone: outcomeTones[outcome] }));
}

export interface FaultCount {
  slug: string;
  title: string;
  reports: number;
}

/** The `limit` fixes with the most reports; ties by title so the order never flickers between loads. */
export function topFaults(rows: readonly FaultCount[], limit = 5): FaultCount[] {
  return rows
    .filter((r) => r.reports > 0)
    .slice()
    .sort((a, b) => b.reports - a.reports || a.title.localeCompare(b.title, 'en') || a.slug.localeCompare(b.slug))
    .slice(0, Math.max(0, limit));
}

export function faultBars(rows: readonly FaultCount[]): BarDatum[] {
  return rows.map((r) => ({ label: r.title, value: r.reports, href: `/fixes/${r.slug}` }));
}
