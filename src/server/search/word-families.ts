// Reads the active word families: both search providers expand queries (or set synonyms) from them.
import type { Knex } from 'knex';
import type { WordFamily } from '@/lib/search/word-families';

export async function activeWordFamilies(knex: Knex): Promise<WordFamily[]> {
  const rows: { id: number; name: string; terms: string[] }[] = await knex('word_families').whereNull('retired_at').orderBy('id').select('id', 'name', 'terms');
  return rows.map((r) => ({ id: r.id, name: r.name, terms: r.terms }));
}
