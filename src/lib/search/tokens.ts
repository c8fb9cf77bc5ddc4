// Splits a search query into folded pieces, quoted phrases and excluded words: the first step of every search.

/** Lower case, accents removed, apostrophes dropped: "Won’t" → "wont", "Démag" → "demag". */
export function foldText(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/\p{M}+/gu, '')
    .toLowerCase()
    .replace(/['’`ʼ]/g, '');
}

/** A run of letters and digits from the query, in order. */
export interface Piece {
  text: string;
  hasDigit: boolean;
  /** True when only a separator (space, dash, dot, slash) stood between this piece and the one before. */
  joinsPrevious: boolean;
  /** True when a dash, dot or slash (no space) joined it to the piece before, as in "DR-4120". */
  tight: boolean;
}

export interface ParsedQuery {
  pieces: Piece[];
  /** Quoted phrases, matched as written: no word families, no corrections. */
  phrases: string[];
  /** Words after a minus sign: fixes containing them are left out. */
  excluded: string[];
}

/** The longest query we read; the search form allows 200 characters. */
export const MAX_QUERY_LENGTH = 200;
const MAX_PIECES = 24;

/** Pieces of a folded text: "dr-4120k tray" → ["dr", "4120k", "tray"]. */
export function piecesOf(folded: string): Piece[] {
  const pieces: Piece[] = [];
  const pattern = /[\p{L}\p{N}]+/gu;
  let lastEnd = -1;
  for (const match of folded.matchAll(pattern)) {
    const start = match.index ?? 0;
    const between = lastEnd < 0 ? '' : folded.slice(lastEnd, start);
    const joinsPrevious = lastEnd >= 0 && /^[\s\-./_]+$/.test(between);
    pieces.push({ text: match[0], hasDigit: /\p{N}/u.test(match[0]), joinsPrevious, tight: joinsPrevious && /^[-./_]+$/.test(between) });
    lastEnd = start + match[0].length;
  }
  return pieces;
}

/** Parses the text of a search box; never throws, whatever was typed. */
export function parseQuery(raw: string): ParsedQuery {
  const folded = foldText(raw.slice(0, MAX_QUERY_LENGTH));
  const phrases: string[] = [];
  // A quote left open runs to the end of the query.
  const unquoted = folded.replace(/"([^"]*)("|$)/g, (_all, inner: string) => {
    const phrase = piecesOf(inner)
      .map((p) => p.text)
      .join(' ');
    if (phrase) phrases.push(phrase);
    return ' ';
  });
  const excluded: string[] = [];
  const kept = unquoted.replace(/(^|\s)-([\p{L}\p{N}]+)/gu, (_all, lead: string, word: string) => {
    excluded.push(word);
    return lead;
  });
  return { pieces: piecesOf(kept).slice(0, MAX_PIECES), phrases: phrases.slice(0, 4), excluded: excluded.slice(0, 4) };
}
