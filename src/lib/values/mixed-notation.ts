// Refuses values that mix notations ("4k7Ω", "1k5R", "4.7k7", "4u7 100nF") instead of guessing what was meant.
import { readRkm, rkmHeadPattern, rkmLetters } from './codes';
import { formatValue } from './format-value';
import { exampleOf, type Quantity } from './quantities';
import { finishReading } from './reading';
import { fail, type Result } from './result';
import { parseTolerance, toleranceFromLetter } from './tolerance';

/** A unit, with or without a prefix, or ohms written as R: what may not follow an RKM code. */
const unitAfterCode = /^(?:[pnumkKMGT]?(?:Ω|ohms?|F|V|H|W|A)|[Rr]|mfd)/;

/** The code's value in SI form ("4.7 kΩ"), for the example of good input. */
function siFormOf(code: string, expect?: Quantity): string {
  const reading = readRkm(code, expect);
  if (!reading?.ok) return code;
  const value = finishReading(reading.value, code, expect);
  return value.ok ? formatValue(value.value) : code;
}

/**
 * A refusal when the text mixes an RKM code with another notation; undefined when it does not, so the
 * readers go on. An RKM code followed by a tolerance letter (4K7J) is one notation and passes.
 */
export function refuseMixedNotation(input: string, expect?: Quantity): Result<never> | undefined {
  const [first = '', ...others] = input.split(' ');
  const rest = others.join(' ');
  const pointAndLetter = /^(\d*\.\d*)([RrKkMGTpPnNuUF])(\d+)/.exec(first);
  if (pointAndLetter) {
    const [, decimal = '', letter = ''] = pointAndLetter;
    return fail(
      `"${input}" has both a decimal point and an RKM letter, which also stands for the point; use one notation.`,
      `${decimal}${letter} or ${decimal.replace('.', letter)}`,
    );
  }
  const head = rkmHeadPattern.exec(first);
  if (!head) return undefined;
  const code = head[0];
  const tail = first.slice(code.length);
  const implies = rkmLetters[head[2] ?? '']?.implies;
  // A code of another quantity than the one expected ("4k7Ω" where a capacitance is asked) gets that quantity's example.
  const example = expect && implies && implies !== expect ? exampleOf[expect] : `${code} or ${siFormOf(code, expect)}`;
  if (tail === 'F' && implies === 'capacitance' && rest === '') {
    return fail(
      `"${input}" could end in F for farads or in F, the tolerance letter for ±1 %; write the code alone, or the tolerance as ±1 %.`,
      `${code}, ${siFormOf(code, expect)} or ${code} ±1 %`,
    );
  }
  const toleranceLetterOnly = tail.length === 1 && /[A-Z]/.test(tail) && toleranceFromLetter(tail) !== undefined;
  if (toleranceLetterOnly && rest === '') return undefined;
  if (tail !== '' && !toleranceLetterOnly) return mixedWithUnit(input, example);
  if (rest === '') return undefined;
  if (unitAfterCode.test(rest)) return mixedWithUnit(input, example);
  if (/^[\d.]/.test(rest) && !parseTolerance(rest).ok) {
    return fail(`"${input}" gives more than one value (${code} and ${rest}); a part has one value.`, example);
  }
  return undefined;
}

function mixedWithUnit(input: string, example: string): Result<never> {
  return fail(
    `"${input}" mixes an RKM code with a unit: the code's letter already stands for the decimal point and the unit, so write one or the other.`,
    example,
  );
}
