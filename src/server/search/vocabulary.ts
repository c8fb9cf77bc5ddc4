// The words and codes of the live fixes, kept beside fix_search: what corrections and code matching look up.
import type { Knex } from 'knex';
import type { Vocabulary } from '@/lib/search/plan';
import { codeGroups, codeWindows, digitKeysOf } from '@/lib/search/code-match';
import type { ParsedQuery } from '@/lib/search/tokens';
import { pgArray } from './sql-fragment';
import { baseFormsOf, englishWords, relatedWords } from './lexicon';

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
    await trx.raw('DELETE FROM search_lexemes');
    await trx.raw(`
      INSERT INTO search_lexemes (lexeme, ndoc, ndoc_summary)
      SELECT d.word, d.ndoc, coalesce(a.ndoc, 0)
      FROM ts_stat('SELECT document FROM fix_search') AS d
      LEFT JOIN ts_stat('SELECT doc_a FROM fix_search') AS a ON a.word = d.word`);
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
  const lexemeConflict = isNewFix
    ? 'DO UPDATE SET ndoc = search_lexemes.ndoc + 1, ndoc_summary = search_lexemes.ndoc_summary + EXCLUDED.ndoc_summary'
    : 'DO NOTHING';
  await knex.raw(
    `INSERT INTO search_lexemes (lexeme, ndoc, ndoc_summary)
     SELECT lexeme, 1, CASE WHEN lexeme = ANY(tsvector_to_array(doc_a)) THEN 1 ELSE 0 END
     FROM fix_search, unnest(tsvector_to_array(document)) AS lexeme
     WHERE fix_id = ?
     ON CONFLICT (lexeme) ${lexemeConflict}`,
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
  word: string | null;
  word_stem: string | null;
  ndoc: number | null;
}

/** The vocabulary for planning, and the English stem of every word involved (typed, or offered as a correction). */
export interface LookedUp {
  vocabulary: Vocabulary;
  stems: Map<string, string>;
  /** Dictionary relatives of typed words no fix uses, each with whether a fix uses it (the caller adds family words). */
  relatedCandidates: Map<string, { word: string; stored: boolean }[]>;
}

/** A word of at least this many letters that nothing knows may be two words run together ("takeup"). */
const MIN_COMPOUND = 6;

/** Every way to cut a word into two words of two letters or more. */
function splits(word: string): [string, string][] {
  const cuts: [string, string][] = [];
  for (let i = 2; i <= word.length - 2; i++) cuts.push([word.slice(0, i), word.slice(i)]);
  return cuts;
}

/**
 * For typed words neither the fixes nor the word families know: which are English (never corrected), their
 * dictionary relatives, and which run two stored words together. One small query, only when such words exist.
 */
async function dictionaryLookup(
  knex: Knex,
  unknown: string[],
): Promise<{
  english: Set<string>;
  related: Map<string, string[]>;
  compounds: Map<string, string>;
  inflections: Map<string, string>;
  stems: Map<string, string>;
  stored: Set<string>;
}> {
  const english = await englishWords(unknown);
  const bases = await baseFormsOf([...english]);
  const related = new Map<string, string[]>();
  for (const word of english) related.set(word, await relatedWords(word));
  const compoundWords = unknown.filter((w) => !english.has(w) && w.length >= MIN_COMPOUND);
  const asked = [
    ...new Set([
      ...[...related.values()].flat().flatMap((w) => [w, ...w.split(' ')]),
      ...compoundWords.flatMap((w) => splits(w).flat()),
      ...[...bases.values()].flat(),
    ]),
  ];
  const stems = new Map<string, string>();
  const stored = new Set<string>();
  /** Words some fix uses, as written or through their stem. */
  const used = new Set<string>();
  if (asked.length) {
    const { rows } = await knex.raw<{ rows: { word: string; stem: string; stored: boolean; used: boolean }[] }>(
      `WITH t AS (SELECT word, ${STEM_OF('word')} AS stem FROM unnest(?::text[]) AS word)
       SELECT t.word, t.stem, EXISTS (SELECT 1 FROM search_words w WHERE w.word = t.word) AS stored,
              EXISTS (SELECT 1 FROM search_words w WHERE w.word = t.word OR (t.stem <> '' AND w.stem = t.stem)) AS used
       FROM t`,
      [pgArray(asked)],
    );
    for (const row of rows) {
      stems.set(row.word, row.stem);
      if (row.stored) stored.add(row.word);
      if (row.used) used.add(row.word);
    }
  }
  // A typed form no fix uses whose base form some fix does: searched as the base form ("skiping" → skip).
  const inflections = new Map<string, string>();
  for (const [word, forms] of bases) {
    const base = forms.find((f) => used.has(f));
    if (base) inflections.set(word, base);
  }
  const compounds = new Map<string, string>();
  for (const word of compoundWords) {
    // The cut whose shorter half is longest: "autoreverse" → "auto reverse" rather than "au toreverse".
    const cut = splits(word)
      .filter(([a, b]) => stored.has(a) && stored.has(b))
      .sort((x, y) => Math.min(y[0].length, y[1].length) - Math.min(x[0].length, x[1].length))[0];
    if (cut) compounds.set(word, cut.join(' '));
  }
  return { english, related, compounds, inflections, stems, stored };
}

