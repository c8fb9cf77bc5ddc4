// IEC 60062 marking codes: RKM codes (4R7, 4K7, 4u7) and the three-digit capacitance code in pF (104, 475).
import { allowedPrefixes, exampleOf, withArticle, type PrefixSymbol, type Quantity } from './quantities';
import { fail, ok, type Result } from './result';
import { toleranceFromLetter } from './tolerance';
import type { RawReading } from './reading';

/** Letters written in place of the decimal point in an RKM code, with the prefix each stands for. */
const rkmLetters: Record<string, { prefix: PrefixSymbol; implies?: Quantity }> = {
  R: { prefix: '', implies: 'resistance' },
  r: { prefix: '', implies: 'resistance' },
  K: { prefix: 'k', implies: 'resistance' },
  k: { prefix: 'k', implies: 'resistance' },
  M: { prefix: 'M', implies: 'resistance' },
  G: { prefix: 'G', implies: 'resistance' },
  p: { prefix: 'p', implies: 'capacitance' },
  P: { prefix: 'p', implies: 'capacitance' },
  n: { prefix: 'n', implies: 'capacitance' },
  N: { prefix: 'n', implies: 'capacitance' },
  u: { prefix: 'µ', implies: 'capacitance' },
  U: { prefix: 'µ', implies: 'capacitance' },
  // "m" stands for milli of whatever the caller expects (4m7 = 4.7 mF on a capacitor).
  m: { prefix: 'm' },
};

const rkmPattern = /^(\d*)([RrKkMGpPnNuUm])(\d+)([FGJKMZ])?$/;
const threeDigitPattern = /^(\d)(\d)(\d)([FGJKMZ])?$/;

/** An RKM code such as 4K7, R47, 2k2, 4u7 or 4K7J (with a tolerance letter); undefined when not one. */
export function readRkm(compact: string, expect?: Quantity): Result<RawReading> | undefined {
  const match = rkmPattern.exec(compact);
  if (!match) return undefined;
  const [, before = '', letter = '', after = '', toleranceLetter] = match;
  const meaning = rkmLetters[letter];
  if (!meaning) return undefined;
  // R always means ohms; other letters only clash when the expected unit does not take their prefix.
  const clashes = meaning.prefix === '' || !allowedPrefixes[expect ?? 'resistance'].includes(meaning.prefix);
  if (meaning.implies && expect && meaning.implies !== expect && clashes) {
    return fail(`"${compact}" reads as ${withArticle(meaning.implies)}, but ${withArticle(expect)} is expected here.`, exampleOf[expect]);
  }
  const reading: RawReading = {
    digits: `${before || '0'}.${after}`,
    exponent: 0,
    divisor: 1,
    prefix: meaning.prefix,
  };
  if (meaning.implies) reading.impliedQuantity = meaning.implies;
  const tolerance = toleranceLetter ? toleranceFromLetter(toleranceLetter) : undefined;
  if (tolerance) reading.tolerance = tolerance;
  return ok(reading);
}

/**
 * The three-digit code: two significant figures and a multiplier, in picofarads; multiplier 8 means
 * ×0.01 and 9 means ×0.1 (IEC 60062). "470K" without a stated quantity is refused: it reads as
 * 470 kΩ on a resistor list and as 47 pF ±10 % on a capacitor, and guessing would order the wrong part.
 */
export function readThreeDigitCode(compact: string, expect?: Quantity): Result<RawReading> | undefined {
  const match = threeDigitPattern.exec(compact);
  if (!match) return undefined;
  if (expect && expect !== 'capacitance') return undefined;
  const [, first = '0', second = '0', multiplier = '0', toleranceLetter] = match;
  if (!expect && (toleranceLetter === 'K' || toleranceLetter === 'M')) {
    return fail(
      `"${compact}" could be a resistor (${first}${second}${multiplier} ${toleranceLetter === 'K' ? 'kΩ' : 'MΩ'}) or a capacitor code with tolerance ${toleranceLetter}; say which part it is.`,
      `${compact} on a capacitor, or ${first}${second}${multiplier} kΩ`,
    );
  }
  const multiplierDigit = Number(multiplier);
  const powerOfTen = multiplierDigit === 8 ? -2 : multiplierDigit === 9 ? -1 : multiplierDigit;
  const reading: RawReading = {
    digits: `${first}${second}`,
    exponent: powerOfTen,
    divisor: 1,
    prefix: 'p',
    impliedQuantity: 'capacitance',
  };
  const tolerance = toleranceLetter ? toleranceFromLetter(toleranceLetter) : undefined;
  if (tolerance) reading.tolerance = tolerance;
  return ok(reading);
}
