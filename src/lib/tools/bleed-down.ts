// The bleed-down tool: capacitance, bleed resistor and starting voltage read into the RC discharge figures.
import { bleedDown, bleedDownCurve, ES1_DC_LIMIT_V, type BleedDownResult } from '@/lib/bench/bleed-down';
import { ok } from '@/lib/values/result';
import { FormReader, type Outcome } from './form-reader';
import { readQuantity } from './numbers';

export const bleedFieldNames = ['capacitance', 'resistance', 'voltage', 'safeVoltage'] as const;
export type BleedField = (typeof bleedFieldNames)[number];

export interface BleedPoint {
  timeS: number;
  voltageV: number;
}

export interface BleedOutcomeResult extends BleedDownResult {
  curve: BleedPoint[];
  /** The figures read aloud and printed instead of the chart: start, each time constant, the safe time. */
  keyPoints: Array<BleedPoint & { label: string }>;
}

/** The example from the tool's page: a primary smoothing capacitor and a typical bleed resistor. */
export const bleedExample: Record<BleedField, string> = { capacitance: '150uF', resistance: '470k', voltage: '340V', safeVoltage: '' };

function keyPoints(result: BleedDownResult): BleedOutcomeResult['keyPoints'] {
  const tau = result.timeConstantS;
  const points: BleedOutcomeResult['keyPoints'] = [0, 1, 2, 3, 4, 5].map((n) => ({
    label: n === 0 ? 'start' : `${n} × RC`,
    timeS: n * tau,
    voltageV: result.initialVoltageV * Math.exp(-n),
  }));
  if (result.timeToSafeS > 0) {
    points.push({ label: `reaches ${result.safeVoltageV} V`, timeS: result.timeToSafeS, voltageV: result.safeVoltageV });
  }
  return points.sort((a, b) => a.timeS - b.timeS);
}

export function bleedOutcome(fields: Readonly<Record<BleedField, string>>, submitted: boolean): Outcome<BleedField, BleedOutcomeResult> {
  const form = new FormReader(fields, submitted);
  const capacitanceF = form.required('capacitance', readQuantity('capacitance'));
  const resistanceOhm = form.required('resistance', readQuantity('resistance'));
  const initialVoltageV = form.required('voltage', readQuantity('voltage'));
  const safeVoltageV = form.optional('safeVoltage', readQuantity('voltage')) ?? ES1_DC_LIMIT_V;
  if (!form.complete || capacitanceF === undefined || resistanceOhm === undefined || initialVoltageV === undefined) return form.stopped();
  const input = { capacitanceF, resistanceOhm, initialVoltageV, safeVoltageV };
  const result = bleedDown(input);
  if (!result.ok) return form.finish(result);
  const curve = bleedDownCurve(input);
  return form.finish(ok({ ...result.value, curve: curve.ok ? curve.value.points : [], keyPoints: keyPoints(result.value) }));
}
