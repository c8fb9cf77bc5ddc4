// The preferred-values tool: a value with its unit, a series, and the nearest IEC 60063 values around it.
import { nearestPreferred, seriesNames, type PreferredMatch, type SeriesName } from '@/lib/bench/preferred-values';
import type { Quantity } from '@/lib/values/quantities';
import { fail, ok, type Result } from '@/lib/values/result';
import { FormReader, type Outcome } from './form-reader';
import { readQuantity } from './numbers';

export const preferredFieldNames = ['value', 'quantity', 'series'] as const;
export type PreferredField = (typeof preferredFieldNames)[number];

export const preferredQuantities: ReadonlyArray<{ quantity: Quantity; label: string }> = [
  { quantity: 'resistance', label: 'Resistance' },
  { quantity: 'capacitance', label: 'Capacitance' },
  { quantity: 'inductance', label: 'Inductance' },
];

export const DEFAULT_SERIES: SeriesName = 'E12';

export interface PreferredResult extends PreferredMatch {
  quantity: Quantity;
}

function readSeries(text: string): Result<SeriesName> {
  const upper = (text === '' ? DEFAULT_SERIES : text).toUpperCase();
  const name = seriesNames.find((s) => s === upper);
  return name ? ok(name) : fail(`"${text}" is not a preferred number series.`, seriesNames.join(', '));
}

function readQuantityName(text: string): Result<Quantity> {
  const found = preferredQuantities.find((q) => q.quantity === (text === '' ? 'resistance' : text));
  return found ? ok(found.quantity) : fail(`"${text}" is not a quantity this tool rounds.`, 'resistance, capacitance or inductance');
}

export function preferredOutcome(
  fields: Readonly<Record<PreferredField, string>>,
  submitted: boolean,
): Outcome<PreferredField, PreferredResult> {
  const form = new FormReader(fields, submitted);
  const series = form.optional('series', readSeries) ?? DEFAULT_SERIES;
  const quantity = form.optional('quantity', readQuantityName) ?? 'resistance';
  const value = form.required('value', readQuantity(quantity));
  if (!form.complete || value === undefined) return form.stopped();
  const match = nearestPreferred(value, series);
  return form.finish(match.ok ? ok({ ...match.value, quantity }) : match);
}