/** Up to this many stored words are compared with each unknown word (same first letter, near length). */
const SHAPE_CANDIDATES = 400;
const TRIGRAM_CANDIDATES = 40;

/**
 * One query for the words: each word's stem, whether any fix uses it, and for unknown words of four
 * letters or more the stored words that could be a slip for it (same first letter and near length, or
 * trigram-close). The edit distance is then measured in code (see correctWord).
 */
function wordsQuery(knex: Knex, words: string[]): Promise<{ rows: WordRow[] }> {
  if (words.length === 0) return Promise.resolve({ rows: [] });
  return knex.raw<{ rows: WordRow[] }>(
    `WITH t AS (SELECT typed, ${STEM_OF('typed')} AS stem FROM unnest(?::text[]) AS typed),
     k AS (SELECT t.typed, t.stem, EXISTS (SELECT 1 FROM search_words w WHERE w.word = t.typed OR (t.stem <> '' AND w.stem = t.stem)) AS known FROM t)
     SELECT k.typed, k.stem, k.known, c.word, c.stem AS word_stem, c.ndoc
     FROM k LEFT JOIN LATERAL (
       (SELECT w.word, w.stem, w.ndoc FROM search_words w
         WHERE NOT k.known AND k.stem <> '' AND length(k.typed) BETWEEN 4 AND 40
           AND left(w.word, 1) = left(k.typed, 1) AND length(w.word) BETWEEN length(k.typed) - 2 AND length(k.typed) + 2
         ORDER BY w.ndoc DESC, w.word LIMIT ${SHAPE_CANDIDATES})
       UNION
       (SELECT w.word, w.stem, w.ndoc FROM search_words w
         WHERE NOT k.known AND k.stem <> '' AND length(k.typed) BETWEEN 4 AND 40 AND w.word % k.typed
         ORDER BY similarity(w.word, k.typed) DESC, w.word LIMIT ${TRIGRAM_CANDIDATES})
     ) AS c ON true`,
    [pgArray(words)],
  );
}

