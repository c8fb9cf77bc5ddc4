// Checks a bench tool's input against its zod schema and turns the first problem into a readable error.
import type { z } from 'zod';
import { readableMessage } from '@/lib/schemas/field-errors';
import { fail, ok, type Result } from '@/lib/values/result';

export function readInput<S extends z.ZodType>(schema: S, input: unknown, example: string): Result<z.output<S>> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return ok(parsed.data);
  const issue = parsed.error.issues[0];
  const path = issue?.path.map(String).join('.') ?? '';
  // Field messages already name the field; the path only helps when a nested list item is wrong.
  const where = path.includes('.') ? `${path}: ` : '';
  return fail(`${where}${issue ? readableMessage(issue) : 'The input could not be read.'}`, example);
}
