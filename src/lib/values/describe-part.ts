// Decodes a parts row (value + rating text) into a canonical spec and a key that groups equal parts.
import type { PartKind } from '@/lib/schemas/revision';
import { MAX_TEXT_LENGTH, parseValue, type ParseOptions } from './parse-value';
import { electricalLabel, type ElectricalSpec, type PartSpec, type TextSpec } from './part-spec';
import type { Quantity } from './quantities';
import { parseRating, splitAtSlashes, type RatingFields } from './rating';
import type { ParsedValue } from './reading';
import { fail, ok, type Result } from './result';
import { sameTolerance } from './tolerance';
import { normaliseText } from './text-key';

export interface DescribeOptions {
  /** The row's part kind; it says which quantity the value is and whether it has one at all. */
  kind?: PartKind;
  /** The value and rating are printed on the part: codes as in parseValue's marking option, voltage codes (1C). */
  marking?: boolean;
}

/** Kinds whose value is one electrical quantity; a value that does not decode is an error for them. */
const quantityOfKind: Partial<Record<PartKind, Quantity>> = { capacitor: 'capacitance', resistor: 'resistance' };

/** Kinds identified by a size or a part number, not a value: they get a normalised text key. */
const textKinds: ReadonlySet<PartKind> = new Set<PartKind>([
  'belt',
  'idler_tyre',
  'pinch_roller',
  'mechanical',
  'diode',
  'transistor',
  'ic',
  'fuse',
  'switch',
  'motor',
  'optical_pickup',
  'lamp',
  'connector',
]);

export function describePart(value: string, rating: string, options: DescribeOptions = {}): Result<PartSpec> {
  const kind = options.kind;
  if (kind && textKinds.has(kind)) return textSpec(value, rating, kind);
  const electrical = electricalSpec(value, rating, { expect: kind ? quantityOfKind[kind] : undefined, marking: options.marking });
  // "other" parts may carry a value (10 µH) or a part number; the latter falls back to text.
  if (!electrical.ok && kind === 'other') return textSpec(value, rating, kind);
  return electrical;
}

/** Kinds described by size and material; their label is the normalised text, sizes written one way. */
const mechanicalKinds: ReadonlySet<PartKind> = new Set<PartKind>(['belt', 'idler_tyre', 'pinch_roller', 'mechanical']);

/**
 * Key: kind plus normalised text, so "92mm x 4mm" and "92 x 4 mm" group. Label: the normalised text for
 * mechanical parts; for part numbers the text as written (one space), since their case is meaningful to read.
 */
export function textSpec(value: string, rating: string, partKind: PartKind): Result<TextSpec> {
  if (value.length + rating.length > 2 * MAX_TEXT_LENGTH) {
    return fail(`The part's text is longer than ${2 * MAX_TEXT_LENGTH} characters.`, 'flat belt 92 mm x 4 mm');
  }
  const normalised = [normaliseText(value), normaliseText(rating)].filter((t) => t !== '').join(' ');
  if (normalised === '') return fail('The part has neither a value nor a description.', 'flat belt 92 mm x 4 mm');
  const asWritten = `${value} ${rating}`.normalize('NFKC').replace(/\s+/g, ' ').trim();
  const label = mechanicalKinds.has(partKind) ? normalised : asWritten;
  return ok({ kind: 'text', partKind, label, key: `${partKind}:${normalised}` });
}

function electricalSpec(valueText: string, ratingText: string, options: ParseOptions): Result<ElectricalSpec> {
  const leading = readLeadingValue(splitAtSlashes(valueText), options);
  if (!leading.ok) return leading;
  const voltageCodes = options.marking === true && leading.value.value.quantity === 'capacitance';
  const rating = parseRating(`${leading.value.rest} ${ratingText}`, { voltageCodes });
  if (!rating.ok) return rating;
  const merged = mergeTolerance(leading.value.value, rating.value);
  if (!merged.ok) return merged;
  const { tolerance: _ratingTolerance, ...ratingFields } = rating.value;
  const label = electricalLabel(merged.value, rating.value);
  return ok({
    ...ratingFields,
    ...merged.value,
    kind: 'electrical',
    label,
    key: `${merged.value.quantity}:${label}`,
  });
}

/** The value may be followed by rating words in the same cell ("470uF 16V"): read the longest leading value. */
function readLeadingValue(text: string, options: ParseOptions): Result<{ value: ParsedValue; rest: string }> {
  const whole = parseValue(text, options);
  if (whole.ok) return ok({ value: whole.value, rest: '' });
  const tokens = text.trim().split(/\s+/);
  for (let end = tokens.length - 1; end >= 1; end--) {
    const head = parseValue(tokens.slice(0, end).join(' '), options);
    if (head.ok) return ok({ value: head.value, rest: tokens.slice(end).join(' ') });
  }
  return whole;
}

function mergeTolerance(value: ParsedValue, rating: RatingFields): Result<ParsedValue> {
  if (!rating.tolerance) return ok(value);
  if (value.tolerance && !sameTolerance(value.tolerance, rating.tolerance)) {
    return fail('The value and the rating give different tolerances.', '100 nF ±10 % or 104K');
  }
  return ok({ ...value, tolerance: rating.tolerance });
}
