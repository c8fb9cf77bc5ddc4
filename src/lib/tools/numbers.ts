// Readers for the plain number fields of the tools (hours, °C, kelvin, millimetres, hertz) and for values with units.
import { parseValue } from '@/lib/values/parse-value';
import type { Quantity } from '@/lib/values/quantities';
import { fail, ok, type Result } from '@/lib/values/result';
import { MAX_FIELD_LENGTH } from './form-reader';

export interface NumberSpec {
  /** The field's name in messages: "Rated life". */
  what: string;
  /** Unit words the reader may write after the number and that are dropped: ['h', 'hours']. */
  units?: readonly string[];
  example: string;
  min?: number;
  max?: number;
  /** Zero is a valid answer (self-heating of 0 K); otherwise a value must be above zero. */
  allowZero?: boolean;
  allowNegative?: boolean;
}

const decimalPattern = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?$/i;

function stripUnit(text: string, units: readonly string[]): string {
  for (const unit of [...units].sort((a, b) => b.length - a.length)) {
    if (text.toLowerCase().endsWith(unit.toLowerCase())) return text.slice(0, text.length - unit.length).trim();
  }
  return text;
}

/** A plain decimal number, optionally followed by one of the field's units. */
export function readNumber(text: string, spec: NumberSpec): Result<number> {
  if (text.length > MAX_FIELD_LENGTH) return fail(`${spec.what} is too long to be a number.`, spec.example);
  const compact = text
    .normalize('NFKC')
    .replace(/\u2212/g, '-')
    .trim();
  if (compact === '') return fail(`${spec.what} is empty.`, spec.example);
  const bare = stripUnit(compact, spec.units ?? []);
  if (bare.includes(',')) return fail(`${spec.what}: write the decimal point as a dot and no thousands separator.`, spec.example);
  if (!decimalPattern.test(bare)) return fail(`${spec.what}: "${compact}" is not a number this tool can read.`, spec.example);
  const value = Number(bare);
  if (!Number.isFinite(value)) return fail(`${spec.what}: "${compact}" is too large.`, spec.example);
  if (value < 0 && !spec.allowNegative) return fail(`${spec.what} cannot be negative.`, spec.example);
  if (value === 0 && !spec.allowZero && !spec.allowNegative) return fail(`${spec.what} must be above zero.`, spec.example);
  if (spec.min !== undefined && value < spec.min) return fail(`${spec.what} must be at least ${spec.min}.`, spec.example);
  if (spec.max !== undefined && value > spec.max) return fail(`${spec.what} must be at most ${spec.max}.`, spec.example);
  return ok(value);
}

/** A temperature in °C as people write it: 85, 85C, 85 °C, -20. */
export function readCelsius(what: string, example: string): (text: string) => Result<number> {
  return (text) =>
    readNumber(text, {
      what,
      units: ['°C', 'º C', 'ºC', '° C', 'deg C', 'degC', 'C'],
      example,
      min: -55,
      max: 200,
      allowZero: true,
      allowNegative: true,
    });
}

const frequencyPrefixes: Record<string, number> = { '': 1, k: 1e3, K: 1e3, M: 1e6 };

/** A frequency: 120, 120 Hz, 100k, 100 kHz, 1 MHz. */
export function readFrequency(text: string): Result<number> {
  const example = '120 Hz, 100 kHz or 100k';
  const match = /^(.*?)\s*([kKM]?)(?:[Hh][Zz])?$/.exec(text.normalize('NFKC').trim());
  const prefix = match?.[2] ?? '';
  const number = readNumber(match?.[1] ?? text, { what: 'Meter frequency', example, max: 1e7 });
  if (!number.ok) return number;
  const hertz = number.value * (frequencyPrefixes[prefix] ?? 1);
  if (hertz > 1e7) return fail('Meter frequency above 10 MHz is not an ESR test.', example);
  return ok(hertz);
}

/** A component value of one quantity in base units, with the value decoder's messages and examples. */
export function readQuantity(quantity: Quantity): (text: string) => Result<number> {
  return (text) => {
    const parsed = parseValue(text, { expect: quantity });
    return parsed.ok ? ok(parsed.value.magnitude) : parsed;
  };
}
