// Decimal commas as written in much of the world ("4,7 µF", "6,3V"), read as points where that is certain.
import { fail, ok, type Result } from './result';

const THOUSANDS_EXAMPLE = '4.7 µF, 4,7 µF or 4700 µF';

/**
 * Turns each comma between digits into a decimal point. Refused rather than guessed: "4,700" (a decimal
 * comma or a thousands separator), several commas in one number, and a comma beside a decimal point.
 * Other commas (list separators) are left for the caller.
 */
export function readDecimalCommas(text: string): Result<string> {
  if (!/\d,\d/.test(text)) return ok(text);
  const grouped = /\d+(?:[.,]\d+){2,}/.exec(text);
  if (grouped) {
    return fail(
      `"${grouped[0]}" uses both commas and points or several commas; write the number with one decimal point and no separators.`,
      THOUSANDS_EXAMPLE,
    );
  }
  const ambiguous = /(?<![\d.])(\d{1,3}),(\d{3})(?![\d])/.exec(text);
  if (ambiguous) {
    return fail(
      `"${ambiguous[0]}" could be ${Number(`${ambiguous[1]}.${ambiguous[2]}`)} (a decimal comma) or ${ambiguous[1]}${ambiguous[2]} (a thousands separator); write it without the comma.`,
      THOUSANDS_EXAMPLE,
    );
  }
  return ok(text.replace(/(\d),(?=\d)/g, '$1.'));
}
