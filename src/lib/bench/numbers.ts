// Zod pieces for the bench tools' numeric inputs, each with a message that says what is wrong.
import { z } from 'zod';

/** A finite number above zero; zod 4 already refuses NaN and ±Infinity. */
export function positiveNumber(what: string): z.ZodNumber {
  return z.number({ error: `${what} must be a number.` }).positive(`${what} must be above zero.`);
}

export function nonNegativeNumber(what: string): z.ZodNumber {
  return z.number({ error: `${what} must be a number.` }).nonnegative(`${what} cannot be negative.`);
}

/** A temperature in °C within what parts and benches see (-55 to 200 °C). */
export function temperatureC(what: string): z.ZodNumber {
  return z
    .number({ error: `${what} must be a number in °C.` })
    .min(-55, `${what} below -55 °C is outside any part's rating.`)
    .max(200, `${what} above 200 °C is outside any part's rating.`);
}
