// The blind evaluation set as a regression floor: top-3 recall may not fall below the committed figures.
import { describe, expect, it } from 'vitest';
import { db } from '@/server/core/db';
import { PostgresSearchProvider } from '@/server/search/pg-provider';
import { demoFixes } from '@/server/seed/demo/fixes';
import { figuresOf, floorOf, loadCases, reportLines, runEval, type QuerySet } from '../search-eval/eval';

describe('the blind evaluation sets (tests/search-eval)', () => {
  it.each<QuerySet>(['tuned', 'holdout', 'fresh'])(
    'keeps top-3 recall on the %s set at or above the committed floor, with and without a machine named',
    async (set) => {
      const knex = db();
      // Scope "all" is the harder one for machine-named cases: every machine competes with the one named.
      // Other test files write fixes into the same database: ranks are counted among the demo world's fixes.
      const demo = new Set(demoFixes.map((f) => f.slug));
      const run = await runEval(knex, new PostgresSearchProvider(knex), loadCases(set), ['all'], demo);
      const floor = floorOf(set);
      const noMachine = figuresOf(run.results.filter((r) => r.group === 'noMachine'));
      const named = figuresOf(run.results.filter((r) => r.group === 'machineNamed'));
      const table = reportLines('PostgreSQL provider', run).join('\n');
      expect(noMachine.cases, table).toBeGreaterThan(0);
      expect(named.cases, table).toBeGreaterThan(0);
      expect(noMachine.at3, table).toBeGreaterThanOrEqual(floor.noMachine);
      expect(named.at3, table).toBeGreaterThanOrEqual(floor.machineNamed);
    },
    120_000,
  );
});
