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
  /**
   * For terms the English index cannot search as meant, because it drops a word that carries the meaning
   * ("no power", "does not rotate", "switches off", "cuts out"): a tsquery over the 'simple' dictionary that
   * finds the term as written, each word by its stem as a prefix ("switch":* <-> 'off').
   */
  asWritten: Map<string, string>;
}

/** Negations the English dictionary drops: a term holding one loses its meaning in the English index. */
const DROPPED_NEGATIONS = new Set(['no', 'not', 'nor']);

/** The common start of a word and its stem: "standby"/"standbi" → "standb", so the prefix finds every form. */
function stemPrefix(word: string, stem: string): string {
  let i = 0;
  while (i < word.length && i < stem.length && word[i] === stem[i]) i++;
  return word.slice(0, Math.max(i, Math.min(3, word.length)));
}

const quoteLexeme = (w: string) => `'${w.replace(/'/g, "''")}'`;

/**
 * The as-written query of a term, from its words in order with their English stems ('' for words the index
 * drops), or null when the English query already keeps the meaning (nothing dropped at its ends, no negation).
 */
export function asWrittenQuery(words: readonly { word: string; stem: string }[]): string | null {
  if (words.length < 2) return null;
  const dropsMeaning = words[0]?.stem === '' || words[words.length - 1]?.stem === '' || words.some((w) => DROPPED_NEGATIONS.has(w.word));
  if (!dropsMeaning) return null;
  return words.map((w) => (w.stem === '' ? quoteLexeme(w.word) : `${quoteLexeme(stemPrefix(w.word, w.stem))}:*`)).join(' <-> ');
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
  const { rows } = await knex.raw<{
    rows: { id: number; name: string; terms: string[]; queries: string[]; words: { word: string; stem: string }[][] }[];
  }>(
    `SELECT f.id, f.name, f.terms,
       ARRAY(SELECT websearch_to_tsquery('english', benchlore_unaccent(
                CASE WHEN t.term ~ '\\s' THEN '"' || replace(t.term, '"', '') || '"' ELSE t.term END))::text
             FROM unnest(f.terms) WITH ORDINALITY AS t(term, n) ORDER BY t.n) AS queries,
       ARRAY(SELECT coalesce((SELECT json_agg(json_build_object('word', u.lexeme, 'stem',
                    coalesce(array_to_string(tsvector_to_array(to_tsvector('english', u.lexeme)), ' '), '')) ORDER BY p)
                  FROM unnest(to_tsvector('simple', benchlore_unaccent(t.term))) AS u, unnest(u.positions) AS p), '[]'::json)
             FROM unnest(f.terms) WITH ORDINALITY AS t(term, n) ORDER BY t.n) AS words
     FROM word_families f WHERE f.retired_at IS NULL ORDER BY f.id`,
  );
  const termQueries = new Map<string, string>();
  const asWritten = new Map<string, string>();
  for (const row of rows)
    row.terms.forEach((term, i) => {
      termQueries.set(quoteMultiWord(term), row.queries[i] ?? '');
      const written = asWrittenQuery(row.words[i] ?? []);
      if (written) asWritten.set(quoteMultiWord(term), written);
    });
  return { families: rows.map((r) => ({ id: r.id, name: r.name, terms: r.terms })), termQueries, asWritten };
}
