// The canonical spec of a parts row and its label: the label doubles as the grouping key for order lists.
import type { PartKind } from '@/lib/schemas/revision';
import { formatValue } from './format-value';
import type { ParsedValue } from './reading';
import type { RatingFields } from './rating';
import { formatTemperature } from './temperature';

export interface ElectricalSpec extends ParsedValue, Omit<RatingFields, 'tolerance'> {
  kind: 'electrical';
  /** Canonical text, e.g. "470 µF 16 V 105 °C low-ESR". */
  label: string;
  /** Equal for equal parts: quantity plus label. */
  key: string;
}

export interface TextSpec {
  kind: 'text';
  partKind: PartKind;
  /** Normalised value and rating text, e.g. "flat belt 92 mm x 4 mm". */
  label: string;
  key: string;
}

export type PartSpec = ElectricalSpec | TextSpec;

function number(x: number): string {
  return String(Number(x.toPrecision(12)));
}

/** Label parts in a fixed order so the same part always reads, and groups, the same. */
export function electricalLabel(value: ParsedValue, rating: RatingFields): string {
  const parts: string[] = [formatValue(value)];
  if (rating.voltage !== undefined) parts.push(formatValue({ quantity: 'voltage', magnitude: rating.voltage, unit: 'V' }));
  if (rating.temperatureC !== undefined) parts.push(formatTemperature(rating.temperatureC));
  if (rating.lowEsr) parts.push('low-ESR');
  if (rating.bipolar) parts.push('bipolar');
  if (rating.powerW !== undefined) parts.push(formatValue({ quantity: 'power', magnitude: rating.powerW, unit: 'W' }));
  if (rating.rippleCurrentA !== undefined) {
    parts.push(`ripple ${formatValue({ quantity: 'current', magnitude: rating.rippleCurrentA, unit: 'A' })}`);
  }
  if (rating.lifeHours !== undefined) parts.push(`${number(rating.lifeHours)} h`);
  if (rating.diameterMm !== undefined && rating.heightMm !== undefined) {
    parts.push(`Ø${number(rating.diameterMm)} × ${number(rating.heightMm)} mm`);
  }
  if (rating.leadPitchMm !== undefined) parts.push(`pitch ${number(rating.leadPitchMm)} mm`);
  parts.push(...rating.words);
  return parts.join(' ');
}
