// Unit tests of fieldErrors: a schema's own sentence is kept, validator wording is rewritten with the field and an example.
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { fieldErrors, fieldLabel, readableMessage } from '@/lib/schemas/field-errors';

function errorOf(schema: z.ZodType, input: unknown): z.ZodError {
  const parsed = schema.safeParse(input);
  if (parsed.success) throw new Error('expected a failure');
  return parsed.error;
}

describe('fieldErrors', () => {
  it("keeps a schema's own message", () => {
    const schema = z.object({ quantity: z.number().min(1, 'Quantity is at least 1.') });
    expect(fieldErrors(errorOf(schema, { quantity: 0 }))).toEqual({ quantity: ['Quantity is at least 1.'] });
  });

  it('rewrites validator wording into a sentence naming the field, with an example', () => {
    const schema = z.object({ ratedVoltageV: z.number(), note: z.string().max(5), kind: z.enum(['capacitor', 'belt']) });
    const fields = fieldErrors(errorOf(schema, { ratedVoltageV: Number.NaN, note: 'too long', kind: 'x' }));
    expect(fields).toEqual({
      ratedVoltageV: ['Rated voltage needs a number, e.g. 12.'],
      note: ['Note is longer than 5 characters; shorten it.'],
      kind: ['Kind must be one of capacitor or belt.'],
    });
  });

  it('puts an error without a path under "_" and says what the whole input needs', () => {
    expect(fieldErrors(errorOf(z.object({ a: z.string() }), 'text'))).toEqual({ _: ['This value needs its own fields filled in.'] });
  });

  it('gives each message once per field', () => {
    const schema = z.object({ code: z.string().min(3, 'Give the code, e.g. F-07.').regex(/-/, 'Give the code, e.g. F-07.') });
    expect(errorOf(schema, { code: 'F' }).issues).toHaveLength(2);
    expect(fieldErrors(errorOf(schema, { code: 'F' }))).toEqual({ code: ['Give the code, e.g. F-07.'] });
  });
});

describe('fieldLabel', () => {
  it('turns a path into the words of its last field, without a unit suffix', () => {
    expect(fieldLabel(['original', 'capacitanceF'])).toBe('Capacitance');
    expect(fieldLabel(['space', 'maxDiameterMm'])).toBe('Max diameter');
    expect(fieldLabel(['lines', 3, 'quantity'])).toBe('Quantity');
    expect(fieldLabel([])).toBe('This value');
  });
});

describe('readableMessage', () => {
  it('writes a sentence for an e-mail address that does not read', () => {
    const issue = errorOf(z.object({ email: z.email() }), { email: 'nope' }).issues[0];
    expect(issue && readableMessage(issue)).toBe('Email needs an e-mail address, e.g. name@example.org.');
  });
});

describe('readableErrors (the per-parse option forms in the browser use)', () => {
  it("gives every issue a schema leaves without its own sentence one with an example, and keeps the schema's own", async () => {
    const { z } = await import('zod');
    const { readableErrors, isRawValidatorText } = await import('@/lib/schemas/field-errors');
    const schema = z.object({
      timeMinutes: z.number().int().min(1),
      title: z.string().min(3, 'Give the fix a title, e.g. “Tray will not close”.'),
      parts: z.array(z.object({ quantity: z.number() })),
    });
    const parsed = schema.safeParse({ timeMinutes: Number.NaN, title: 'x', parts: [{ quantity: 'two' }] }, readableErrors);
    expect(parsed.success).toBe(false);
    const messages = parsed.error!.issues.map((i) => i.message);
    expect(messages).toContain('Give the fix a title, e.g. “Tray will not close”.');
    expect(messages).toContain('Time minutes needs a number, e.g. 12.');
    expect(messages).toContain('Quantity needs a number, e.g. 12.');
    for (const message of messages) expect(isRawValidatorText(message)).toBe(false);
  });

  it('leaves nothing raw in the fix submission schema the editor checks with', async () => {
    const { readableErrors, isRawValidatorText } = await import('@/lib/schemas/field-errors');
    const { fixSubmissionSchema } = await import('@/lib/schemas/fix-draft');
    for (const bad of [{}, { title: 5, symptoms: 'x', timeMinutes: 'soon', parts: [{ quantity: -1 }] }, null, []]) {
      const parsed = fixSubmissionSchema.safeParse(bad, readableErrors);
      expect(parsed.success).toBe(false);
      for (const issue of parsed.error!.issues) expect(isRawValidatorText(issue.message), issue.message).toBe(false);
    }
  });
});
