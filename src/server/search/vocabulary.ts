// The words and codes of the live fixes, kept beside fix_search: what corrections and code matching look up.
import type { Knex } from 'knex';
import type { Vocabulary } from '@/lib/search/plan';
import { codeGroups, codeWindows, digitsOf } from '@/lib/search/code-match';
import type { ParsedQuery } from '@/lib/search/tokens';
import { pgArray } from './sql-fragment';

/** Every text column of fix_search, as the 'simple' dictionary splits it (unstemmed, lower case). */
const SIMPLE_DOCUMENT = `to_tsvector('simple', benchlore_unaccent(title || ' ' || symptoms || ' ' || cause || ' ' || remedy || ' ' || parts || ' ' || machines_text))`;
/** Letters only: numbers and codes are matched through search_codes, never corrected as words. */
const WORD_SHAPE = `word ~ '^[a-z]{2,40}$'`;
const STEM_OF = (column: string) => `coalesce(array_to_string(tsvector_to_array(to_tsvector('english', ${column})), ' '), '')`;
const DIGITS_OF = (column: string) => `array_to_string(ARRAY(SELECT m[1] FROM regexp_matches(${column}, '([0-9]+)', 'g') AS m), '.')`;

/** Rebuilds both vocabularies from every row of fix_search (the reindex command and the seed call this). */
export async function refreshVocabulary(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    await trx.raw('DELETE FROM search_words');
    await trx.raw(`
      INSERT INTO search_words (word, stem, ndoc)
      SELECT word, ${STEM_OF('word')}, ndoc
      FROM ts_stat($$SELECT ${SIMPLE_DOCUMENT} FROM fix_search$$)
      WHERE ${WORD_SHAPE}`);
    await trx.raw('DELETE FROM search_codes');
    await trx.raw(`
      INSERT INTO search_codes (code, digits, ndoc)
      SELECT code, ${DIGITS_OF('code')}, count(*)
      FROM fix_search, unnest(code_list) AS code
      WHERE code <> ''
      GROUP BY code`);
  });
}

/**
 * Adds one fix's words and codes (a new fix may bring a model number nobody has searched before).
 * `isNewFix` counts the fix into each word's ndoc; a re-proofed fix only adds words it did not have.
 */
export async function addFixToVocabulary(knex: Knex, fixId: number, isNewFix = false): Promise<void> {
  const onConflict = isNewFix ? 'DO UPDATE SET ndoc = search_words.ndoc + 1' : 'DO NOTHING';
  await knex.raw(
    `INSERT INTO search_words (word, stem, ndoc)
     SELECT DISTINCT word, ${STEM_OF('word')}, 1
     FROM fix_search, unnest(tsvector_to_array(${SIMPLE_DOCUMENT})) AS word
     WHERE fix_id = ? AND ${WORD_SHAPE}
     ON CONFLICT (word) ${onConflict}`,
    [fixId],
  );
  await knex.raw(
    `INSERT INTO search_codes (code, digits, ndoc)
     SELECT DISTINCT code, ${DIGITS_OF('code')}, 1
     FROM fix_search, unnest(code_list) AS code
     WHERE fix_id = ? AND code <> ''
     ON CONFLICT (code) ${onConflict.replace('search_words', 'search_codes')}`,
    [fixId],
  );
}

interface WordRow {
  typed: string;
  stem: string;
  known: boolean;
}

/** Looks up what the database knows about a parsed query's words and code windows, in two queries. */
export async function lookupVocabulary(knex: Knex, parsed: ParsedQuery): Promise<Vocabulary> {
  const words = [...new Set(parsed.pieces.filter((p) => !p.hasDigit).map((p) => p.text))];
  const windows = codeGroups(parsed.pieces).flatMap(codeWindows);
  const digitKeys = [...new Set(windows.map(digitsOf).filter((d) => d !== ''))];
  const [wordRows, codeRows] = await Promise.all([
    words.length
      ? knex.raw<{ rows: WordRow[] }>(
          `SELECT t.typed, ${STEM_OF('t.typed')} AS stem,
             EXISTS (SELECT 1 FROM search_words w WHERE w.word = t.typed OR w.stem = ${STEM_OF('t.typed')}) AS known
           FROM unnest(?::text[]) AS t(typed)`,
          [pgArray(words)],
        )
      : Promise.resolve({ rows: [] as WordRow[] }),
    digitKeys.length ? knex('search_codes').whereIn('digits', digitKeys).limit(500).pluck('code') : Promise.resolve([] as string[]),
  ]);
  const known = new Set<string>();
  const stopwords = new Set<string>();
  const unknown: string[] = [];
  for (const row of wordRows.rows) {
    if (row.stem === '') stopwords.add(row.typed);
    else if (row.known) known.add(row.typed);
    else unknown.push(row.typed);
  }
  return { known, stopwords, candidates: await correctionCandidates(knex, unknown), codes: codeRows as string[] };
}

/** Stored words that could be a slip for each unknown word: same first letter and near length, or trigram-close. */
async function correctionCandidates(knex: Knex, unknown: string[]): Promise<Map<string, { word: string; ndoc: number }[]>> {
  const candidates = new Map<string, { word: string; ndoc: number }[]>();
  const correctable = unknown.filter((w) => w.length >= 4 && w.length <= 40);
  if (correctable.length === 0) return candidates;
  const { rows } = await knex.raw<{ rows: { typed: string; word: string; ndoc: number }[] }>(
    `SELECT t.typed, c.word, c.ndoc
     FROM unnest(?::text[]) AS t(typed)
     CROSS JOIN LATERAL (
       (SELECT w.word, w.ndoc FROM search_words w
         WHERE left(w.word, 1) = left(t.typed, 1) AND length(w.word) BETWEEN length(t.typed) - 2 AND length(t.typed) + 2
         ORDER BY w.ndoc DESC, w.word LIMIT 400)
       UNION
       (SELECT w.word, w.ndoc FROM search_words w WHERE w.word % t.typed ORDER BY similarity(w.word, t.typed) DESC, w.word LIMIT 40)
     ) AS c`,
    [pgArray(correctable)],
  );
  for (const row of rows) candidates.set(row.typed, [...(candidates.get(row.typed) ?? []), { word: row.word, ndoc: Number(row.ndoc) }]);
  return candidates;
}
