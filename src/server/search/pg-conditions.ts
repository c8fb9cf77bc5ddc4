// WHERE clauses of the PostgreSQL provider over fix_search (alias s): scope, filters and the query's clauses.
import type { SearchQuery } from '@/lib/search/query-schema';
import type { CodeClause } from '@/lib/search/plan';
import { allOf, anyOf, frag, pgArray, type Fragment } from './sql-fragment';
import { andQuery, lexemesOf, orQuery, type AnalysedQuery, type CompiledTextClause } from './analyse';
import { clauseLevel } from '@/lib/search/ranking';
import type { SearchContext } from './context';

/** The named machine's scope: its own fixes and family-wide ones, its whole family, or everything. */
function scopeCondition(query: SearchQuery, context: SearchContext): Fragment[] {
  if (context.machineMissing) return [frag('FALSE')];
  const machine = context.machine;
  if (!machine || query.scope === 'all') return [];
  if (query.scope === 'family' && machine.chassisId !== null) return [frag('s.chassis_ids @> ARRAY[?]::int[]', machine.chassisId)];
  const own = frag('s.machine_ids @> ARRAY[?]::int[]', machine.id);
  if (machine.chassisId === null) return [own];
  return [anyOf([own, frag('s.direct_chassis_ids @> ARRAY[?]::int[]', machine.chassisId)])];
}

export function filterCondition(query: SearchQuery, context: SearchContext, analysed: AnalysedQuery | null): Fragment {
  const parts: Fragment[] = scopeCondition(query, context);
  const f = query.filters;
  if (context.makerId === null || context.chassisId === null) parts.push(frag('FALSE'));
  if (context.makerId) parts.push(frag('s.maker_ids @> ARRAY[?]::int[]', context.makerId));
  if (context.chassisId) parts.push(frag('s.chassis_ids @> ARRAY[?]::int[]', context.chassisId));
  if (f.deviceType) parts.push(frag('s.device_types @> ARRAY[?]::text[]', f.deviceType));
  if (f.format) parts.push(frag('s.formats @> ARRAY[?]::text[]', f.format));
  if (f.hasPhotos) parts.push(frag('s.has_photos'));
  if (f.caution) parts.push(frag('s.caution_kinds @> ARRAY[?]::text[]', f.caution));
  if (analysed?.excluded) parts.push(frag('NOT (s.document @@ ?::tsquery)', analysed.excluded));
  return allOf(parts);
}

/** Title and symptoms as written (the 'simple' dictionary keeps "no", "not", "off"), built only for candidates. */
const SUMMARY_AS_WRITTEN = `to_tsvector('simple', benchlore_unaccent(s.title || ' ' || s.symptoms))`;

/** The same query with every phrase loosened to "all these words": a necessary condition, cheaper to test. */
export function withoutPhrases(tsquery: string): string {
  return tsquery.replace(/<\d*-?>/g, '&');
}

export function codeCondition(code: CodeClause): Fragment {
  return frag('s.code_list && ?::text[]', pgArray([...code.exact, ...code.variants]));
}

/**
 * What a clause must find for a fix to be a candidate: a word family's phrases ("won't close", "disc tray")
 * loosened to their words, so the index answers without reading every candidate's word positions; the
 * phrases themselves rank (levelsExpression), on the few candidates only. A quoted phrase stays a phrase.
 */
export const matchQuery = (c: CompiledTextClause): string => (c.clause.exact ? c.any : withoutPhrases(c.any));

/**
 * Title and symptoms tested while walking the bench-order index: from the copy the index carries (no table
 * row read), or, for the rare fix whose copy is empty (very long symptoms), from its row.
 */
const walkedSummary = (q: string) =>
  frag(
    `CASE WHEN s.doc_a_inline IS NULL THEN (SELECT x.doc_a @@ ?::tsquery FROM fix_search x WHERE x.fix_id = s.fix_id) ELSE s.doc_a_inline @@ ?::tsquery END`,
    q,
    q,
  );

/**
 * Every hard clause, each searched in `column`: the whole document, or title and symptoms (doc_a, through
 * its text index; 'walked summary' while walking the bench-order index).
 */
export function allClauses(
  analysed: AnalysedQuery,
  column: 'document' | 'doc_a' | 'walked summary',
  text: CompiledTextClause[] = analysed.hardText,
  codes: CodeClause[] = analysed.codes,
  testTextOnly = false,
): Fragment {
  const parts: Fragment[] = [];
  const textQuery = andQuery(text.map(matchQuery));
  // "IS TRUE" makes the text a test on rows found otherwise (by a code, a machine): scanning the text
  // index for a broad word would cost more than the rows it is tested on.
  const test = (q: string) => {
    const found = column === 'walked summary' ? walkedSummary(q) : frag(`s.${column} @@ ?::tsquery`, q);
    return testTextOnly ? frag(`(${found.sql}) IS TRUE`, ...found.bindings) : found;
  };
  if (textQuery) {
    // Phrases need word positions, which costs about twice as much per fix: words-present first, so most
    // fixes are turned away by the cheaper test.
    const loose = withoutPhrases(textQuery);
    if (loose !== textQuery) parts.push(test(loose));
    parts.push(test(textQuery));
  }
  parts.push(...codes.map(codeCondition));
  return allOf(parts);
}

