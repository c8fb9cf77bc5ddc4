// Normalised text for parts that have no electrical value (belts, tyres, part numbers): one spelling per part.

const NUMBER = /^\d+(?:\.\d+)?$/;
const LENGTH_UNIT = /^(?:mm|cm|m|in)$/;

/**
 * Lower case, one space, "92mm" → "92 mm", "×" → "x", and a unit written once at the end of a size
 * given to every figure: "92 x 4 mm" and "92mm x 4mm" both become "92 mm x 4 mm".
 */
export function normaliseText(text: string): string {
  const spaced = text
    .normalize('NFKC')
    .toLowerCase()
    .replace(/[µμ]/g, 'u')
    .replace(/(\d),(\d)/g, '$1.$2')
    .replace(/\s*[×*]\s*/g, ' x ')
    .replace(/(\d)\s*x\s*(?=\d)/g, '$1 x ')
    .replace(/(\d)(mm|cm|m|in)\b/g, '$1 $2')
    .replace(/\s+/g, ' ')
    .trim()
    .replace(/[.,;]+$/, '');
  return distributeUnits(spaced.split(' ')).join(' ');
}

/** Gives each bare figure in an "a x b x c unit" chain the chain's unit. */
function distributeUnits(tokens: string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i] ?? '';
    out.push(token);
    const next = tokens[i + 1];
    if (NUMBER.test(token) && next === 'x') {
      const unit = chainUnit(tokens, i);
      if (unit) out.push(unit);
    }
  }
  return out;
}

/** The unit that ends the size chain starting at index start, if any. */
function chainUnit(tokens: string[], start: number): string | undefined {
  let i = start;
  while (NUMBER.test(tokens[i] ?? '') && tokens[i + 1] === 'x') i += 2;
  if (!NUMBER.test(tokens[i] ?? '')) return undefined;
  const unit = tokens[i + 1];
  return unit && LENGTH_UNIT.test(unit) ? unit : undefined;
}
