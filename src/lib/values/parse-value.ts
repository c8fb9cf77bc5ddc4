// Reads one component value as written on a parts list or a marking: "4.7 µF", "2k2", "104", "16 WV".
import { readFourDigitCode, readRkm, readThreeDigitCode } from './codes';
import { readDecimalCommas } from './decimal-comma';
import { refuseMixedNotation } from './mixed-notation';
import { exampleFor, finishReading, type ParsedValue, type RawReading } from './reading';
import type { PrefixSymbol, Quantity, UnitSymbol } from './quantities';
import { fail, ok, type Result } from './result';
import { parseTolerance, type Tolerance } from './tolerance';
import { readVoltageCode } from './voltage-codes';

export interface ParseOptions {
  /** The quantity the caller expects; a value of another quantity is refused, and unit-less input reads as it. */
  expect?: Quantity | undefined;
  /**
   * The text is printed on the part, not written on a parts list: bare digits on a resistor are then its
   * three- or four-digit code (472 = 4.7 kΩ, not 472 Ω), and a voltage may be a letter-digit code (1C = 16 V).
   */
  marking?: boolean | undefined;
}

const prefixChars: Record<string, PrefixSymbol> = {
  p: 'p',
  P: 'p',
  n: 'n',
  N: 'n',
  u: 'µ',
  U: 'µ',
  m: 'm',
  k: 'k',
  K: 'k',
  M: 'M',
  G: 'G',
  T: 'T',
};

/** Unit words as people type them; "WV" and "VDC" are voltage notations on electrolytic capacitors. */
const unitWords: ReadonlyArray<[RegExp, UnitSymbol]> = [
  [/^(?:f|farads?)$/i, 'F'],
  [/^(?:Ω|ohms?|r)$/i, 'Ω'],
  [/^(?:v|volts?|v\s*\.?\s*dc|w\.?\s*v\.?(?:\s*dc)?)$/i, 'V'],
  [/^(?:h|henr(?:y|ys|ies))$/i, 'H'],
  [/^(?:w|watts?)$/i, 'W'],
  [/^(?:a|amps?|amperes?)$/i, 'A'],
];

const numberPattern = /^(?:(\d+)\/(\d+)|(\d+(?:\.\d*)?|\.\d+)(?:e([+-]?\d+))?)/i;

/** Longer than any value or rating on a parts row; also keeps the readers' regular expressions fast. */
export const MAX_TEXT_LENGTH = 200;

export function parseValue(text: string, options: ParseOptions = {}): Result<ParsedValue> {
  const { expect, marking } = options;
  if (text.length > MAX_TEXT_LENGTH) return fail(`The value is longer than ${MAX_TEXT_LENGTH} characters.`, exampleFor(expect));
  const normalised = normaliseValueText(text);
  if (normalised === '') return fail('Nothing to read: the value is empty.', exampleFor(expect));
  if (/^-/.test(normalised)) return fail(`"${normalised}" is negative; component values are above zero.`, exampleFor(expect));
  const commas = readDecimalCommas(normalised);
  if (!commas.ok) return commas;
  const input = commas.value;
  if (input.includes(',')) {
    return fail(`"${normalised}" has a comma that is not a decimal comma; give one value here.`, exampleFor(expect));
  }
  const mixed = refuseMixedNotation(input, expect);
  if (mixed) return mixed;
  if (marking && expect === 'voltage') {
    const code = readVoltageCode(input);
    if (code) return code.ok ? ok({ quantity: 'voltage', magnitude: code.value, unit: 'V' }) : code;
  }
  // A code is one word: "100F" is code 10 pF ±1 %, "100 F" is 100 farads.
  const coded = readCode(input, { expect, marking });
  if (coded) return coded.ok ? finishReading(coded.value, input, expect) : coded;
  const reading = readSi(input, expect);
  return reading.ok ? finishReading(reading.value, input, expect) : reading;
}

/** A code alone ("4K7J", "104") or followed by a written tolerance ("4u7 ±10 %"); undefined when not a code. */
function readCode(
  input: string,
  options: { expect?: Quantity | undefined; marking?: boolean | undefined },
): Result<RawReading> | undefined {
  const [code = '', ...rest] = input.split(' ');
  const codeReading = readThreeDigitCode(code, options) ?? readFourDigitCode(code, options) ?? readRkm(code, options.expect);
  if (rest.length === 0) return codeReading;
  // Only a written percentage may follow: "100 F" is 100 farads, not the code 100 with the letter F.
  if (!codeReading || !rest.join(' ').includes('%')) return undefined;
  const tolerance = parseTolerance(rest.join(' '));
  if (!codeReading.ok || !tolerance.ok) return undefined;
  if (codeReading.value.tolerance)
    return fail(`"${input}" gives the tolerance twice.`, `${code} or ${code.slice(0, -1)} ${rest.join(' ')}`);
  return ok({ ...codeReading.value, tolerance: tolerance.value });
}

