// Near matches for a search that found nothing: fixes whose titles look like the query (pg_trgm similarity).
import type { Knex } from 'knex';
import { foldText } from '@/lib/search/tokens';
import type { ResolvedMachine } from './context';

export interface NearMatch {
  slug: string;
  title: string;
  /** Trigram similarity of the title to the query, 0 to 1. */
  similarity: number;
  sameFamily: boolean;
}

/** Lower than pg_trgm's default of 0.3: a reader who found nothing is helped by looser suggestions. */
const NEAR_THRESHOLD = 0.12;

export async function nearMatches(knex: Knex, text: string, machine: ResolvedMachine | null, limit = 5): Promise<NearMatch[]> {
  const folded = foldText(text)
    .replace(/[^\p{L}\p{N}\s]+/gu, ' ')
    .trim();
  if (folded.length < 3) return [];
  const chassisId = machine?.chassisId ?? null;
  return knex.transaction(async (trx) => {
    // SET LOCAL keeps the looser threshold inside this transaction; the trigram index still serves %.
    await trx.raw(`SET LOCAL pg_trgm.similarity_threshold = ${NEAR_THRESHOLD}`);
    const { rows } = await trx.raw<{ rows: { slug: string; title: string; similarity: number; same_family: boolean }[] }>(
      `SELECT f.slug, s.title, similarity(s.title, ?) AS similarity,
         (?::int IS NOT NULL AND s.chassis_ids @> ARRAY[?::int]) AS same_family
       FROM fix_search s JOIN fixes f ON f.id = s.fix_id
       WHERE s.title % ?
       ORDER BY same_family DESC, similarity DESC, s.fix_id
       LIMIT ?`,
      [folded, chassisId, chassisId, folded, limit],
    );
    return rows.map((r) => ({ slug: r.slug, title: r.title, similarity: Number(r.similarity), sameFamily: r.same_family }));
  });
}
