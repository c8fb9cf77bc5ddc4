// Searches that found nothing, counted by folded query and machine (no person, no address): the wanted-fixes list.
import type { Knex } from 'knex';
import { missKey } from '@/lib/search/miss-key';

export interface WantedFix {
  query: string;
  machine: { slug: string; label: string } | null;
  count: number;
  firstAt: Date;
  lastAt: Date;
}

/** Counts one search that found nothing. Returns false when the query held nothing worth counting. */
export async function recordSearchMiss(knex: Knex, query: string, machineId: number | null): Promise<boolean> {
  const key = missKey(query);
  if (!key) return false;
  await knex.raw(
    `INSERT INTO search_misses (query_norm, query_text, machine_id) VALUES (?, ?, ?)
     ON CONFLICT (query_norm, (coalesce(machine_id, 0)))
     DO UPDATE SET count = search_misses.count + 1, last_at = now()`,
    [key, key, machineId],
  );
  return true;
}

/** Most asked first, then most recent; for editors deciding what to write up next. */
export async function listWantedFixes(
  knex: Knex,
  options: { limit: number; offset: number },
): Promise<{ items: WantedFix[]; total: number }> {
  const [rows, counted] = await Promise.all([
    knex('search_misses as sm')
      .leftJoin('machines as m', 'm.id', 'sm.machine_id')
      .leftJoin('makers as mk', 'mk.id', 'm.maker_id')
      .select(
        'sm.query_text',
        'sm.count',
        'sm.first_at',
        'sm.last_at',
        'm.slug as machine_slug',
        'm.model_number',
        'm.region',
        'mk.name as maker_name',
      )
      .orderBy([
        { column: 'sm.count', order: 'desc' },
        { column: 'sm.last_at', order: 'desc' },
        { column: 'sm.id', order: 'asc' },
      ])
      .limit(options.limit)
      .offset(options.offset),
    knex('search_misses').count<{ n: string }[]>('* as n').first(),
  ]);
  return {
    total: Number(counted?.n ?? 0),
    items: rows.map((r) => ({
      query: r.query_text,
      machine: r.machine_slug ? { slug: r.machine_slug, label: `${r.maker_name} ${r.model_number} (${r.region})` } : null,
      count: r.count,
      firstAt: r.first_at,
      lastAt: r.last_at,
    })),
  };
}
