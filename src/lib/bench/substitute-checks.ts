// The single checks of the electrolytic substitute check, each a pass, warn or fail with its reason.
import { formatMagnitude } from '@/lib/values/format-value';
import { canonicalMagnitude } from '@/lib/values/decimal';
import type { CapacitorSpec, SubstituteCheck } from './substitute-types';

/** Electrolytics are usually ±20 % (tolerance letter M); assumed when the original's is not known. */
export const DEFAULT_TOLERANCE_PERCENT = 20;
/** Common practice (no single standard): rated voltage at least 1.25 × the working voltage. */
export const HEADROOM_FACTOR = 1.25;

const uF = (farads: number): string => formatMagnitude({ quantity: 'capacitance', magnitude: farads, unit: 'F' });
const volts = (v: number): string => `${canonicalMagnitude(v)} V`;

export function capacitanceCheck(original: CapacitorSpec, candidate: CapacitorSpec): SubstituteCheck {
  const assumed = original.tolerance === undefined;
  const minus = original.tolerance?.minusPercent ?? DEFAULT_TOLERANCE_PERCENT;
  const plus = original.tolerance?.plusPercent ?? DEFAULT_TOLERANCE_PERCENT;
  const low = canonicalMagnitude(original.capacitanceF * (1 - minus / 100));
  const high = canonicalMagnitude(original.capacitanceF * (1 + plus / 100));
  const band = `${uF(low)} to ${uF(high)}${assumed ? `, taking the usual ±${DEFAULT_TOLERANCE_PERCENT} % as the original's tolerance is not known` : ''}`;
  const candidateF = canonicalMagnitude(candidate.capacitanceF);
  if (candidateF < low) {
    return { check: 'capacitance', status: 'fail', reason: `${uF(candidateF)} is below the original's range (${band}).` };
  }
  if (candidateF > high) {
    return {
      check: 'capacitance',
      status: 'warn',
      reason: `${uF(candidateF)} is above the original's range (${band}). More capacitance is often fine for smoothing, but it changes timing and filter circuits and raises the switch-on surge.`,
    };
  }
  return { check: 'capacitance', status: 'pass', reason: `${uF(candidateF)} is within the original's range (${band}).` };
}

export function ratedVoltageCheck(original: CapacitorSpec, candidate: CapacitorSpec): SubstituteCheck {
  if (candidate.ratedVoltageV < original.ratedVoltageV) {
    return {
      check: 'ratedVoltage',
      status: 'fail',
      reason: `Rated ${volts(candidate.ratedVoltageV)} is lower than the original's ${volts(original.ratedVoltageV)}.`,
    };
  }
  return {
    check: 'ratedVoltage',
    status: 'pass',
    reason: `Rated ${volts(candidate.ratedVoltageV)}, not lower than the original's ${volts(original.ratedVoltageV)}.`,
  };
}

export function headroomCheck(candidate: CapacitorSpec, workingVoltageV: number): SubstituteCheck {
  const needed = canonicalMagnitude(HEADROOM_FACTOR * workingVoltageV);
  const rated = candidate.ratedVoltageV;
  if (rated < workingVoltageV) {
    return {
      check: 'headroom',
      status: 'fail',
      reason: `Rated ${volts(rated)} is below the ${volts(workingVoltageV)} working voltage: the part would be over-stressed.`,
    };
  }
  if (rated < needed) {
    return {
      check: 'headroom',
      status: 'warn',
      reason: `Rated ${volts(rated)} leaves little headroom over ${volts(workingVoltageV)} working; common practice asks for ${volts(needed)} (1.25 × working), with DC plus ripple peak below the rating.`,
    };
  }
  return {
    check: 'headroom',
    status: 'pass',
    reason: `Rated ${volts(rated)} is at least 1.25 × the ${volts(workingVoltageV)} working voltage (${volts(needed)}, common practice).`,
  };
}

export function temperatureCheck(original: CapacitorSpec, candidate: CapacitorSpec): SubstituteCheck | undefined {
  if (original.temperatureC === undefined) return undefined;
  if (candidate.temperatureC === undefined) {
    return {
      check: 'temperature',
      status: 'warn',
      reason: `The original is a ${original.temperatureC} °C part; the candidate's class is not known.`,
    };
  }
  if (candidate.temperatureC < original.temperatureC) {
    return {
      check: 'temperature',
      status: 'fail',
      reason: `${candidate.temperatureC} °C class is lower than the original's ${original.temperatureC} °C; it will age faster where the original was chosen for heat.`,
    };
  }
  return {
    check: 'temperature',
    status: 'pass',
    reason: `${candidate.temperatureC} °C class, not lower than the original's ${original.temperatureC} °C.`,
  };
}

export function lowEsrCheck(original: CapacitorSpec, candidate: CapacitorSpec): SubstituteCheck | undefined {
  if (original.lowEsr === true) {
    if (candidate.lowEsr === true) return { check: 'lowEsr', status: 'pass', reason: 'Low-ESR like the original.' };
    if (candidate.lowEsr === undefined) {
      return { check: 'lowEsr', status: 'warn', reason: 'The original is low-ESR; check that the candidate is too.' };
    }
    return {
      check: 'lowEsr',
      status: 'fail',
      reason: 'The original is low-ESR (often in a switch-mode supply); a general-purpose part runs hot there and fails early.',
    };
  }
  if (candidate.lowEsr === true) {
    return { check: 'lowEsr', status: 'pass', reason: 'Low-ESR in place of a general-purpose part is fine in most circuits.' };
  }
  return undefined;
}

export function rippleCheck(original: CapacitorSpec, candidate: CapacitorSpec): SubstituteCheck | undefined {
  if (original.rippleCurrentA === undefined) return undefined;
  const originalA = formatMagnitude({ quantity: 'current', magnitude: original.rippleCurrentA, unit: 'A' });
  if (candidate.rippleCurrentA === undefined) {
    return {
      check: 'ripple',
      status: 'warn',
      reason: `The original is rated for ${originalA} ripple; the candidate's rating is not known.`,
    };
  }
  const candidateA = formatMagnitude({ quantity: 'current', magnitude: candidate.rippleCurrentA, unit: 'A' });
  if (candidate.rippleCurrentA < original.rippleCurrentA) {
    return {
      check: 'ripple',
      status: 'fail',
      reason: `Ripple rating ${candidateA} is lower than the original's ${originalA}; it would run hotter.`,
    };
  }
  return { check: 'ripple', status: 'pass', reason: `Ripple rating ${candidateA}, not lower than the original's ${originalA}.` };
}

export function polarityCheck(original: CapacitorSpec, candidate: CapacitorSpec): SubstituteCheck {
  const originalPolarity = original.polarity ?? 'polarised';
  const candidatePolarity = candidate.polarity ?? 'polarised';
  if (originalPolarity === 'bipolar' && candidatePolarity === 'polarised') {
    return {
      check: 'polarity',
      status: 'fail',
      reason: 'The original is bipolar: it sees voltage both ways round, which a polarised part cannot take.',
    };
  }
  if (originalPolarity === 'polarised' && candidatePolarity === 'bipolar') {
    return { check: 'polarity', status: 'pass', reason: 'A bipolar part may replace a polarised one; it works either way round.' };
  }
  return {
    check: 'polarity',
    status: 'pass',
    reason: `Both ${originalPolarity}${original.polarity ? '' : ' (polarised unless marked bipolar)'}.`,
  };
}
