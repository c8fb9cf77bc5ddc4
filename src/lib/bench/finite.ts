// Guards a bench tool's answer: a figure that overflowed to Infinity (or became NaN) is refused, never shown.
import { type InputError } from '@/lib/values/result';

/**
 * The first figure that is not a finite number, as an error naming it, or undefined when all are finite.
 * Inputs far beyond any real part (1e200 F) pass the schemas as finite numbers yet overflow in the arithmetic.
 */
export function refuseNonFinite(figures: Readonly<Record<string, number>>, example: string): { ok: false; error: InputError } | undefined {
  const name = Object.keys(figures).find((key) => !Number.isFinite(figures[key]));
  if (name === undefined) return undefined;
  const message = `The ${name} comes out beyond the numbers this tool can work with: the inputs are far outside any real part. Check their units and size.`;
  return { ok: false, error: { message, example } };
}
