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
import type { Tolerance } from './tolerance';

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
