// Size checks of the substitute check: can diameter, can height and lead pitch against the original or the room.
import { canonicalMagnitude } from '@/lib/values/decimal';
import type { CapacitorSpec, CheckName, SubstituteCheck } from './substitute-types';

/** Pitches closer than this are the same pitch read off different datasheets. */
const PITCH_SAME_MM = 0.1;

const mm = (x: number): string => `${canonicalMagnitude(x)} mm`;

function sizeCheck(
  check: CheckName,
  what: string,
  candidateMm: number | undefined,
  originalMm: number | undefined,
  roomMm: number | undefined,
): SubstituteCheck | undefined {
  const limit = roomMm ?? originalMm;
  if (limit === undefined) return undefined;
  const against = roomMm !== undefined ? `the ${mm(roomMm)} of room` : `the original's ${mm(limit)}`;
  if (candidateMm === undefined) {
    return { check, status: 'warn', reason: `The candidate's ${what} is not known; check it against ${against}.` };
  }
  if (candidateMm <= limit) {
    return { check, status: 'pass', reason: `${what[0]?.toUpperCase()}${what.slice(1)} ${mm(candidateMm)} fits ${against}.` };
  }
  // Larger than a measured room does not fit; larger than the original may still fit, so look first.
  return roomMm !== undefined
    ? { check, status: 'fail', reason: `${what[0]?.toUpperCase()}${what.slice(1)} ${mm(candidateMm)} is more than ${against}.` }
    : {
        check,
        status: 'warn',
        reason: `${what[0]?.toUpperCase()}${what.slice(1)} ${mm(candidateMm)} is more than ${against}; check the room around it.`,
      };
}

export function diameterCheck(original: CapacitorSpec, candidate: CapacitorSpec, roomMm?: number): SubstituteCheck | undefined {
  return sizeCheck('diameter', 'can diameter', candidate.diameterMm, original.diameterMm, roomMm);
}

export function heightCheck(original: CapacitorSpec, candidate: CapacitorSpec, roomMm?: number): SubstituteCheck | undefined {
  return sizeCheck('height', 'can height', candidate.heightMm, original.heightMm, roomMm);
}

export function leadPitchCheck(original: CapacitorSpec, candidate: CapacitorSpec): SubstituteCheck | undefined {
  if (original.leadPitchMm === undefined) return undefined;
  if (candidate.leadPitchMm === undefined) {
    return {
      check: 'leadPitch',
      status: 'warn',
      reason: `The original's leads are ${mm(original.leadPitchMm)} apart; the candidate's pitch is not known.`,
    };
  }
  if (Math.abs(candidate.leadPitchMm - original.leadPitchMm) <= PITCH_SAME_MM) {
    return { check: 'leadPitch', status: 'pass', reason: `Lead pitch ${mm(candidate.leadPitchMm)} matches the board.` };
  }
  return {
    check: 'leadPitch',
    status: 'warn',
    reason: `Lead pitch ${mm(candidate.leadPitchMm)} differs from the original's ${mm(original.leadPitchMm)}: the leads need forming to the holes without stressing the seal.`,
  };
}
