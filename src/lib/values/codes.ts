// IEC 60062 marking codes: RKM codes (4R7, 4K7, 4u7), the three-digit capacitance code in pF (104, 475) and,
// on a part's marking, the three- and four-digit resistance codes (472, 4702).
import { formatMagnitude } from './format-value';
import { allowedPrefixes, exampleOf, withArticle, type PrefixSymbol, type Quantity } from './quantities';
import { fail, ok, type Result } from './result';
import { TOLERANCE_LETTER_CLASS, toleranceFromLetter } from './tolerance';
import type { RawReading } from './reading';

/** Letters written in place of the decimal point in an RKM code, with the prefix each stands for. */
export const rkmLetters: Record<string, { prefix: PrefixSymbol; implies?: Quantity }> = {
  R: { prefix: '', implies: 'resistance' },
  r: { prefix: '', implies: 'resistance' },
  K: { prefix: 'k', implies: 'resistance' },
  k: { prefix: 'k', implies: 'resistance' },
  M: { prefix: 'M', implies: 'resistance' },
  G: { prefix: 'G', implies: 'resistance' },
  T: { prefix: 'T', implies: 'resistance' },
  p: { prefix: 'p', implies: 'capacitance' },
  P: { prefix: 'p', implies: 'capacitance' },
  n: { prefix: 'n', implies: 'capacitance' },
  N: { prefix: 'n', implies: 'capacitance' },
  u: { prefix: 'µ', implies: 'capacitance' },
  U: { prefix: 'µ', implies: 'capacitance' },
  // "F" between digits is whole farads (1F5 = 1.5 F); after the digits it is the tolerance letter.
  F: { prefix: '', implies: 'capacitance' },
  // "m" stands for milli of whatever the caller expects (4m7 = 4.7 mF on a capacitor).
  m: { prefix: 'm' },
};

const RKM_LETTER_CLASS = `[${Object.keys(rkmLetters).join('')}]`;
/** Digits, one RKM letter, digits: the whole code without its tolerance letter. */
export const rkmHeadPattern = new RegExp(`^(\\d*)(${RKM_LETTER_CLASS})(\\d+)`);
const rkmPattern = new RegExp(`^(\\d*)(${RKM_LETTER_CLASS})(\\d+)(${TOLERANCE_LETTER_CLASS})?$`);
const threeDigitPattern = new RegExp(`^(\\d)(\\d)(\\d)(${TOLERANCE_LETTER_CLASS})?$`);
const fourDigitPattern = new RegExp(`^(\\d)(\\d)(\\d)(\\d)(${TOLERANCE_LETTER_CLASS})?$`);

export interface CodeOptions {
  expect?: Quantity | undefined;
  /** The text is printed on the part itself, so bare digits are codes rather than plain numbers. */
  marking?: boolean | undefined;
}

function withToleranceLetter(reading: RawReading, letter: string | undefined): RawReading {
  const tolerance = letter ? toleranceFromLetter(letter) : undefined;
  if (letter && tolerance) return { ...reading, tolerance, toleranceLetter: letter };
  return reading;
}

/** An RKM code such as 4K7, R47, 2k2, 4u7 or 4K7J (with a tolerance letter); undefined when not one. */
export function readRkm(compact: string, expect?: Quantity): Result<RawReading> | undefined {
  const match = rkmPattern.exec(compact);
  if (!match) return undefined;
  const [, before = '', letter = '', after = '', toleranceLetter] = match;
  const meaning = rkmLetters[letter];
  if (!meaning) return undefined;
  // R and F always name their unit; other letters only clash when the expected unit does not take their prefix.
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
  return ok(withToleranceLetter(reading, toleranceLetter));
}

/**
 * The three-digit code: two significant figures and a multiplier. On capacitors it is in picofarads and
 * multiplier 8 means ×0.01, 9 means ×0.1 (IEC 60062). On a resistor's marking it is in ohms; on a parts
 * list a resistor's "470" is 470 Ω, so resistors read it as a code only when the text is a marking.
 * "470K" without a stated quantity is refused: 470 kΩ on a resistor list, 47 pF ±10 % on a capacitor.
 */
export function readThreeDigitCode(compact: string, options: CodeOptions = {}): Result<RawReading> | undefined {
  const { expect, marking } = options;
  const match = threeDigitPattern.exec(compact);
  if (!match) return undefined;
  const [, first = '0', second = '0', multiplier = '0', toleranceLetter] = match;
  if (expect === 'resistance' && marking) return resistorCode(`${first}${second}`, multiplier, toleranceLetter, compact);
  if (expect && expect !== 'capacitance') return undefined;
  if (!expect && marking) {
    const ohms = formatMagnitude({ quantity: 'resistance', magnitude: Number(`${first}${second}e${multiplier}`), unit: 'Ω' });
    return fail(
      `"${compact}" is printed on resistors (${ohms}) and on capacitors (a value in pF); say which part it is.`,
      `${compact} with the part set to resistor or capacitor`,
    );
  }
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
  return ok(withToleranceLetter(reading, toleranceLetter));
}

/**
 * The four-digit code of close-tolerance resistors: three significant figures and a multiplier (4702 = 47.0 kΩ).
 * Read only from a marking, since "4700" on a parts list is 4700 Ω.
 */
export function readFourDigitCode(compact: string, options: CodeOptions = {}): Result<RawReading> | undefined {
  const { expect, marking } = options;
  if (!marking || (expect && expect !== 'resistance')) return undefined;
  const match = fourDigitPattern.exec(compact);
  if (!match) return undefined;
  const [, first = '0', second = '0', third = '0', multiplier = '0', toleranceLetter] = match;
  return resistorCode(`${first}${second}${third}`, multiplier, toleranceLetter, compact);
}

function resistorCode(figures: string, multiplier: string, toleranceLetter: string | undefined, compact: string): Result<RawReading> {
  // Resistor markings write values below 10 Ω with R (4R7, 47R0); the capacitor multipliers 8 and 9 are not used.
  if (multiplier === '8' || multiplier === '9') {
    return fail(
      `"${compact}" ends in the multiplier ${multiplier}, which resistor codes do not use; below 10 Ω they write R for the point.`,
      '4R7, 472 or 4702',
    );
  }
  const reading: RawReading = { digits: figures, exponent: Number(multiplier), divisor: 1, prefix: '', impliedQuantity: 'resistance' };
  return ok(withToleranceLetter(reading, toleranceLetter));
}
