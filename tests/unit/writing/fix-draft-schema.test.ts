// The shared draft schema: lenient while writing, strict on submission, with a message on every field it refuses.
import { describe, expect, it } from 'vitest';
import { emptyDraft, fixDraftSchema, fixSubmissionSchema, submissionIssues, type FixDraftInput } from '@/lib/schemas/fix-draft';

function complete(): FixDraftInput {
  return {
    ...emptyDraft(),
    title: 'Tray opens, then closes again',
    symptoms: ['Tray opens and shuts at once'],
    cause: 'The loading belt has stretched.',
    body: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Fit a new belt.' }] }] },
    machineIds: [1],
    parts: [{ ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C', quantity: 2, notes: '' }],
  };
}

const fieldsOf = (input: FixDraftInput) => {
  const result = fixSubmissionSchema.safeParse(input);
  return result.success ? {} : Object.fromEntries(result.error.issues.map((i) => [i.path.join('.'), i.message]));
};

describe('fixDraftSchema', () => {
  it('refuses an id larger than the database holds, in the field’s own sentence', () => {
    const result = fixDraftSchema.safeParse({ ...emptyDraft(), machineIds: [2_147_483_648] });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]!.path).toEqual(['machineIds', 0]);
    expect(fixDraftSchema.safeParse({ ...emptyDraft(), machineIds: [2_147_483_647] }).success).toBe(true);
  });

  it('accepts an empty draft so autosave never refuses work in progress', () => {
    expect(fixDraftSchema.safeParse(emptyDraft()).success).toBe(true);
  });

  it('drops blank symptom lines and trims the rest', () => {
    const parsed = fixDraftSchema.parse({ ...emptyDraft(), symptoms: ['  No rewind ', '', '   '] });
    expect(parsed.symptoms).toEqual(['No rewind']);
  });

  it('refuses a body that is not a document, naming the body field', () => {
    const result = fixDraftSchema.safeParse({ ...emptyDraft(), body: { type: 'paragraph' } });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.path).toEqual(['body']);
    expect(result.error?.issues[0]?.message).toMatch(/remedy could not be read/);
  });

  it('cleans unknown nodes out of the body instead of storing them', () => {
    const parsed = fixDraftSchema.parse({
      ...emptyDraft(),
      body: { type: 'doc', content: [{ type: 'script', content: [{ type: 'text', text: 'x' }] }, { type: 'paragraph' }] },
    });
    expect(JSON.stringify(parsed.body)).not.toContain('script');
  });

  it('refuses a quantity that is not a whole number', () => {
    const result = fixDraftSchema.safeParse({
      ...emptyDraft(),
      parts: [{ ref: '', kind: 'belt', value: 'belt', rating: '', quantity: 1.5, notes: '' }],
    });
    expect(result.error?.issues[0]?.path).toEqual(['parts', 0, 'quantity']);
  });
});

describe('fixSubmissionSchema', () => {
  it('passes a complete fix', () => {
    expect(fieldsOf(complete())).toEqual({});
  });

  it('names the missing symptom, cause, remedy and machine', () => {
    const fields = fieldsOf({ ...complete(), symptoms: [], cause: '', body: { type: 'doc', content: [] }, machineIds: [] });
    expect(Object.keys(fields).sort()).toEqual(['body', 'cause', 'machineIds', 'symptoms']);
    expect(fields.symptoms).toMatch(/at least one symptom/);
  });

  it('shows the value decoder’s message and example on a part value it cannot read', () => {
    const fields = fieldsOf({
      ...complete(),
      parts: [{ ref: 'C1', kind: 'capacitor', value: '47 0uF', rating: '', quantity: 1, notes: '' }],
    });
    expect(fields['parts.0.value']).toMatch(/For example:/);
  });

  it('refuses a reading without an expected value, in the table and in the remedy', () => {
    const withTable = fieldsOf({ ...complete(), readings: [{ testPoint: 'TP3', expected: '', measured: '', note: '' }] });
    expect(withTable['readings.0.expected']).toMatch(/expected value/);
    const inBody = submissionIssues(
      fixDraftSchema.parse({
        ...complete(),
        body: {
          type: 'doc',
          content: [
            { type: 'paragraph', content: [{ type: 'text', text: 'Measure.' }] },
            { type: 'reading', attrs: { testPoint: 'TP3', expected: '', measured: '', note: '' } },
          ],
        },
      }),
    );
    expect(inBody.map((i) => i.message).join(' ')).toMatch(/at TP3.*expected value/);
  });

  it('refuses the same caution kind twice', () => {
    const fields = fieldsOf({
      ...complete(),
      cautions: [
        { kind: 'mains', detail: '' },
        { kind: 'mains', detail: 'again' },
      ],
    });
    expect(fields.cautions).toMatch(/once/);
  });
});
