// Bench tool failures in the API's one error shape, with the example of good input in the field's message.
import type { z } from 'zod';
import type { InputError } from '@/lib/values/result';
import { readableMessage } from '@/lib/schemas/field-errors';
import { apiError, fieldErrors } from '@/server/http/responses';

/** "… For example: 4.7 µF, 4u7, 100nF or 104": the one sentence a field message carries. */
export function withExample(error: InputError): string {
  return `${error.message} For example: ${error.example}`;
}

/** A tool's own refusal (bad value, rating or combination) as a 400 naming the field at fault. */
export function toolInputError(field: string, error: InputError): Response {
  return apiError('bad_request', withExample(error), { [field]: [withExample(error)] });
}

/** A schema failure as a 400 with every field's message, and the example of a whole good body. */
export function schemaError(error: z.ZodError, example: string): Response {
  const fields = fieldErrors(error);
  const first = error.issues[0];
  const where = first && first.path.length > 0 ? `${first.path.join('.')}: ` : '';
  return apiError('bad_request', `${where}${first ? readableMessage(first) : 'The input is not valid.'} For example: ${example}`, fields);
}
