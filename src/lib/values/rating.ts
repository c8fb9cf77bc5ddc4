// Reads the rating text of a parts row ("16V 105C low-ESR", "0.25W 1%", "Ø10x16mm P5") into fields.
import { MAX_TEXT_LENGTH, parseValue } from './parse-value';
import { formatMagnitude } from './format-value';
import { withArticle } from './quantities';
import { fail, ok, type Result } from './result';
import { parseTemperature } from './temperature';
import { parseTolerance, sameTolerance, type Tolerance } from './tolerance';
import { readDecimalCommas } from './decimal-comma';
import { readVoltageCode } from './voltage-codes';

export interface RatingFields {
  /** Rated voltage in V. */
  voltage?: number;
  temperatureC?: number;
  tolerance?: Tolerance;
  lowEsr?: boolean;
  bipolar?: boolean;
  powerW?: number;
  rippleCurrentA?: number;
  lifeHours?: number;
  diameterMm?: number;
  heightMm?: number;
  leadPitchMm?: number;
  /** Other words ("radial", "snap-in"), lower case, in the order written. */
  words: string[];
}

const RATING_EXAMPLE = '16V 105C low-ESR, 0.25W 1%, Ø10x16mm P5';
const NUM = String.raw`(\d+(?:\.\d+)?)`;

type NumericField = 'voltage' | 'temperatureC' | 'powerW' | 'rippleCurrentA' | 'lifeHours' | 'diameterMm' | 'heightMm' | 'leadPitchMm';

const fieldNames: Record<NumericField, string> = {
  voltage: 'voltages',
  temperatureC: 'temperature classes',
  powerW: 'power ratings',
  rippleCurrentA: 'ripple currents',
  lifeHours: 'life ratings',
  diameterMm: 'diameters',
  heightMm: 'heights',
  leadPitchMm: 'lead pitches',
};

/** Sets a field once; a second, different value for the same field is a contradiction, not a choice. */
function setField(fields: RatingFields, name: NumericField, value: number): Result<true> {
  const before = fields[name];
  if (before !== undefined && before !== value) {
    return fail(`The rating gives two different ${fieldNames[name]} (${before} and ${value}).`, RATING_EXAMPLE);
  }
  fields[name] = value;
  return ok(true);
}

interface Extractor {
  pattern: RegExp;
  apply: (match: RegExpExecArray, fields: RatingFields) => Result<true>;
}

const extractors: Extractor[] = [
  { pattern: /\blow[\s-]*(?:esr|impedance|imp\.?|z)(?![a-z])/gi, apply: (_m, f) => ((f.lowEsr = true), ok(true)) },
  { pattern: /\b(?:bi-?polar|non-?polari[sz]ed|non-?polar|np|bp)\b/gi, apply: (_m, f) => ((f.bipolar = true), ok(true)) },
  { pattern: /\bpolari[sz]ed\b/gi, apply: (_m, f) => ((f.bipolar = f.bipolar ?? false), ok(true)) },
  {
    pattern: new RegExp(String.raw`(?:ø|⌀|dia\.?\s*)?${NUM}\s*(?:mm)?\s*[x×*]\s*(?:l|h)?\s*${NUM}\s*mm\b`, 'gi'),
    apply: (m, f) => both(setField(f, 'diameterMm', Number(m[1])), () => setField(f, 'heightMm', Number(m[2]))),
  },
  {
    pattern: new RegExp(String.raw`(?:\b(?:pitch|p|ls)\s*[=:]?\s*${NUM}\s*(?:mm)?|${NUM}\s*mm\s+pitch)\b`, 'gi'),
    apply: (m, f) => setField(f, 'leadPitchMm', Number(m[1] ?? m[2])),
  },
  { pattern: new RegExp(String.raw`\b${NUM}\s*(?:h|hrs?|hours?)\b`, 'gi'), apply: (m, f) => setField(f, 'lifeHours', Number(m[1])) },
  {
    pattern: /(?:±|\+\/-|\+-)\s*\d+(?:\.\d+)?\s*%|[+-]\s*\d+(?:\.\d+)?\s*%?\s*\/?\s*[+-]\s*\d+(?:\.\d+)?\s*%|\b\d+(?:\.\d+)?\s*%/g,
    apply: (m, f) => readTolerance(m[0], f),
  },
  {
    pattern: /(?:[-+]?\d+\s*(?:°|º|o|deg)?\s*C?\s*(?:~|\.\.\.?|…|\/|to)\s*)?\+?\d+(?:\.\d+)?\s*(?:°|º|o|deg\.?)?\s*C(?![a-z])/gi,
    apply: (m, f) => {
      const temperature = parseTemperature(m[0]);
      return temperature.ok ? setField(f, 'temperatureC', temperature.value) : temperature;
    },
  },
];

