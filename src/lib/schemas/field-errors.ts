// The one way a zod failure becomes what a person reads: each field's message a sentence with an example.
import type { z } from 'zod';

type Issue = z.core.$ZodIssue;

/**
 * Validator wording that must never reach a person: zod's own defaults ("Invalid input: expected number,
 * received NaN", "Too small: expected string to have >=1 characters", "Unrecognized key: …").
 */
const rawWording = /^(?:Invalid\b|Too (?:big|small)\b|Unrecognized keys?\b)|\bexpected \w+.*\breceived\b|\bNaN\b|[{}]|[<>]=/;

export function isRawValidatorText(message: string): boolean {
  return rawWording.test(message);
}

/** "ratedVoltageV" → "Rated voltage", "partsUsed.2.value" → "Value"; the field a person sees, in words. */
export function fieldLabel(path: readonly PropertyKey[]): string {
  const name = [...path].reverse().find((segment): segment is string => typeof segment === 'string');
  if (!name) return 'This value';
  const words = name
    .replace(/(?:Mm|Hz|[A-Z])$/, (unit) => (name.length > unit.length + 2 ? '' : unit))
    .replace(/_/g, ' ')
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .toLowerCase()
    .trim();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

const typeExamples: Record<string, string> = {
  number: 'a number, e.g. 12',
  int: 'a whole number, e.g. 3',
  string: 'text, e.g. a few words',
  boolean: 'yes or no',
  array: 'a list, e.g. one line per item',
  object: 'its own fields filled in',
  date: 'a date, e.g. 2026-03-14',
};

function listOf(values: readonly unknown[]): string {
  const shown = values.map((v) => String(v).replace(/_/g, ' '));
  return shown.length <= 1 ? (shown[0] ?? '') : `${shown.slice(0, -1).join(', ')} or ${shown.at(-1) ?? ''}`;
}

/** A sentence with an example for an issue that carries only the validator's own wording. */
function sentenceFor(issue: Issue): string {
  const label = fieldLabel(issue.path);
  switch (issue.code) {
    case 'invalid_type': {
      const wanted = typeExamples[issue.expected] ?? 'a value of the right kind';
      return `${label} needs ${wanted}.`;
    }
    case 'too_small':
      if (issue.origin === 'string') {
        return Number(issue.minimum) <= 1
          ? `${label} is empty; fill it in, e.g. a few words.`
          : `${label} needs at least ${issue.minimum} characters.`;
      }
      if (issue.origin === 'array' || issue.origin === 'set')
        return `${label} needs at least ${issue.minimum} item${Number(issue.minimum) === 1 ? '' : 's'}.`;
      return `${label} must be ${issue.inclusive ? 'at least' : 'above'} ${issue.minimum}, e.g. ${issue.inclusive ? issue.minimum : Number(issue.minimum) + 1}.`;
    case 'too_big':
      if (issue.origin === 'string') return `${label} is longer than ${issue.maximum} characters; shorten it.`;
      if (issue.origin === 'array' || issue.origin === 'set') return `${label} holds at most ${issue.maximum} items; remove some.`;
      return `${label} must be ${issue.inclusive ? 'at most' : 'below'} ${issue.maximum}, e.g. ${issue.maximum}.`;
    case 'invalid_value':
      return `${label} must be ${issue.values.length === 1 ? '' : 'one of '}${listOf(issue.values)}.`;
    case 'invalid_format':
      if (issue.format === 'email') return `${label} needs an e-mail address, e.g. name@example.org.`;
      if (issue.format === 'url') return `${label} needs a web address, e.g. https://example.org/page.`;
      return `${label} is not written in the form this field takes; check it against the hint beside it.`;
    case 'not_multiple_of':
      return `${label} must be a multiple of ${issue.divisor}, e.g. ${issue.divisor}.`;
    case 'unrecognized_keys':
      return `${listOf(issue.keys)} ${issue.keys.length === 1 ? 'is not a field' : 'are not fields'} of this form; leave ${issue.keys.length === 1 ? 'it' : 'them'} out.`;
    default:
      return `${label} is not in a form this field takes; check it against the hint beside it.`;
  }
}

/** The message a person reads for one issue: the schema's own sentence, or one written from the issue. */
export function readableMessage(issue: Issue): string {
  return isRawValidatorText(issue.message) ? sentenceFor(issue) : issue.message;
}

/** `{ "page": ["Page must be at least 1, e.g. 1."] }`; an error with no path goes under "_". */
export function fieldErrors(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    const message = readableMessage(issue);
    const messages = (fields[key] ??= []);
    if (!messages.includes(message)) messages.push(message);
  }
  return fields;
}

/**
 * zod's per-parse `error` option: every issue a schema leaves without a sentence of its own gets one with an
 * example, so a form checked in the browser (e.g. through react-hook-form's zodResolver) never shows zod's
 * wording. A schema's own messages still win.
 */
export const readableErrors = {
  error: (issue: z.core.$ZodRawIssue): string => sentenceFor({ ...issue, path: issue.path ?? [], message: '' } as unknown as Issue),
};
