// Rule checks and zod issues become field messages a person can read; the validator's own wording never passes.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { issuesToFields } from '@/server/http/result';
import { isRawValidatorText } from '@/lib/schemas/field-errors';

describe('issuesToFields', () => {
  it('rewrites a zod issue still in validator wording into a sentence with an example', () => {
    const parsed = z.object({ timeMinutes: z.number().int().min(1) }).safeParse({ timeMinutes: Number.NaN });
    expect(parsed.success).toBe(false);
    const fields = issuesToFields(parsed.error!.issues);
    expect(fields.timeMinutes?.[0]).toBe('Time minutes needs a number, e.g. 12.');
    expect(isRawValidatorText(fields.timeMinutes![0]!)).toBe(false);
  });

  it("keeps our own rule checks' sentences as written and groups them by field", () => {
    const fields = issuesToFields([
      { path: ['photoIds'], message: 'The photo “belt” is still being processed; submit again in a moment.' },
      { path: [], message: 'Add at least one symptom, e.g. “tray will not close”.' },
    ]);
    expect(fields).toEqual({
      photoIds: ['The photo “belt” is still being processed; submit again in a moment.'],
      _: ['Add at least one symptom, e.g. “tray will not close”.'],
    });
  });
});
