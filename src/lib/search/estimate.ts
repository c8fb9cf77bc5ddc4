// Estimates how many fixes a tsquery matches from per-lexeme counts, to choose how candidates are read.
/*
  An OR adds its parts (an upper bound); a phrase or an AND inside one term takes its rarest part (also
  an upper bound). Separate clauses of a query are taken to overlap fully: the words of one symptom come
  together ("tray", "won't", "open"), so the rarest clause bounds the share. When words that rarely meet
  are asked together the estimate runs high, the walk runs out of budget, and the stage is collected
  instead: slower, still right.
  The estimate only chooses between walking fixes best-score-first and collecting matches first; a poor
  estimate costs time, never a wrong answer.
*/

type Count = (lexeme: string) => number;

/** Matches of one tsquery text as we write it: quoted lexemes, ( ), |, &, <->, <N>, and ! for exclusion. */
export function estimateMatches(tsquery: string, count: Count): number {
  const tokens = tsquery.match(/'(?:[^']|'')*'|<\d*-?>|[()|&!]/g) ?? [];
  let at = 0;
  const primary = (): number => {
    const token = tokens[at++];
    if (token === '(') {
      const inner = or();
      at++; // the closing ')'
      return inner;
    }
    if (token === '!') {
      primary();
      return Number.POSITIVE_INFINITY;
    }
    if (token?.startsWith("'")) return count(token.slice(1, -1).replace(/''/g, "'"));
    return 0;
  };
  const and = (): number => {
    let value = primary();
    while (tokens[at] === '&' || tokens[at]?.startsWith('<')) {
      at++;
      value = Math.min(value, primary());
    }
    return value;
  };
  const or = (): number => {
    let value = and();
    while (tokens[at] === '|') {
      at++;
      value += and();
    }
    return value;
  };
  return tokens.length ? or() : 0;
}

/** Share of all fixes matching every clause (the rarest clause's share); 1 when there are no clauses. */
export function estimateShare(clauseMatches: readonly number[], total: number): number {
  if (total <= 0) return 0;
  return clauseMatches.reduce((share, m) => Math.min(share, Math.max(0, m / total)), 1);
}

/**
 * The share from which walking beats collecting: walking reads about limit ÷ share fixes at `walkCost`
 * each, collecting reads share × total matches at `collectCost` each; they cost the same at
 * share = √(limit · walkCost ÷ (total · collectCost)).
 */
export function walkThreshold(limit: number, total: number, walkCost: number, collectCost: number): number {
  if (total <= 0) return Number.POSITIVE_INFINITY;
  return Math.sqrt((limit * walkCost) / (total * collectCost));
}
