// Copies each fix's bench score and report count into fix_search, where ranking reads it.
import type { Knex } from 'knex';
import { benchScoresFor } from '../bench-work/bench-scores';
import { queueSearchSync } from './sync-queue';

export async function refreshBenchScoreColumns(knex: Knex, fixIds?: number[]): Promise<void> {
  const ids: number[] = fixIds ?? (await knex('fix_search').pluck('fix_id'));
  const scores = await benchScoresFor(ids, knex);
  for (const id of ids) {
    const s = scores.get(id);
    const changed = await knex('fix_search')
      .where({ fix_id: id })
      .update({ bench_score: s?.score ?? null, report_count: s?.counted ?? 0 });
    // The Meilisearch copy sorts on the score too; a full refresh (no ids) is followed by a reindex instead.
    if (changed && fixIds) await queueSearchSync(knex, id);
  }
}