/** One spelling per character: micro signs become "u", the ohm sign becomes Ω, the minus sign "-". */
export function normaliseValueText(text: string): string {
  return text
    .normalize('NFKC')
    .replace(/[µμ]/g, 'u')
    .replace(/[\u2212\u2013]/g, '-')
    .replace(/\s+/g, ' ')
    .trim();
}

function readSi(input: string, expect?: Quantity): Result<RawReading> {
  const number = numberPattern.exec(input);
  if (!number) return fail(`"${input}" does not start with a number.`, exampleFor(expect));
  const [matched, numerator, denominator, digits, exponent] = number;
  const reading: RawReading = {
    digits: digits ?? numerator ?? '0',
    exponent: Number(exponent ?? 0),
    divisor: denominator ? Number(denominator) : 1,
    prefix: '',
  };
  if (reading.divisor === 0) return fail(`"${input}" divides by zero.`, '1/4 W');
  if (!Number.isFinite(Number(`${reading.digits}e${reading.exponent}`))) {
    return fail(`"${input}" is too large to be a component value.`, exampleFor(expect));
  }
  const split = splitTolerance(input.slice(matched.length).trim());
  if (!split.ok) return split;
  if (split.value.tolerance) reading.tolerance = split.value.tolerance;
  const unitPart = split.value.rest;
  if (unitPart === '') {
    if (expect === 'capacitance' || !expect) {
      return fail(`"${input}" needs a unit: a bare number could be pF, nF or µF.`, exampleFor(expect));
    }
    return ok(reading);
  }
  return readUnit(unitPart, reading, input, expect);
}

function readUnit(unitPart: string, reading: RawReading, input: string, expect?: Quantity): Result<RawReading> {
  if (/^mfd$/i.test(unitPart)) return ok({ ...reading, prefix: 'µ', unit: 'F' });
  if (unitPart === 'MF') {
    return fail(`"${input}" reads as megafarads; for microfarads write µF, uF or mfd.`, '10 µF or 10 mfd');
  }
  const bareUnit = unitFromWord(unitPart);
  if (bareUnit) return ok({ ...reading, unit: bareUnit });
  const prefix = prefixChars[unitPart.charAt(0)];
  const afterPrefix = unitPart.slice(1).trim();
  if (prefix !== undefined) {
    if (afterPrefix === '') return ok({ ...reading, prefix, ...impliedBy(prefix) });
    const unit = unitFromWord(afterPrefix);
    if (unit) return ok({ ...reading, prefix, unit });
  }
  if (/\s/.test(unitPart) && /\d/.test(unitPart)) {
    return fail(`"${input}" holds more than one value; give one value here, and a rating in the rating field.`, exampleFor(expect));
  }
  return fail(`"${unitPart}" in "${input}" is not a unit or prefix this reader knows.`, exampleFor(expect));
}

function unitFromWord(word: string): UnitSymbol | undefined {
  return unitWords.find(([pattern]) => pattern.test(word))?.[1];
}

/** Without a unit, kilo and mega mean ohms and pico, nano, micro mean farads; milli needs a unit. */
function impliedBy(prefix: PrefixSymbol): { impliedQuantity?: Quantity } {
  if (prefix === 'k' || prefix === 'M' || prefix === 'G' || prefix === 'T') return { impliedQuantity: 'resistance' };
  if (prefix === 'p' || prefix === 'n' || prefix === 'µ') return { impliedQuantity: 'capacitance' };
  return {};
}

/** Takes a trailing tolerance ("±10%", "+80/-20%", " 5 %") off the unit part. */
function splitTolerance(rest: string): Result<{ rest: string; tolerance?: Tolerance }> {
  const signAt = rest.search(/[±+]/);
  const plainPercent = /\s(\d+(?:\.\d+)?\s*%)$/.exec(rest);
  const at = signAt >= 0 ? signAt : plainPercent ? plainPercent.index : rest === '' || !rest.endsWith('%') ? -1 : 0;
  if (at < 0) return ok({ rest });
  const tolerance = parseTolerance(rest.slice(at));
  if (!tolerance.ok) return tolerance;
  return ok({ rest: rest.slice(0, at).trim(), tolerance: tolerance.value });
}
