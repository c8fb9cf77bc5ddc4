// tsquery text built from lexemes the database already gave us, so a query needs no extra round trip to compile.

/** One lexeme as tsquery text: 'tray'. Quotes and backslashes are escaped as PostgreSQL's tsquery input expects. */
export function lexemeQuery(lexeme: string): string {
  return `'${lexeme.replace(/\\/g, '\\\\').replace(/'/g, "''")}'`;
}

/**
 * A phrase from its words' lexemes in order; '' marks a stop word, which keeps its place, as
 * to_tsvector counts positions ("tray won't close" → 'tray' <-> 'won' <2> 'close').
 */
export function phraseQuery(lexemes: readonly string[]): string {
  let text = '';
  let gap = 0;
  for (const lexeme of lexemes) {
    gap++;
    if (lexeme === '') continue;
    text = text === '' ? lexemeQuery(lexeme) : `${text} ${gap === 1 ? '<->' : `<${gap}>`} ${lexemeQuery(lexeme)}`;
    gap = 0;
  }
  return text;
}
