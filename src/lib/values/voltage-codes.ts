// Letter-digit codes for a capacitor's rated voltage as printed on small parts (1C = 16 V, 2G = 400 V).
import { fail, ok, type Result } from './result';

/**
 * The EIA rated-voltage code (EIA-198; also used in JIS C 5101), written here from memory: the digit is a
 * decade and the letter a figure within it. Only the codes common on electrolytic and film capacitors.
 */
export const voltageCodes: Readonly<Record<string, number>> = {
  '0E': 2.5,
  '0G': 4,
  '0J': 6.3,
  '1A': 10,
  '1C': 16,
  '1D': 20,
  '1E': 25,
  '1V': 35,
  '1H': 50,
  '1J': 63,
  '2A': 100,
  '2C': 160,
  '2D': 200,
  '2E': 250,
  '2F': 315,
  '2V': 350,
  '2G': 400,
  '2W': 450,
  '2J': 630,
};

/** Code letters that are also unit symbols, so "1A" could be a code or a plain value. */
const unitLetters: Readonly<Record<string, string>> = { A: 'A', V: 'V', H: 'H', W: 'W' };

const VOLTAGE_CODE_EXAMPLE = '1C (16 V), 1E (25 V) or 2G (400 V)';

/**
 * A voltage code on a capacitor's marking, in volts; undefined when the text is not one. A code that also
 * reads as a plain value ("1A" is 1 ampere, "1V" 1 volt, "2W" 2 watts) is refused rather than guessed.
 */
export function readVoltageCode(text: string): Result<number> | undefined {
  const volts = voltageCodes[text];
  if (volts === undefined) return undefined;
  const unit = unitLetters[text.charAt(1)];
  if (unit) {
    return fail(
      `"${text}" is the voltage code for ${volts} V but also reads as ${text.charAt(0)} ${unit}; write the voltage with its unit.`,
      `${volts}V, or ${VOLTAGE_CODE_EXAMPLE}`,
    );
  }
  return ok(volts);
}
