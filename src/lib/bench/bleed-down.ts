// Bleed-down of stored charge through a resistor: time to a safe voltage, energy and resistor stress.
import { z } from 'zod';
import { canonicalMagnitude } from '@/lib/values/decimal';
import { fail, ok, type Result } from '@/lib/values/result';
import { refuseNonFinite } from './finite';
import { readInput } from './input';
import { figures, positiveNumber } from './numbers';

/** ES1 limit for DC voltage in IEC 62368-1 (energy source class 1): 60 V. */
export const ES1_DC_LIMIT_V = 60;

/** Shown before any figure: the calculation assumes a circuit that may not be there. */
export const BLEED_DOWN_CAUTION =
  'Stored charge can injure. Measure the voltage across the capacitor with a meter rated for it before you touch anything: never assume it is discharged, because a bleed resistor can be open, a lead loose or the value wrong. Follow your local electrical codes and licensed practice.';

export const bleedDownInputSchema = figures(
  {
    capacitanceF: positiveNumber('Capacitance'),
    resistanceOhm: positiveNumber('Resistance'),
    initialVoltageV: positiveNumber('Starting voltage'),
    safeVoltageV: positiveNumber('Safe voltage').default(ES1_DC_LIMIT_V),
  },
  'capacitance 150 µF, resistance 470 kΩ and starting voltage 340 V',
);
export type BleedDownInput = z.input<typeof bleedDownInputSchema>;

export interface BleedDownResult {
  caution: string;
  initialVoltageV: number;
  timeConstantS: number;
  /** t = RC · ln(V0 / Vsafe); zero when the start is already at or below the safe level. */
  timeToSafeS: number;
  safeVoltageV: number;
  /** ½ C V0². */
  storedEnergyJ: number;
  /** ½ C Vsafe²: what is still there when the safe level is reached. */
  energyLeftJ: number;
  /** ½ C (V0² − Vsafe²): the pulse the resistor absorbs on the way down. */
  resistorEnergyJ: number;
  /** V0² / R at the first instant: the resistor's peak power. */
  initialResistorPowerW: number;
  notes: string[];
}

const EXAMPLE = 'capacitance 150 µF, bleed resistor 470 kΩ, starting voltage 340 V';

export function bleedDown(input: BleedDownInput): Result<BleedDownResult> {
  const read = readInput(bleedDownInputSchema, input, EXAMPLE);
  if (!read.ok) return read;
  const { capacitanceF: c, resistanceOhm: r, initialVoltageV: v0, safeVoltageV: vSafe } = read.value;
  const timeConstantS = r * c;
  // Both finite and above zero, yet their product can underflow to zero: the decay would have no time scale.
  if (timeConstantS === 0) {
    return fail(
      'The time constant R × C comes out too small to work with: the inputs are far outside any real part. Check their units.',
      EXAMPLE,
    );
  }
  const alreadySafe = v0 <= vSafe;
  const timeToSafeS = alreadySafe ? 0 : canonicalMagnitude(timeConstantS * Math.log(v0 / vSafe));
  const figures = {
    'time constant': canonicalMagnitude(timeConstantS),
    'time to the safe voltage': timeToSafeS,
    'stored energy': canonicalMagnitude(0.5 * c * v0 * v0),
    'energy left at the safe voltage': canonicalMagnitude(0.5 * c * Math.min(v0, vSafe) ** 2),
    'energy the resistor takes': alreadySafe ? 0 : canonicalMagnitude(0.5 * c * (v0 * v0 - vSafe * vSafe)),
    'resistor power at the start': canonicalMagnitude((v0 * v0) / r),
    // The chart's time axis (see bleedDownCurve) must stay a number too.
    'chart length': chartEndS(timeConstantS, timeToSafeS),
  };
  const tooLarge = refuseNonFinite(figures, EXAMPLE);
  if (tooLarge) return tooLarge;
  const notes = ['Use a resistor rated for the full starting voltage as well as the power.'];
  if (alreadySafe) notes.push(`The starting voltage is already at or below ${vSafe} V; measure it all the same.`);
  return ok({
    caution: BLEED_DOWN_CAUTION,
    initialVoltageV: v0,
    timeConstantS: figures['time constant'],
    timeToSafeS: figures['time to the safe voltage'],
    safeVoltageV: vSafe,
    storedEnergyJ: figures['stored energy'],
    energyLeftJ: figures['energy left at the safe voltage'],
    resistorEnergyJ: figures['energy the resistor takes'],
    initialResistorPowerW: figures['resistor power at the start'],
    notes,
  });
}

/** V(t) = V0 · e^(−t/RC). */
export function voltageAfter(initialVoltageV: number, timeS: number, timeConstantS: number): number {
  return initialVoltageV * Math.exp(-timeS / timeConstantS);
}

/** The chart runs to five time constants, or a little past the safe time when that is later. */
function chartEndS(timeConstantS: number, timeToSafeS: number): number {
  return Math.max(5 * timeConstantS, 1.2 * timeToSafeS);
}

export interface BleedDownCurve {
  caution: string;
  points: Array<{ timeS: number; voltageV: number }>;
}

/** Evenly spaced points of the decay for a chart, to five time constants or past the safe time. */
export function bleedDownCurve(input: BleedDownInput, pointCount = 61): Result<BleedDownCurve> {
  const result = bleedDown(input);
  if (!result.ok) return result;
  if (!Number.isInteger(pointCount) || pointCount < 2 || pointCount > 1000) {
    return fail('The number of points must be a whole number from 2 to 1000.', '61');
  }
  const { timeConstantS, timeToSafeS, initialVoltageV: v0 } = result.value;
  const endS = chartEndS(timeConstantS, timeToSafeS);
  const points = Array.from({ length: pointCount }, (_, i) => {
    // The fraction first, so a long but finite chart cannot overflow on the way.
    const timeS = canonicalMagnitude(endS * (i / (pointCount - 1)));
    return { timeS, voltageV: canonicalMagnitude(voltageAfter(v0, timeS, timeConstantS)) };
  });
  return ok({ caution: BLEED_DOWN_CAUTION, points });
}
