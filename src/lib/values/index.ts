// Public face of the component value decoder: parse, format, describe parts.
export { parseValue, normaliseValueText, type ParseOptions } from './parse-value';
export { formatValue, formatMagnitude, canonicalPrefix } from './format-value';
export type { ComponentValue, ParsedValue } from './reading';
export { parseTolerance, formatTolerance, toleranceLetters, type Tolerance } from './tolerance';
export { parseTemperature, formatTemperature } from './temperature';
export { quantities, unitOf, type Quantity, type UnitSymbol } from './quantities';
export { ok, fail, type Result, type InputError } from './result';
export { describePart, textSpec, type DescribeOptions } from './describe-part';
export type { PartSpec, ElectricalSpec, TextSpec } from './part-spec';
export { parseRating, type RatingFields } from './rating';
export { normaliseText } from './text-key';
