// Temperature class of a part ("85C", "105 °C", "-40~+105°C"): the upper category temperature in °C.
import { fail, ok, type Result } from './result';

const TEMPERATURE_EXAMPLE = '85 °C, 105C or -40~+105 °C';
/** An optional lower limit and a separator, then the upper limit with its degree mark and C. */
const temperaturePattern =
  /^(?:[-+]?\d+(?:\.\d+)?\s*(?:°|º|o|deg)?\s*C?\s*(?:~|\.\.\.?|…|\/|to)\s*)?\+?(\d+(?:\.\d+)?)\s*(?:°|º|o|deg\.?)?\s*C$/i;

/** Reads a temperature class; the lowest class in use is 40 °C and none exceeds 200 °C. */
export function parseTemperature(text: string): Result<number> {
  const compact = text
    .normalize('NFKC')
    .replace(/\u2212/g, '-')
    .trim();
  if (compact === '') return fail('No temperature given.', TEMPERATURE_EXAMPLE);
  const match = temperaturePattern.exec(compact);
  if (!match) return fail(`Could not read "${compact}" as a temperature class.`, TEMPERATURE_EXAMPLE);
  const upperC = Number(match[1]);
  if (!Number.isFinite(upperC) || upperC < 40 || upperC > 200) {
    return fail(`${upperC} °C is not a temperature class parts are rated for (40 to 200 °C).`, TEMPERATURE_EXAMPLE);
  }
  return ok(upperC);
}

export function formatTemperature(celsius: number): string {
  return `${celsius} °C`;
}
