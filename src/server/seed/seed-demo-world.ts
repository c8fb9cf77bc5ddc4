// Seeds the whole invented demo world; safe to run again (existing rows are kept).
import type { Knex } from 'knex';
import { seedCatalogue } from './seed-catalogue';
import { seedFixes } from './seed-fixes';
import { seedBenchReports } from './seed-bench-reports';
import { refreshBenchScoreColumns } from '../search/bench-score-columns';

export async function seedDemoWorld(knex: Knex): Promise<{ fixesCreated: number; reportsCreated: number }> {
  const ids = await seedCatalogue(knex);
  const { created } = await seedFixes(knex, ids);
  const reportsCreated = await seedBenchReports(knex, ids);
  await refreshBenchScoreColumns(knex);
  return { fixesCreated: created, reportsCreated };
}
