// Reads the active word families: both search providers expand queries (or set synonyms) from them.
import type { Knex } from 'knex';
import { quoteMultiWord } from '@/lib/search/plan';
import type { WordFamily } from '@/lib/search/word-families';

export async function activeWordFamilies(knex: Knex): Promise<WordFamily[]> {
  const rows: { id: number; name: string; terms: string[] }[] = await knex('word_families')
    .whereNull('retired_at')
    .orderBy('id')
    .select('id', 'name', 'terms');
  return rows.map((r) => ({ id: r.id, name: r.name, terms: r.terms }));
}

export interface CompiledFamilies {
  families: WordFamily[];
  /** tsquery text of every family term, keyed as plans write the term (multi-word terms quoted). */
  termQueries: Map<string, string>;
}

/**
 * The last compiled families, with the stamp they were read at. Every search reads the stamp (one tiny
 * query) and compiles again when any family was added, changed, retired or removed, so an editor's change
 * applies to the very next search on every server.
 */
let compiled: { stamp: string; families: CompiledFamilies } | null = null;

async function familiesStamp(knex: Knex): Promise<string> {
  const { rows } = await knex.raw<{ rows: { stamp: string }[] }>(
    `SELECT count(*) || '/' || coalesce(max(updated_at)::text, '') || '/' || coalesce(max(id), 0) AS stamp FROM word_families`,
  );
  return `${knex.client.config?.connection ? JSON.stringify(knex.client.config.connection) : ''}|${rows[0]?.stamp ?? ''}`;
}

/** The active families with each term compiled by websearch_to_tsquery, compiled again only when they change. */
export async function compiledWordFamilies(knex: Knex): Promise<CompiledFamilies> {
  const stamp = await familiesStamp(knex);
  if (compiled?.stamp === stamp) return compiled.families;
  const families = await compileWordFamilies(knex);
  compiled = { stamp, families };
  return families;
}

async function compileWordFamilies(knex: Knex): Promise<CompiledFamilies> {
  const { rows } = await knex.raw<{ rows: { id: number; name: string; terms: string[]; queries: string[] }[] }>(
    `SELECT f.id, f.name, f.terms,
       ARRAY(SELECT websearch_to_tsquery('english', benchlore_unaccent(
                CASE WHEN t.term ~ '\\s' THEN '"' || replace(t.term, '"', '') || '"' ELSE t.term END))::text
             FROM unnest(f.terms) WITH ORDINALITY AS t(term, n) ORDER BY t.n) AS queries
     FROM word_families f WHERE f.retired_at IS NULL ORDER BY f.id`,
  );
  const termQueries = new Map<string, string>();
  for (const row of rows) row.terms.forEach((term, i) => termQueries.set(quoteMultiWord(term), row.queries[i] ?? ''));
  return { families: rows.map((r) => ({ id: r.id, name: r.name, terms: r.terms })), termQueries };
}
