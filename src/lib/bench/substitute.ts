// Substitute check for electrolytic capacitors: can this candidate replace the original? Worst check wins.
import type { Result } from '@/lib/values/result';
import { readInput } from './input';
import {
  capacitanceCheck,
  headroomCheck,
  lowEsrCheck,
  polarityCheck,
  ratedVoltageCheck,
  rippleCheck,
  temperatureCheck,
} from './substitute-checks';
import { diameterCheck, heightCheck, leadPitchCheck } from './substitute-size';
import {
  substituteInputSchema,
  type CheckStatus,
  type SubstituteCheck,
  type SubstituteInput,
  type SubstituteResult,
} from './substitute-types';

export * from './substitute-types';
export { DEFAULT_TOLERANCE_PERCENT, HEADROOM_FACTOR } from './substitute-checks';

const severity: Record<CheckStatus, number> = { pass: 0, warn: 1, fail: 2 };

export function worstStatus(statuses: readonly CheckStatus[]): CheckStatus {
  return statuses.reduce<CheckStatus>((worst, s) => (severity[s] > severity[worst] ? s : worst), 'pass');
}

const EXAMPLE = 'original 470 µF 16 V 85 °C, candidate 470 µF 25 V 105 °C, working voltage 12 V';

/**
 * Each check only judges what is known: a check with no data on either side is left out; data on the
 * original but not the candidate is a warning. Every check is monotonic in the candidate's ratings.
 */
export function checkSubstitute(input: SubstituteInput): Result<SubstituteResult> {
  const read = readInput(substituteInputSchema, input, EXAMPLE);
  if (!read.ok) return read;
  const { original, candidate, workingVoltageV, space } = read.value;
  const checks: Array<SubstituteCheck | undefined> = [
    capacitanceCheck(original, candidate),
    ratedVoltageCheck(original, candidate),
    workingVoltageV === undefined ? undefined : headroomCheck(candidate, workingVoltageV),
    temperatureCheck(original, candidate),
    lowEsrCheck(original, candidate),
    rippleCheck(original, candidate),
    diameterCheck(original, candidate, space?.maxDiameterMm),
    heightCheck(original, candidate, space?.maxHeightMm),
    leadPitchCheck(original, candidate),
    polarityCheck(original, candidate),
  ];
  const present = checks.filter((c): c is SubstituteCheck => c !== undefined);
  return { ok: true, value: { verdict: worstStatus(present.map((c) => c.status)), checks: present } };
}
