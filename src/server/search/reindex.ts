// Full reindex: every fix's search row rebuilt from its live revision, the vocabularies, and (when set up) Meilisearch.
import type { Knex } from 'knex';
import { refreshBenchScoreColumns } from './bench-score-columns';
import { refreshFixSearchRow } from './fix-search-row';
import { refreshVocabulary } from './vocabulary';
import { documentsAfter } from './meili/documents';
import { MeiliIndex } from './meili/index-client';
import { activeWordFamilies } from './word-families';

export interface ReindexReport {
  fixes: number;
  removed: number;
}

/** Rewrites fix_search for every fix (rows of fixes with no live revision are removed), then the vocabularies. */
export async function reindexPostgres(knex: Knex, onProgress?: (done: number, total: number) => void): Promise<ReindexReport> {
  const ids: number[] = await knex('fixes').orderBy('id').pluck('id');
  const orphans = await knex('fix_search').whereNotIn('fix_id', knex('fixes').select('id')).delete();
  for (const [i, id] of ids.entries()) {
    await refreshFixSearchRow(knex, id);
    if (onProgress && (i + 1) % 500 === 0) onProgress(i + 1, ids.length);
  }
  await refreshBenchScoreColumns(knex);
  await refreshVocabulary(knex);
  await knex.raw('ANALYZE fix_search, search_words, search_codes');
  const live = await knex('fix_search').count<{ n: string }[]>('* as n').first();
  return { fixes: Number(live?.n ?? 0), removed: orphans };
}

/**
 * Rebuilds the Meilisearch index beside the live one and swaps them, so searches never meet a half-built
 * index; the old contents are then dropped. Returns how many documents were sent.
 */
export async function reindexMeili(knex: Knex, meili: MeiliIndex, batchSize = 500): Promise<number> {
  const families = await activeWordFamilies(knex);
  const building = new MeiliIndex({ url: meili.connection.url, key: meili.connection.key, index: `${meili.uid}_reindex` });
  await building.drop();
  await meili.prepare(families);
  await building.prepare(families);
  let after = 0;
  let sent = 0;
  for (;;) {
    const batch = await documentsAfter(knex, after, batchSize);
    if (batch.length === 0) break;
    await building.apply(batch, []);
    sent += batch.length;
    after = batch[batch.length - 1]!.id;
  }
  await meili.swapWith(building);
  await building.drop();
  return sent;
}
