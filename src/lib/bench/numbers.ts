// Zod pieces for the bench tools' numeric inputs, each with a message that says what is wrong.
import { z } from 'zod';

/** A tool's input as named figures; the message for anything that is not one names an example. */
export function figures<S extends z.core.$ZodLooseShape>(shape: S, example: string): z.ZodObject<S> {
  return z.object(shape, { error: `Give the figures by name, e.g. ${example}.` });
}

/** Yes or no, such as "low-ESR". */
export function yesOrNo(what: string): z.ZodBoolean {
  return z.boolean({ error: `${what} is yes or no (true or false).` });
}

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
