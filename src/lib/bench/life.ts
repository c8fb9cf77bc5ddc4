// Life estimate of an electrolytic capacitor by the 10-kelvin rule: life doubles for every 10 K cooler.
import { z } from 'zod';
import { canonicalMagnitude } from '@/lib/values/decimal';
import { fail, ok, type Result } from '@/lib/values/result';
import { refuseNonFinite } from './finite';
import { readInput } from './input';
import { figures, nonNegativeNumber, positiveNumber, temperatureC } from './numbers';

export const HOURS_PER_YEAR = 8766;
/** Makers' application guides apply the rule best between these core temperatures. */
export const RULE_BEST_FROM_C = 70;
export const RULE_BEST_TO_C = 90;
/** About 15 years: estimates beyond this outrun seals and electrolyte (common practice, from memory). */
export const LONGEST_CREDIBLE_HOURS = 15 * HOURS_PER_YEAR;

const rippleSchema = figures(
  {
    currentA: positiveNumber('Ripple current'),
    esrOhm: positiveNumber('ESR'),
    /** Case-to-ambient thermal resistance of the can, K/W. */
    thermalResistanceKPerW: positiveNumber('Thermal resistance'),
  },
  'ripple current 1 A, ESR 0.1 Ω and thermal resistance 50 K/W',
);

export const lifeInputSchema = figures(
  {
    ratedLifeH: positiveNumber('Rated life'),
    ratedTemperatureC: temperatureC('Rated temperature'),
    /** Air temperature beside the part (near a regulator's heatsink this is well above room). */
    ambientTemperatureC: temperatureC('Temperature beside the part'),
    selfHeatingK: nonNegativeNumber('Self-heating').optional(),
    ripple: rippleSchema.optional(),
  },
  'rated life 2000 h at 105 °C, 85 °C beside the part',
).refine((i) => i.selfHeatingK === undefined || i.ripple === undefined, {
  message: 'Give the self-heating either directly or from ripple current, not both.',
});
export type LifeInput = z.input<typeof lifeInputSchema>;

export interface LifeEstimate {
  lifeH: number;
  lifeYears: number;
  /** Ambient plus self-heating: the temperature the rule is applied at. */
  coreTemperatureC: number;
  selfHeatingK: number;
  /** 2^((rated − core) / 10). */
  factor: number;
  warnings: string[];
}

const EXAMPLE = 'rated life 2000 h at 105 °C, 85 °C beside the part';
const RIPPLE_EXAMPLE = 'ripple current 1 A through 0.1 Ω at 50 K/W (5 K)';

/** ΔT = I² · ESR · Rth: ripple power in the ESR through the can's thermal resistance. */
export function rippleSelfHeatingK(currentA: number, esrOhm: number, thermalResistanceKPerW: number): number {
  return currentA * currentA * esrOhm * thermalResistanceKPerW;
}

/** L = L0 · 2^((T0 − T)/10), refused above the rated temperature where the rule does not hold. */
export function estimateLife(input: LifeInput): Result<LifeEstimate> {
  const read = readInput(lifeInputSchema, input, EXAMPLE);
  if (!read.ok) return read;
  const { ratedLifeH, ratedTemperatureC, ambientTemperatureC, ripple } = read.value;
  const selfHeatingK = canonicalMagnitude(
    ripple ? rippleSelfHeatingK(ripple.currentA, ripple.esrOhm, ripple.thermalResistanceKPerW) : (read.value.selfHeatingK ?? 0),
  );
  const tooLargeHeating = refuseNonFinite({ 'self-heating': selfHeatingK }, RIPPLE_EXAMPLE);
  if (tooLargeHeating) return tooLargeHeating;
  const coreTemperatureC = canonicalMagnitude(ambientTemperatureC + selfHeatingK);
  if (coreTemperatureC > ratedTemperatureC) {
    return fail(
      `The part would run at ${coreTemperatureC} °C, above its ${ratedTemperatureC} °C rating: the 10-kelvin rule does not apply there and the part is over-stressed. Choose a higher temperature class or cool it.`,
      `a ${ratedTemperatureC} °C part at or below ${ratedTemperatureC} °C`,
    );
  }
  const factor = 2 ** ((ratedTemperatureC - coreTemperatureC) / 10);
  const lifeH = canonicalMagnitude(ratedLifeH * factor);
  const lifeYears = canonicalMagnitude(lifeH / HOURS_PER_YEAR);
  const tooLarge = refuseNonFinite({ 'expected life': lifeH }, EXAMPLE);
  if (tooLarge) return tooLarge;
  return ok({
    lifeH,
    lifeYears,
    coreTemperatureC,
    selfHeatingK,
    factor: canonicalMagnitude(factor),
    warnings: lifeWarnings(coreTemperatureC, lifeH),
  });
}

function lifeWarnings(coreTemperatureC: number, lifeH: number): string[] {
  const warnings: string[] = [];
  if (coreTemperatureC < RULE_BEST_FROM_C || coreTemperatureC > RULE_BEST_TO_C) {
    warnings.push(
      `The 10-kelvin rule fits best near ${RULE_BEST_FROM_C}–${RULE_BEST_TO_C} °C; at ${coreTemperatureC} °C treat the figure as a rough guide.`,
    );
  }
  if (lifeH > LONGEST_CREDIBLE_HOURS) {
    warnings.push('Beyond about 15 years the estimate outruns the seal and the electrolyte, which age anyway (common practice).');
  }
  return warnings;
}

export const lifeCurveInputSchema = figures(
  {
    ratedLifeH: positiveNumber('Rated life'),
    ratedTemperatureC: temperatureC('Rated temperature'),
    fromC: temperatureC('Lowest temperature').default(25),
    stepC: positiveNumber('Step').min(0.5, 'Step must be at least 0.5 K.').default(5),
  },
  'rated life 2000 h at 105 °C, from 40 °C',
);
export type LifeCurveInput = z.input<typeof lifeCurveInputSchema>;

export interface LifePoint {
  temperatureC: number;
  lifeH: number;
}

/** Points of life against temperature for a chart, from fromC up to the rated temperature (never past it). */
export function lifeCurve(input: LifeCurveInput): Result<LifePoint[]> {
  const read = readInput(lifeCurveInputSchema, input, 'rated life 2000 h at 105 °C, from 40 °C');
  if (!read.ok) return read;
  const { ratedLifeH, ratedTemperatureC, fromC, stepC } = read.value;
  if (fromC >= ratedTemperatureC) return fail('The lowest temperature must be below the rated temperature.', 'fromC: 40');
  const points: LifePoint[] = [];
  for (let i = 0; fromC + i * stepC < ratedTemperatureC; i++) {
    const t = canonicalMagnitude(fromC + i * stepC);
    points.push({ temperatureC: t, lifeH: canonicalMagnitude(ratedLifeH * 2 ** ((ratedTemperatureC - t) / 10)) });
  }
  points.push({ temperatureC: ratedTemperatureC, lifeH: ratedLifeH });
  // The coolest point has the longest life, so it is the one that can overflow.
  const tooLarge = refuseNonFinite(
    { 'life at the lowest temperature': points[0]?.lifeH ?? ratedLifeH },
    '{ ratedLifeH: 2000, ratedTemperatureC: 105, fromC: 40 }',
  );
  if (tooLarge) return tooLarge;
  return ok(points);
}