function both(first: Result<true>, second: () => Result<true>): Result<true> {
  return first.ok ? second() : first;
}

function readTolerance(text: string, fields: RatingFields): Result<true> {
  const tolerance = parseTolerance(text);
  if (!tolerance.ok) return tolerance;
  if (fields.tolerance && !sameTolerance(fields.tolerance, tolerance.value)) {
    return fail('The rating gives two different tolerances.', RATING_EXAMPLE);
  }
  fields.tolerance = tolerance.value;
  return ok(true);
}

export interface RatingOptions {
  /** Read letter-digit voltage codes (1C = 16 V), as on a capacitor's marking. */
  voltageCodes?: boolean;
}

/**
 * Parts lists join a value and its ratings with slashes ("100uF/16V/105C"): those slashes become spaces.
 * A slash after a plain integer is a fraction bar (1/4W), and one before a sign belongs to a range (+80/-20%).
 */
export function splitAtSlashes(text: string): string {
  return text.replace(/([^\s/]+)\s*\/\s*(?=[\d.])/g, (whole: string, left: string) => (/^\d+$/.test(left) ? whole : `${left} `));
}

export function parseRating(text: string, options: RatingOptions = {}): Result<RatingFields> {
  // Twice a value's limit: the reader also gets the words that followed the value in its own cell.
  if (text.length > 2 * MAX_TEXT_LENGTH) return fail(`The rating is longer than ${2 * MAX_TEXT_LENGTH} characters.`, RATING_EXAMPLE);
  const fields: RatingFields = { words: [] };
  const commas = readDecimalCommas(splitAtSlashes(text.normalize('NFKC')));
  if (!commas.ok) return commas;
  let rest = commas.value.replace(/[µμ]/g, 'u').replace(/[\u2212\u2013]/g, '-');
  // Before the other readers, since "1C" (16 V) would otherwise read as a temperature.
  if (options.voltageCodes) {
    const codes = readVoltageCodes(rest, fields);
    if (!codes.ok) return codes;
    rest = codes.value;
  }
  for (const extractor of extractors) {
    for (const match of rest.matchAll(extractor.pattern)) {
      const applied = extractor.apply(match as RegExpExecArray, fields);
      if (!applied.ok) return applied;
    }
    rest = rest.replace(extractor.pattern, ' ');
  }
  // "16 V DC" and "16 V" become "16V" so each value is one token.
  rest = rest.replace(/(\d)\s*(v|wv|w\.v\.)\s*\.?\s*dc\b/gi, '$1V').replace(/(\d)\s+(?=[pnumkKMG]?(?:F|Ω|ohms?|V|WV|W|A|H)\b)/g, '$1');
  for (const token of rest.split(/[\s,;|@()]+/).filter((t) => t !== '')) {
    const read = readToken(token, fields);
    if (!read.ok) return read;
  }
  return ok(fields);
}

/** Takes the letter-digit voltage codes out of the text into the voltage field; the rest is returned. */
function readVoltageCodes(text: string, fields: RatingFields): Result<string> {
  const codePattern = /(?<![\w.])([0-3][A-Z])(?![\w.])/g;
  for (const match of text.matchAll(codePattern)) {
    const volts = readVoltageCode(match[1] ?? '');
    if (!volts) continue;
    if (!volts.ok) return volts;
    const set = setField(fields, 'voltage', volts.value);
    if (!set.ok) return set;
  }
  return ok(text.replace(codePattern, (code: string) => (readVoltageCode(code) ? ' ' : code)));
}

function readToken(token: string, fields: RatingFields): Result<true> {
  if (/^[a-z][a-z.'-]*$/i.test(token)) {
    fields.words.push(token.toLowerCase().replace(/\.+$/, ''));
    return ok(true);
  }
  const value = parseValue(token);
  if (!value.ok) {
    return fail(`Could not read "${token}" in the rating: ${value.error.message}`, RATING_EXAMPLE);
  }
  const { quantity, magnitude } = value.value;
  if (quantity === 'voltage') return setField(fields, 'voltage', magnitude);
  if (quantity === 'power') return setField(fields, 'powerW', magnitude);
  if (quantity === 'current') return setField(fields, 'rippleCurrentA', magnitude);
  return fail(
    `The rating holds ${withArticle(quantity)} (${formatMagnitude(value.value)}); a part has one value, written in the value column.`,
    RATING_EXAMPLE,
  );
}
