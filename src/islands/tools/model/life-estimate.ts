// The life tool: rated life and temperature class against the temperature beside the part, by the 10-kelvin rule.
import { estimateLife, lifeCurve, type LifeEstimate, type LifePoint } from '@/lib/bench/life';
import { ok } from '@/lib/values/result';
import { FormReader, type Outcome } from './form-reader';
import { readCelsius, readNumber } from './numbers';

export const lifeFieldNames = ['ratedLife', 'ratedTemperature', 'ambient', 'selfHeating'] as const;
export type LifeField = (typeof lifeFieldNames)[number];

export interface LifeOutcomeResult extends LifeEstimate {
  ratedLifeH: number;
  ratedTemperatureC: number;
  /** Life against temperature from 25 °C (or lower) up to the rating, for the chart and its table. */
  curve: LifePoint[];
}

export const lifeExample: Record<LifeField, string> = { ratedLife: '2000', ratedTemperature: '105', ambient: '85', selfHeating: '' };

const readHours = (text: string) => readNumber(text, { what: 'Rated life', units: ['hours', 'hrs', 'h'], example: '2000 h', max: 1e7 });
const readKelvin = (text: string) =>
  readNumber(text, { what: 'Self-heating', units: ['kelvin', 'K'], example: '5 K (0 when unknown)', max: 100, allowZero: true });

/** The chart starts at room temperature, or 10 K below the part when it runs cooler than that. */
function curveStart(coreTemperatureC: number, ratedTemperatureC: number): number {
  return Math.max(-55, Math.min(25, Math.floor(coreTemperatureC / 5) * 5 - 5, ratedTemperatureC - 10));
}

export function lifeOutcome(fields: Readonly<Record<LifeField, string>>, submitted: boolean): Outcome<LifeField, LifeOutcomeResult> {
  const form = new FormReader(fields, submitted);
  const ratedLifeH = form.required('ratedLife', readHours);
  const ratedTemperatureC = form.required('ratedTemperature', readCelsius('Rated temperature', '105 °C or 85 °C'));
  const ambientTemperatureC = form.required('ambient', readCelsius('Temperature beside the part', '55 °C'));
  const selfHeatingK = form.optional('selfHeating', readKelvin);
  if (!form.complete || ratedLifeH === undefined || ratedTemperatureC === undefined || ambientTemperatureC === undefined)
    return form.stopped();
  const estimate = estimateLife({
    ratedLifeH,
    ratedTemperatureC,
    ambientTemperatureC,
    ...(selfHeatingK !== undefined ? { selfHeatingK } : {}),
  });
  if (!estimate.ok) return form.finish(estimate);
  const curve = lifeCurve({ ratedLifeH, ratedTemperatureC, fromC: curveStart(estimate.value.coreTemperatureC, ratedTemperatureC) });
  return form.finish(ok({ ...estimate.value, ratedLifeH, ratedTemperatureC, curve: curve.ok ? curve.value : [] }));
}
