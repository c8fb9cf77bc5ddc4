// Splitting a draft into values that pass and fields held as typed, putting them back for the form, and the messages.
import { describe, expect, it } from 'vitest';
import { emptyDraft, fixDraftSchema, fixSubmissionSchema, splitDraft, withHeldFields } from '@/lib/schemas/fix-draft';

const helpful = /^[A-Z].*(e\.g\.|For example).*[.”]$/;
const rawValidatorText =
  /\bexpected (string|number|array|object|nonoptional)|received|invalid_type|Too small|Too big|NaN|Invalid (input|option)/;

describe('splitDraft', () => {
  it('holds nothing when every field passes', () => {
    const split = splitDraft(emptyDraft());
    expect(split).toEqual({ ok: true, values: fixDraftSchema.parse(emptyDraft()), held: {} });
  });

  it('holds a negative bench time as typed and stores no time', () => {
    const split = splitDraft({ ...emptyDraft(), title: 'Kept', timeMinutes: -5 });
    expect(split.ok && split.values).toMatchObject({ title: 'Kept', timeMinutes: null });
    expect(split.ok && split.held.timeMinutes).toEqual({ typed: -5, message: expect.stringMatching(helpful) });
  });

  it('holds one cell of a parts row and keeps the rest of the row and the other rows', () => {
    const parts = [
      { ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V', quantity: 0, notes: 'low-ESR' },
      { ref: 'R3', kind: 'resistor', value: '2k2', rating: '', quantity: 2, notes: '' },
    ];
    const split = splitDraft({ ...emptyDraft(), parts });
    if (!split.ok) throw new Error(split.message);
    expect(Object.keys(split.held)).toEqual(['parts.0.quantity']);
    expect(split.values.parts).toEqual([{ ...parts[0], quantity: 1 }, parts[1]]);
  });

  it('holds a whole list when a row is not a row at all', () => {
    const split = splitDraft({ ...emptyDraft(), readings: ['TP4 12 V'] });
    expect(split.ok && split.held.readings?.typed).toEqual(['TP4 12 V']);
    expect(split.ok && split.values.readings).toEqual([]);
  });

  it('fills fields the sender left out with their empty values', () => {
    const split = splitDraft({ title: 'Only a title' });
    expect(split.ok && split.values).toMatchObject({ title: 'Only a title', symptoms: [], parts: [] });
    expect(split.ok && split.held).toEqual({});
  });

  it('refuses a remedy that is not a document and a draft that is not a set of fields', () => {
    const body = splitDraft({ ...emptyDraft(), body: { type: 'paragraph' } });
    expect(body.ok).toBe(false);
    expect(!body.ok && Object.keys(body.fields)).toEqual(['body']);
    expect(splitDraft([1, 2]).ok).toBe(false);
    expect(splitDraft('draft').ok).toBe(false);
  });
});

describe('withHeldFields', () => {
  it('puts held fields back where they were typed, leaving the stored values alone', () => {
    const values = { ...emptyDraft(), parts: [{ ref: '', kind: 'belt' as const, value: 'belt', rating: '', quantity: 1, notes: '' }] };
    const shown = withHeldFields(values, {
      timeMinutes: { typed: -5, message: 'm' },
      'parts.0.quantity': { typed: 0, message: 'm' },
      'parts.4.quantity': { typed: 0, message: 'a row that is gone' },
    });
    expect(shown.timeMinutes).toBe(-5);
    expect(shown.parts[0]?.quantity).toBe(0);
    expect(shown.parts).toHaveLength(1);
    expect(values.timeMinutes).toBeNull();
    expect(values.parts[0]?.quantity).toBe(1);
  });
});

describe('messages of the draft and submission checks', () => {
  // Every kind of wrong input a field can get, typed or sent: each answer is a sentence with an example.
  const wrong: Record<string, unknown[]> = {
    title: [42, 'x'.repeat(161)],
    symptoms: ['No rewind', [7], ['x'.repeat(201)], Array(21).fill('No rewind')],
    errorCodes: [[null], ['x'.repeat(41)]],
    cause: [false, 'x'.repeat(2001)],
    parts: [
      'C512',
      [{ ref: 'C512', kind: 'gizmo', value: 5, rating: [], quantity: 'two', notes: 'x'.repeat(501) }],
      [{ ref: 'x'.repeat(41), kind: 'capacitor', value: '', rating: '', quantity: 1000, notes: '' }],
      [{ ref: '', kind: 'capacitor', value: '', rating: '', quantity: 1.5, notes: '' }],
    ],
    readings: [[{ testPoint: 1, expected: null, measured: 'x'.repeat(81), note: 'x'.repeat(301) }]],
    cautions: [[{ kind: 'lava', detail: 3 }], Array(7).fill({ kind: 'mains', detail: '' })],
    difficulty: ['easy', 3],
    timeMinutes: [-5, 0, 2.5, 10001, 'forty', Number.NaN],
    editSummary: [{}, 'x'.repeat(301)],
    machineIds: [['1'], [-1], 'all'],
    chassisIds: [[1.5]],
    photoIds: [[0]],
  };
  for (const [field, inputs] of Object.entries(wrong)) {
    it(`answers a sentence with an example for a wrong ${field}`, () => {
      for (const input of inputs) {
        const result = fixDraftSchema.safeParse({ ...emptyDraft(), [field]: input });
        expect(result.success, `${field} = ${JSON.stringify(input)}`).toBe(false);
        for (const issue of result.error!.issues) {
          expect(issue.message, `${field} = ${JSON.stringify(input)}`).toMatch(helpful);
          expect(issue.message).not.toMatch(rawValidatorText);
        }
      }
    });
  }

  it('answers a sentence with an example for everything a submission still needs', () => {
    const result = fixSubmissionSchema.safeParse({
      ...emptyDraft(),
      body: {
        type: 'doc',
        content: [
          { type: 'reading', attrs: { testPoint: 'TP1', expected: '' } },
          { type: 'figure', attrs: { src: '/media/x.jpg', alt: '' } },
        ],
      },
      parts: [{ ref: '', kind: 'capacitor', value: '', rating: '', quantity: 1, notes: '' }],
      readings: [{ testPoint: '', expected: '', measured: '', note: '' }],
      cautions: [
        { kind: 'mains', detail: '' },
        { kind: 'mains', detail: '' },
      ],
    });
    expect(result.success).toBe(false);
    expect(result.error!.issues.length).toBeGreaterThanOrEqual(8);
    for (const issue of result.error!.issues) expect(issue.message, issue.path.join('.')).toMatch(helpful);
  });
});