/** Looks up what the database knows about a parsed query's words and code windows, in two parallel queries. */
export async function lookupVocabulary(knex: Knex, parsed: ParsedQuery): Promise<LookedUp> {
  const phraseWords = parsed.phrases.flatMap((p) => p.split(' '));
  const words = [...new Set([...parsed.pieces.filter((p) => !p.hasDigit).map((p) => p.text), ...phraseWords, ...parsed.excluded])];
  const windows = codeGroups(parsed.pieces).flatMap(codeWindows);
  const digitKeys = [...new Set(windows.flatMap(digitKeysOf))];
  const [wordRows, codeRows] = await Promise.all([
    wordsQuery(knex, words),
    digitKeys.length ? knex('search_codes').whereIn('digits', digitKeys).limit(500).pluck('code') : Promise.resolve([] as string[]),
  ]);
  const known = new Set<string>();
  const stopwords = new Set<string>();
  const stems = new Map<string, string>();
  const candidates = new Map<string, { word: string; ndoc: number }[]>();
  for (const row of wordRows.rows) {
    stems.set(row.typed, row.stem);
    if (row.stem === '') stopwords.add(row.typed);
    else if (row.known) known.add(row.typed);
    if (row.word !== null && row.word_stem !== null) {
      stems.set(row.word, row.word_stem);
      candidates.set(row.typed, [...(candidates.get(row.typed) ?? []), { word: row.word, ndoc: Number(row.ndoc ?? 0) }]);
    }
  }
  const unknown = words.filter((w) => stems.has(w) && !known.has(w) && !stopwords.has(w));
  const dictionary = unknown.length ? await dictionaryLookup(knex, unknown) : null;
  const relatedCandidates = new Map<string, { word: string; stored: boolean }[]>();
  for (const [word, related] of dictionary?.related ?? [])
    relatedCandidates.set(
      word,
      related.map((r) => ({ word: r, stored: r.split(' ').every((part) => dictionary?.stored.has(part)) })),
    );
  for (const [word, stem] of dictionary?.stems ?? []) if (!stems.has(word)) stems.set(word, stem);
  return {
    vocabulary: {
      known,
      stopwords,
      candidates,
      codes: codeRows as string[],
      english: dictionary?.english ?? new Set(),
      compounds: dictionary?.compounds ?? new Map(),
      inflections: dictionary?.inflections ?? new Map(),
    },
    stems,
    relatedCandidates,
  };
}

export interface LexemeStats {
  /** Live fixes in all (the planner's estimate, which ANALYZE and autovacuum keep close). */
  total: number;
  anywhere: (lexeme: string) => number;
  summary: (lexeme: string) => number;
  code: (code: string) => number;
}

/** Counts for the lexemes and codes of a query, for choosing how its candidates are read. */
export async function lexemeStats(knex: Knex, lexemes: string[], codes: string[]): Promise<LexemeStats> {
  // One round trip: the lexemes' and codes' counts, and the size of the table.
  const { rows } = await knex.raw<{ rows: { kind: 'lexeme' | 'code' | 'table'; key: string; ndoc: string; ndoc_summary: string }[] }>(
    `SELECT 'lexeme' AS kind, lexeme AS key, ndoc, ndoc_summary FROM search_lexemes WHERE lexeme = ANY(?::text[])
     UNION ALL SELECT 'code', code, ndoc, ndoc FROM search_codes WHERE code = ANY(?::text[])
     UNION ALL SELECT 'table', '', greatest(reltuples, 0)::bigint, 0 FROM pg_class WHERE oid = 'fix_search'::regclass`,
    [pgArray(lexemes), pgArray(codes)],
  );
  const lexemeRows = rows
    .filter((r) => r.kind === 'lexeme')
    .map((r) => ({ lexeme: r.key, ndoc: Number(r.ndoc), ndoc_summary: Number(r.ndoc_summary) }));
  const codeRows = rows.filter((r) => r.kind === 'code').map((r) => ({ code: r.key, ndoc: Number(r.ndoc) }));
  const table = { rows: rows.filter((r) => r.kind === 'table').map((r) => ({ n: r.ndoc })) };
  const anywhere = new Map<string, number>(lexemeRows.map((r: { lexeme: string; ndoc: number }) => [r.lexeme, Number(r.ndoc)]));
  const summary = new Map<string, number>(
    lexemeRows.map((r: { lexeme: string; ndoc_summary: number }) => [r.lexeme, Number(r.ndoc_summary)]),
  );
  const byCode = new Map<string, number>(codeRows.map((r: { code: string; ndoc: number }) => [r.code, Number(r.ndoc)]));
  return {
    total: Number(table.rows[0]?.n ?? 0),
    anywhere: (l) => anywhere.get(l) ?? 0,
    summary: (l) => summary.get(l) ?? 0,
    code: (c) => byCode.get(c) ?? 0,
  };
}
