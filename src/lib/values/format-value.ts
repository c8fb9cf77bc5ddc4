// Writes a value in its one canonical form: "4.7 µF", "2.2 kΩ", "16 V", "100 nF ±10 %".
import { scaledDecimal } from './decimal';
import { formatBands, prefixExponents, type PrefixSymbol, type Quantity } from './quantities';
import type { ComponentValue, ParsedValue } from './reading';
import { formatTolerance } from './tolerance';

/** The prefix of the canonical form: the highest band whose lower edge the value reaches. */
export function canonicalPrefix(magnitude: number, quantity: Quantity): PrefixSymbol {
  if (magnitude === 0) return '';
  const bands = formatBands[quantity];
  let chosen: PrefixSymbol = bands[0]?.prefix ?? '';
  for (const band of bands) {
    if (magnitude >= band.from) chosen = band.prefix;
  }
  return chosen;
}

/** Magnitude and unit only: "470 µF". */
export function formatMagnitude(value: ComponentValue): string {
  if (!Number.isFinite(value.magnitude)) return 'not a value';
  const prefix = canonicalPrefix(value.magnitude, value.quantity);
  return `${scaledDecimal(value.magnitude, prefixExponents[prefix])} ${prefix}${value.unit}`;
}

/** Magnitude, unit and, when known, tolerance: "100 nF ±10 %". */
export function formatValue(value: ParsedValue): string {
  const magnitude = formatMagnitude(value);
  return value.tolerance ? `${magnitude} ${formatTolerance(value.tolerance)}` : magnitude;
}
