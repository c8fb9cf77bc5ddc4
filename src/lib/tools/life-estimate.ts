// The life tool: rated life and temperature class against the temperature beside the part, by the 10-kelvin rule.
import { estimateLife, lifeCurve, type LifeEstimate, type LifePoint } from '@/lib/bench/life';
import { ok } from '@/lib/values/result';
import { FormReader, type Outcome } from './form-reader';
import { readCelsius, readNumber, readQuantity } from './numbers';

export const lifeFieldNames = [
  'ratedLife',
  'ratedTemperature',
  'ambient',
  'selfHeating',
  'rippleCurrent',
  'esr',
  'thermalResistance',
] as const;
export type LifeField = (typeof lifeFieldNames)[number];

export interface LifeOutcomeResult extends LifeEstimate {
  /** True when the self-heating was worked out from ripple current, ESR and thermal resistance. */
  fromRipple: boolean;
  ratedLifeH: number;
  ratedTemperatureC: number;
  /** Life against temperature from 25 °C (or lower) up to the rating, for the chart and its table. */
  curve: LifePoint[];
}

export const lifeExample: Record<LifeField, string> = {
  ratedLife: '2000',
  ratedTemperature: '105',
  ambient: '85',
  selfHeating: '',
  rippleCurrent: '',
  esr: '',
  thermalResistance: '',
};

/** The three fields that together give the self-heating from ripple, ΔT = I² × ESR × Rth. */
const rippleFields = ['rippleCurrent', 'esr', 'thermalResistance'] as const;
const rippleExamples: Record<(typeof rippleFields)[number], { what: string; example: string }> = {
  rippleCurrent: { what: 'Ripple current', example: '1 A or 850 mA' },
  esr: { what: 'ESR', example: '0.1 or 100m' },
  thermalResistance: { what: 'Thermal resistance', example: '50 K/W' },
};

const readHours = (text: string) => readNumber(text, { what: 'Rated life', units: ['hours', 'hrs', 'h'], example: '2000 h', max: 1e7 });
const readKelvin = (text: string) =>
  readNumber(text, { what: 'Self-heating', units: ['kelvin', 'K'], example: '5 K (0 when unknown)', max: 100, allowZero: true });
const readKelvinPerWatt = (text: string) =>
  readNumber(text, { what: 'Thermal resistance', units: ['K/W', 'K / W', '°C/W', 'C/W'], example: '50 K/W', max: 1000 });

type RippleInput = { currentA: number; esrOhm: number; thermalResistanceKPerW: number };

/** The ripple fields: none given, or all three read; one missing is still needed while typing and an error once sent. */
function readRipple(form: FormReader<LifeField>, selfHeatingGiven: boolean): RippleInput | undefined {
  if (!rippleFields.some((name) => form.text(name) !== '')) return undefined;
  if (selfHeatingGiven) {
    form.flag('selfHeating', {
      message: 'Give the self-heating either here or from ripple current, ESR and thermal resistance, not both.',
      example: 'leave this blank when the ripple fields are filled in',
    });
  }
  for (const name of rippleFields) {
    if (form.text(name) === '') {
      const { what, example } = rippleExamples[name];
      form.absent(name, { message: `${what} is needed with the other ripple fields to work out the self-heating.`, example });
    }
  }
  const currentA = form.optional('rippleCurrent', readQuantity('current'));
  const esrOhm = form.optional('esr', readQuantity('resistance'));
  const thermalResistanceKPerW = form.optional('thermalResistance', readKelvinPerWatt);
  if (currentA === undefined || esrOhm === undefined || thermalResistanceKPerW === undefined) return undefined;
  return { currentA, esrOhm, thermalResistanceKPerW };
}

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
  const ripple = readRipple(form, form.text('selfHeating') !== '');
  if (!form.complete || ratedLifeH === undefined || ratedTemperatureC === undefined || ambientTemperatureC === undefined)
    return form.stopped();
  const estimate = estimateLife({
    ratedLifeH,
    ratedTemperatureC,
    ambientTemperatureC,
    ...(ripple ? { ripple } : selfHeatingK !== undefined ? { selfHeatingK } : {}),
  });
  if (!estimate.ok) return form.finish(estimate);
  const curve = lifeCurve({ ratedLifeH, ratedTemperatureC, fromC: curveStart(estimate.value.coreTemperatureC, ratedTemperatureC) });
  return form.finish(
    ok({ ...estimate.value, fromRipple: ripple !== undefined, ratedLifeH, ratedTemperatureC, curve: curve.ok ? curve.value : [] }),
  );
}
