// The intermediate reading of a value (number, prefix, unit) and its checks before it becomes a value.
import { canonicalMagnitude } from './decimal';
import {
  allowedPrefixes,
  exampleOf,
  magnitudeRange,
  prefixExponents,
  quantityOfUnit,
  unitOf,
  withArticle,
  type PrefixSymbol,
  type Quantity,
  type UnitSymbol,
} from './quantities';
import { fail, ok, type Result } from './result';
import { formatTolerance, picofaradToleranceLetters, type Tolerance } from './tolerance';

export interface ComponentValue {
  quantity: Quantity;
  /** In base units (F, Ω, V, H, W, A), rounded to 12 significant figures. */
  magnitude: number;
  unit: UnitSymbol;
}

export interface ParsedValue extends ComponentValue {
  tolerance?: Tolerance;
}

/** What a reader found before the checks: digits as written, so no precision is lost on the way. */
export interface RawReading {
  digits: string;
  exponent: number;
  divisor: number;
  prefix: PrefixSymbol;
  unit?: UnitSymbol;
  impliedQuantity?: Quantity;
  tolerance?: Tolerance;
  /** The tolerance letter as marked, when the tolerance came from one. */
  toleranceLetter?: string;
}

export function exampleFor(expect: Quantity | undefined): string {
  return expect ? exampleOf[expect] : '4.7 µF, 2k2, 4R7, 104, 16 V';
}

export function finishReading(reading: RawReading, original: string, expect?: Quantity): Result<ParsedValue> {
  const quantity = reading.unit ? quantityOfUnit[reading.unit] : (expect ?? reading.impliedQuantity);
  if (!quantity) {
    return fail(`"${original}" has no unit, so it could be anything.`, exampleFor(expect));
  }
  if (expect && quantity !== expect) {
    return fail(`"${original}" is ${withArticle(quantity)}, but ${withArticle(expect)} is expected here.`, exampleOf[expect]);
  }
  if (!allowedPrefixes[quantity].includes(reading.prefix)) {
    return fail(`The prefix "${reading.prefix}" is not used with ${unitOf[quantity]} on parts.`, exampleOf[quantity]);
  }
  const magnitude = canonicalMagnitude(Number(`${reading.digits}e${reading.exponent + prefixExponents[reading.prefix]}`) / reading.divisor);
  const writtenZero = !/[1-9]/.test(reading.digits);
  const checked = checkMagnitude(magnitude, writtenZero, quantity, original);
  if (!checked.ok) return checked;
  const picofaradLetter = picofaradTolerance(reading, quantity, magnitude, original);
  if (picofaradLetter) return picofaradLetter;
  const value: ParsedValue = { quantity, magnitude, unit: unitOf[quantity] };
  if (reading.tolerance) value.tolerance = reading.tolerance;
  return ok(value);
}

function checkMagnitude(magnitude: number, writtenZero: boolean, quantity: Quantity, original: string): Result<true> {
  if (!Number.isFinite(magnitude)) {
    return fail(`"${original}" is too large to be a component value.`, exampleOf[quantity]);
  }
  // A 0 Ω link is a real part; a zero capacitance or voltage is not.
  if (magnitude === 0 && writtenZero) {
    return quantity === 'resistance'
      ? ok(true)
      : fail(`"${original}" is zero; ${withArticle(quantity)} must be above zero.`, exampleOf[quantity]);
  }
  const range = magnitudeRange(quantity);
  if (magnitude < range.min || magnitude === 0) return fail(`"${original}" is too small to be a component value.`, exampleOf[quantity]);
  if (magnitude > range.max) return fail(`"${original}" is too large to be a component value.`, exampleOf[quantity]);
  return ok(true);
}

/** Below 10 pF, IEC 60062 letters B to G give the tolerance in pF, which a percentage cannot carry. */
function picofaradTolerance(reading: RawReading, quantity: Quantity, magnitude: number, original: string): Result<never> | undefined {
  const letter = reading.toleranceLetter;
  if (quantity !== 'capacitance' || !letter || !picofaradToleranceLetters.has(letter) || magnitude >= 10e-12) return undefined;
  const percent = reading.tolerance ? formatTolerance(reading.tolerance) : '';
  return fail(
    `On a capacitor below 10 pF the letter ${letter} in "${original}" is a tolerance in picofarads, not ${percent}; write the value and its tolerance in pF.`,
    '4.7 pF ±0.25 pF is 4.7 pF ±5 %: write 4.7 pF ±5 %',
  );
}
