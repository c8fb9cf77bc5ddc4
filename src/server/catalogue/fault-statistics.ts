// Fault statistics from bench reports: most reported faults and outcomes per machine or chassis family.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { tallyOutcomes, topFaults, totalOf, type FaultCount, type OutcomeTally } from '@/lib/stats/fault-stats';

export interface FaultStatistics {
  /** The most reported fixes, at most five, most first. */
  topFaults: FaultCount[];
  outcomes: OutcomeTally;
  /** Reports counted in `outcomes`. */
  reports: number;
}

/**
 * Counted reports on live fixes: a fix author's reports on their own fix are shown on the fix page but
 * counted nowhere, here included.
 */
function countedReports(knex: Knex): Knex.QueryBuilder {
  return knex('bench_reports as b')
    .join('fixes as f', 'f.id', 'b.fix_id')
    .join('machines as m', 'm.id', 'b.machine_id')
    .whereNull('f.deleted_at')
    .whereNull('f.hidden_at')
    .whereRaw('b.member_id <> f.created_by');
}

async function statisticsWhere(scope: (q: Knex.QueryBuilder) => void): Promise<FaultStatistics> {
  const knex = db();
  const faultQuery = countedReports(knex)
    .join('revisions as r', 'r.id', 'f.current_revision_id')
    .groupBy('f.id', 'f.slug', 'r.title')
    .select('f.slug', 'r.title', knex.raw('count(*) AS reports'));
  scope(faultQuery);
  const outcomeQuery = countedReports(knex).groupBy('b.outcome').select('b.outcome', knex.raw('count(*) AS count'));
  scope(outcomeQuery);
  const [faultRows, outcomeRows] = await Promise.all([faultQuery, outcomeQuery]);
  const outcomes = tallyOutcomes(outcomeRows);
  return {
    topFaults: topFaults(
      faultRows.map((r: { slug: string; title: string; reports: string }) => ({
        slug: r.slug,
        title: r.title,
        reports: Number(r.reports),
      })),
    ),
    outcomes,
    reports: totalOf(outcomes),
  };
}

/** Reports made on this machine. */
export function machineStatistics(machineId: number): Promise<FaultStatistics> {
  return statisticsWhere((q) => q.where('b.machine_id', machineId));
}

/** Reports made on any machine of the chassis family. */
export function chassisStatistics(chassisId: number): Promise<FaultStatistics> {
  return statisticsWhere((q) => q.where('m.chassis_family_id', chassisId));
}

export interface FamilyCounts {
  /** Live fixes written for the family, or for one of its machines. */
  fixes: number;
  /** Counted bench reports on the family's machines. */
  reports: number;
}

/** Counts per chassis family slug of one maker, for the maker page. */
export async function familyCountsOfMaker(makerId: number): Promise<Map<string, FamilyCounts>> {
  const knex = db();
  const rows = await knex('chassis_families as c')
    .whereNull('c.deleted_at')
    .where('c.maker_id', makerId)
    .select(
      'c.slug',
      knex.raw(
        `(SELECT count(DISTINCT f.id) FROM fixes f
           WHERE f.deleted_at IS NULL AND f.hidden_at IS NULL AND f.current_revision_id IS NOT NULL
             AND (EXISTS (SELECT 1 FROM fix_chassis fc WHERE fc.fix_id = f.id AND fc.chassis_family_id = c.id)
               OR EXISTS (SELECT 1 FROM fix_machines fm JOIN machines m ON m.id = fm.machine_id
                          WHERE fm.fix_id = f.id AND m.chassis_family_id = c.id))) AS fixes`,
      ),
      knex.raw(
        `(SELECT count(*) FROM bench_reports b JOIN fixes f ON f.id = b.fix_id JOIN machines m ON m.id = b.machine_id
           WHERE m.chassis_family_id = c.id AND f.deleted_at IS NULL AND f.hidden_at IS NULL
             AND b.member_id <> f.created_by) AS reports`,
      ),
    );
  return new Map(rows.map((r) => [r.slug as string, { fixes: Number(r.fixes), reports: Number(r.reports) }]));
}
