// Tolerances: IEC 60062 letter codes, "±10 %" and asymmetric "+80/-20 %" forms, parsed and written one way.
import { fail, ok, type Result } from './result';

export interface Tolerance {
  minusPercent: number;
  plusPercent: number;
}

/** IEC 60062 tolerance letters used on resistors and capacitors (percent forms only). */
export const toleranceLetters: Record<string, Tolerance> = {
  B: { minusPercent: 0.1, plusPercent: 0.1 },
  C: { minusPercent: 0.25, plusPercent: 0.25 },
  D: { minusPercent: 0.5, plusPercent: 0.5 },
  F: { minusPercent: 1, plusPercent: 1 },
  G: { minusPercent: 2, plusPercent: 2 },
  J: { minusPercent: 5, plusPercent: 5 },
  K: { minusPercent: 10, plusPercent: 10 },
  M: { minusPercent: 20, plusPercent: 20 },
  N: { minusPercent: 30, plusPercent: 30 },
  Z: { minusPercent: 20, plusPercent: 80 },
};

/** On capacitors below 10 pF these letters give the tolerance in picofarads (B ±0.1 pF … G ±2 pF), not in percent. */
export const picofaradToleranceLetters: ReadonlySet<string> = new Set(['B', 'C', 'D', 'F', 'G']);

/** The letters a code may end with, for the readers' patterns. */
export const TOLERANCE_LETTER_CLASS = `[${Object.keys(toleranceLetters).join('')}]`;

const TOLERANCE_EXAMPLE = '±10 %, 10%, +80/-20 % or a letter B C D F G J K M N Z';
const NUMBER = String.raw`(\d+(?:\.\d+)?)`;
const symmetricPattern = new RegExp(String.raw`^(?:±|\+/-|\+-)?\s*${NUMBER}\s*%$`);
const plusMinusPattern = new RegExp(String.raw`^\+\s*${NUMBER}\s*%?\s*/?\s*-\s*${NUMBER}\s*%$`);
const minusPlusPattern = new RegExp(String.raw`^-\s*${NUMBER}\s*%?\s*/?\s*\+\s*${NUMBER}\s*%$`);

export function toleranceFromLetter(letter: string): Tolerance | undefined {
  return toleranceLetters[letter.toUpperCase()];
}

export function parseTolerance(text: string): Result<Tolerance> {
  const compact = text
    .normalize('NFKC')
    .replace(/\u2212/g, '-')
    .trim();
  if (compact === '') return fail('No tolerance given.', TOLERANCE_EXAMPLE);
  if (/^[a-z]$/i.test(compact)) {
    const fromLetter = toleranceFromLetter(compact);
    return fromLetter ? ok(fromLetter) : fail(`"${compact}" is not a tolerance letter.`, TOLERANCE_EXAMPLE);
  }
  const symmetric = symmetricPattern.exec(compact);
  if (symmetric) return checked(Number(symmetric[1]), Number(symmetric[1]));
  const plusMinus = plusMinusPattern.exec(compact);
  if (plusMinus) return checked(Number(plusMinus[2]), Number(plusMinus[1]));
  const minusPlus = minusPlusPattern.exec(compact);
  if (minusPlus) return checked(Number(minusPlus[1]), Number(minusPlus[2]));
  return fail(`Could not read "${text.trim()}" as a tolerance.`, TOLERANCE_EXAMPLE);
}

function checked(minusPercent: number, plusPercent: number): Result<Tolerance> {
  // Below -100 % a part would have a negative value; above 1000 % is no tolerance anyone marks.
  if (minusPercent > 100 || plusPercent > 1000) {
    return fail('That tolerance is outside what parts are marked with (at most -100 %).', TOLERANCE_EXAMPLE);
  }
  return ok({ minusPercent, plusPercent });
}

export function formatTolerance(tolerance: Tolerance): string {
  if (tolerance.minusPercent === tolerance.plusPercent) return `±${tolerance.minusPercent} %`;
  return `+${tolerance.plusPercent}/-${tolerance.minusPercent} %`;
}

export function sameTolerance(a: Tolerance | undefined, b: Tolerance | undefined): boolean {
  if (!a || !b) return a === b;
  return a.minusPercent === b.minusPercent && a.plusPercent === b.plusPercent;
}
