// Exact decimal helpers: magnitudes are kept to 12 significant figures so text round trips are stable.

/** Significant figures kept in every magnitude; far beyond any marking, well inside a double. */
export const SIGNIFICANT_FIGURES = 12;

/** Rounds to the canonical precision, so 4.7e-6 and 4.7 × 1e-6 become the same number. */
export function canonicalMagnitude(x: number): number {
  if (x === 0) return 0;
  return Number(x.toPrecision(SIGNIFICANT_FIGURES));
}

/** Reads "4.7" with a power of ten exactly (the decimal string is parsed once, not multiplied). */
export function decimalToNumber(digits: string, exponent: number): number {
  return canonicalMagnitude(Number(`${digits}e${exponent}`));
}

/**
 * Writes x / 10^exponent as a plain decimal without floating-point noise or an exponent:
 * scaledDecimal(4.7e-6, -6) === "4.7". The digits come from the number's own decimal form.
 */
export function scaledDecimal(x: number, exponent: number): string {
  if (x === 0) return '0';
  const sign = x < 0 ? '-' : '';
  const [mantissaText = '0', exponentText = '0'] = Math.abs(x)
    .toExponential(SIGNIFICANT_FIGURES - 1)
    .split('e');
  const digits = mantissaText.replace('.', '').replace(/0+$/, '') || '0';
  const pointAfter = 1 + Number(exponentText) - exponent;
  if (pointAfter <= 0) return `${sign}0.${'0'.repeat(-pointAfter)}${digits}`;
  if (pointAfter >= digits.length) return `${sign}${digits}${'0'.repeat(pointAfter - digits.length)}`;
  return `${sign}${digits.slice(0, pointAfter)}.${digits.slice(pointAfter)}`;
}

/** Rounds for display to a number of significant figures, without trailing zeros. */
export function roundSignificant(x: number, figures: number): number {
  if (x === 0 || !Number.isFinite(x)) return x;
  return Number(x.toPrecision(figures));
}
