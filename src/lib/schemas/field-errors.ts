// Field-level messages from a zod error, the same on the server and in the browser.
import type { z } from 'zod';

/** `{ "page": ["Too small: expected number to be >=1"] }`; an error with no path goes under "_". */
export function fieldErrors(error: z.ZodError): Record<string, string[]> {
  const fields: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return fields;
}