/** At least one clause (soft ones included): the widest net, for partial matches. */
export function anyClause(analysed: AnalysedQuery): Fragment {
  const parts: Fragment[] = [];
  const textQuery = orQuery([...analysed.hardText, ...analysed.softText].map(matchQuery));
  if (textQuery) parts.push(frag('s.document @@ ?::tsquery', textQuery));
  const codes = analysed.codes.flatMap((c) => [...c.exact, ...c.variants]);
  if (codes.length) parts.push(frag('s.code_list && ?::text[]', pgArray(codes)));
  return anyOf(parts);
}

/**
 * For each pair of neighbouring text clauses, a query finding them side by side (one stop word may sit
 * between, as in "won't open", where the dropped "t" keeps its place): "won't open" then outranks
 * "won't stay open" for the query "tray won't open". A clause that opens with words the index drops
 * ("will not open" searched as open) may stand that many places further off.
 */
export function neighbourQueries(analysed: AnalysedQuery): string[] {
  const ordered = [...analysed.hardText, ...analysed.softText]
    .filter((c) => !c.clause.exact)
    .sort((a, b) => a.clause.position - b.clause.position);
  const queries: string[] = [];
  for (let i = 1; i < ordered.length; i++) {
    const left = ordered[i - 1]?.any;
    const rightClause = ordered[i];
    const right = rightClause?.any;
    if (!left || !right || !rightClause) continue;
    const dropped = Math.max(0, rightClause.clause.label.split(' ').length - Math.max(1, lexemesOf(rightClause.typed).length));
    const gaps = Array.from({ length: 2 + Math.min(dropped, 3) }, (_, g) => (g === 0 ? '<->' : `<${g + 1}>`));
    queries.push(gaps.map((gap) => `((${left}) ${gap} (${right}))`).join(' | '));
  }
  return queries;
}

/**
 * The clause levels of a row, as an int[]: hard text, codes, soft text, then the neighbour bonuses and the
 * bonuses for a family phrase's words found as typed.
 * `known` is a boolean SQL expression saying the row already matched every hard clause.
 */
export function levelsExpression(analysed: AnalysedQuery, known: string): Fragment {
  const textLevel = (c: CompiledTextClause, isHard: boolean): Fragment => {
    const whens: Fragment[] = [];
    const alternative = c.clause.dictionary ? clauseLevel.summaryDictionary : clauseLevel.summaryAlternative;
    if (c.typed) whens.push(frag(`WHEN s.doc_a @@ ?::tsquery THEN ${clauseLevel.summary}`, c.typed));
    if (c.meantAlternatives) whens.push(frag(`WHEN s.doc_a @@ ?::tsquery THEN ${alternative}`, c.meantAlternatives));
    // Terms the English index cannot search as meant ("no power", "switches off") count as written.
    if (c.asWritten) whens.push(frag(`WHEN ${SUMMARY_AS_WRITTEN} @@ ?::tsquery THEN ${clauseLevel.summaryAlternative}`, c.asWritten));
    // A full match is known to hold the clause's words; only a clause matched by its words alone, not its
    // phrases ("won't … close" apart), is tested again as written.
    if (isHard && matchQuery(c) === c.any) whens.push(frag(`WHEN ${known} THEN ${clauseLevel.body}`));
    whens.push(frag(`WHEN s.document @@ ?::tsquery THEN ${clauseLevel.body}`, c.any));
    return frag(`CASE ${whens.map((w) => w.sql).join(' ')} ELSE 0 END`, ...whens.flatMap((w) => w.bindings));
  };
  const codeLevel = (c: CodeClause): Fragment =>
    frag(
      `CASE WHEN s.code_list && ?::text[] THEN ${clauseLevel.summary} WHEN s.code_list && ?::text[] THEN ${clauseLevel.summaryAlternative} ELSE 0 END`,
      pgArray(c.exact),
      pgArray(c.variants),
    );
  const levels = [
    ...analysed.hardText.map((c) => textLevel(c, true)),
    ...analysed.codes.map(codeLevel),
    ...analysed.softText.map((c) => textLevel(c, false)),
    ...neighbourQueries(analysed).map((q) => frag(`CASE WHEN s.doc_a @@ ?::tsquery THEN ${clauseLevel.body} ELSE 0 END`, q)),
    ...analysed.hardText
      .filter((c) => c.literal !== '')
      .map((c) => frag(`CASE WHEN s.doc_a @@ ?::tsquery THEN ${clauseLevel.body} ELSE 0 END`, c.literal)),
  ];
  if (levels.length === 0) return frag(`'{}'::int[]`);
  return frag(`ARRAY[${levels.map((l) => l.sql).join(', ')}]::int[]`, ...levels.flatMap((l) => l.bindings));
}
