// A draft keeps everything typed: an invalid field is held as typed and marked, edits elsewhere are saved with it,
// only submission waits for the fix; and any draft, however empty, can be discarded.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emptyDraft } from '@/lib/schemas/fix-draft';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { postForm } from '../support/sign-in';
import { call, completeValues, session, someMachineId, type Session } from '../fixtures/writing';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let writer: Session;
let machineId: number;

beforeAll(async () => {
  writer = await session(knex, base, 'member', 'held');
  machineId = await someMachineId(knex, 5);
});
afterAll(() => knex.destroy());

/** A message a person can act on: a sentence with an example, never a validator's own words. */
function expectHelpfulMessage(message: string): void {
  expect(message).toMatch(/^[A-Z].*[.”]$/);
  expect(message).toMatch(/e\.g\.|For example/);
  expect(message).not.toMatch(/\bexpected (string|number|array|object)|received|invalid_type|Too small|Too big|NaN|Invalid (input|option)/);
}

describe('saving a draft with an invalid field', () => {
  it('keeps the invalid fields as typed, saves edits elsewhere, and marks them after a reload', async () => {
    const values = completeValues(machineId, {
      timeMinutes: -5,
      parts: [
        { ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C', quantity: 0, notes: 'low-ESR' },
        { ref: '', kind: 'belt', value: 'flat belt 92 mm', rating: '', quantity: 1, notes: '' },
      ],
    });
    const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: writer.cookie });
    expect(created.status).toBe(201);
    const id = created.body.revision.id as number;
    expect(Object.keys(created.body.revision.held).sort()).toEqual(['parts.0.quantity', 'timeMinutes']);

    // Edits elsewhere while the two fields are still wrong.
    const edited = {
      ...values,
      cause: 'The capstan driver’s supply capacitor has dried out.',
      errorCodes: ['E31', 'E32'],
      editSummary: 'Second error code',
    };
    const saved = await call(base, `/api/v1/drafts/${id}`, { method: 'PUT', body: { values: edited }, cookie: writer.cookie });
    expect(saved.status).toBe(200);

    // "Reload": read the draft back as the editor page does.
    const read = await call(base, `/api/v1/drafts/${id}`, { cookie: writer.cookie });
    expect(read.status).toBe(200);
    const revision = read.body.revision;
    expect(revision.values).toMatchObject({
      title: values.title,
      cause: edited.cause,
      errorCodes: ['E31', 'E32'],
      editSummary: 'Second error code',
      symptoms: values.symptoms,
      machineIds: [machineId],
    });
    expect(revision.values.parts[0]).toMatchObject({ ref: 'C512', value: '470uF', notes: 'low-ESR' });
    expect(revision.values.parts[1]).toMatchObject({ kind: 'belt', value: 'flat belt 92 mm', quantity: 1 });
    expect(revision.held.timeMinutes.typed).toBe(-5);
    expect(revision.held['parts.0.quantity'].typed).toBe(0);
    expectHelpfulMessage(revision.held.timeMinutes.message);
    expectHelpfulMessage(revision.held['parts.0.quantity'].message);
    expect(revision.state).toBe('draft');
  });

  it('refuses only the submission while a field is held, naming it, and submits once it is fixed', async () => {
    const values = completeValues(machineId, { timeMinutes: 2.5 });
    const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: writer.cookie });
    expect(created.status).toBe(201);
    const id = created.body.revision.id as number;

    const refused = await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: writer.cookie });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields)).toEqual(['timeMinutes']);
    expectHelpfulMessage(refused.body.error.fields.timeMinutes[0]);
    expect((await knex('revisions').where({ id }).first('state')).state).toBe('draft');

    // Submitting with the values still wrong saves them (nothing lost) and refuses the same way.
    const again = await call(base, `/api/v1/drafts/${id}/submit`, {
      body: { values: { ...values, cause: 'Edited just before submitting.' } },
      cookie: writer.cookie,
    });
    expect(again.status).toBe(400);
    expect((await knex('revisions').where({ id }).first('cause')).cause).toBe('Edited just before submitting.');

    const fixed = await call(base, `/api/v1/drafts/${id}/submit`, {
      body: { values: { ...values, timeMinutes: 25 } },
      cookie: writer.cookie,
    });
    expect(fixed.status).toBe(200);
    const row = await knex('revisions').where({ id }).first('state', 'time_minutes', 'held_fields');
    expect(row).toEqual({ state: 'submitted', time_minutes: 25, held_fields: {} });
  });

  it('holds fields of the wrong type with a message that shows good input', async () => {
    const values = {
      ...emptyDraft(),
      title: 'Half a draft',
      timeMinutes: 'forty',
      difficulty: 'easy',
      parts: [{ ref: 'C1', kind: 'gizmo', value: '10uF', rating: '', quantity: 'two', notes: '' }],
      readings: [{ testPoint: 'TP1', expected: 5, measured: '', note: '' }],
      cautions: [{ kind: 'lava', detail: '' }],
      symptoms: 'No rewind',
    };
    const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: writer.cookie });
    expect(created.status).toBe(201);
    const held = created.body.revision.held as Record<string, { typed: unknown; message: string }>;
    expect(Object.keys(held).sort()).toEqual([
      'cautions',
      'difficulty',
      'parts.0.kind',
      'parts.0.quantity',
      'readings.0.expected',
      'symptoms',
      'timeMinutes',
    ]);
    expect(held.timeMinutes!.typed).toBe('forty');
    expect(held.cautions!.typed).toEqual([{ kind: 'lava', detail: '' }]);
    for (const field of Object.values(held)) expectHelpfulMessage(field.message);
    expect(created.body.revision.values).toMatchObject({ title: 'Half a draft', timeMinutes: null, difficulty: null, cautions: [] });
    expect(created.body.revision.values.parts[0]).toMatchObject({ ref: 'C1', value: '10uF' });
  });

  it('still refuses a remedy that is not a document, and keeps the stored draft as it was', async () => {
    const created = await call(base, '/api/v1/drafts', {
      body: { values: { ...emptyDraft(), title: 'Remedy test' } },
      cookie: writer.cookie,
    });
    const id = created.body.revision.id as number;
    const before = await knex('revisions').where({ id }).first();
    const answer = await call(base, `/api/v1/drafts/${id}`, {
      method: 'PUT',
      body: { values: { ...emptyDraft(), title: 'Changed', body: { type: 'paragraph' } } },
      cookie: writer.cookie,
    });
    expect(answer.status).toBe(400);
    expect(answer.body.error.message).toMatch(/^Nothing was saved/);
    expect(answer.body.error.fields.body[0]).toMatch(/remedy could not be read/);
    expect(await knex('revisions').where({ id }).first()).toEqual(before);
  });
});

describe('discarding a draft', () => {
  it('discards a draft with nothing in it yet', async () => {
    const created = await call(base, '/api/v1/drafts', { body: { values: emptyDraft() }, cookie: writer.cookie });
    expect(created.status).toBe(201);
    const id = created.body.revision.id as number;
    const discarded = await call(base, `/api/v1/drafts/${id}`, { method: 'DELETE', cookie: writer.cookie });
    expect(discarded.status).toBeLessThan(300);
    expect(await knex('revisions').where({ id }).first('state', 'title')).toEqual({ state: 'withdrawn', title: '' });
  });

  it('discards a draft from the writer’s list of revisions with a plain form', async () => {
    const created = await call(base, '/api/v1/drafts', { body: { values: emptyDraft() }, cookie: writer.cookie });
    const id = created.body.revision.id as number;
    const list = await call(base, '/write/mine', { cookie: writer.cookie });
    // The discard form posts to its Action with the draft named in a hidden field.
    const discardForm = new RegExp(
      `action="/write/mine\\?_action=discardDraft"[^>]*>\\s*<input type="hidden" name="revision" value="${id}"`,
    );
    expect(list.body).toMatch(discardForm);
    const discarded = await postForm(base, '/write/mine?_action=discardDraft', { revision: String(id) }, { cookie: writer.cookie });
    expect(discarded.status).toBe(303);
    expect(discarded.headers.get('location')).toBe('/write/mine?discarded=1');
    expect((await knex('revisions').where({ id }).first('state')).state).toBe('withdrawn');
    const after = await call(base, '/write/mine?discarded=1', { cookie: writer.cookie });
    expect(after.body).toMatch(/Discarded\. The draft stays in this list as withdrawn\./);
    expect(after.body).toContain(`data-revision="${id}" data-state="withdrawn"`);
    expect(after.body).not.toMatch(discardForm);
  });

  it('discards a draft that still holds an invalid field', async () => {
    const created = await call(base, '/api/v1/drafts', {
      body: { values: { ...emptyDraft(), symptoms: [], timeMinutes: 0 } },
      cookie: writer.cookie,
    });
    const id = created.body.revision.id as number;
    expect(created.body.revision.held.timeMinutes.typed).toBe(0);
    const discarded = await call(base, `/api/v1/drafts/${id}`, { method: 'DELETE', cookie: writer.cookie });
    expect(discarded.status).toBeLessThan(300);
    expect((await knex('revisions').where({ id }).first('state')).state).toBe('withdrawn');
    // A discarded draft no longer takes saves.
    const late = await call(base, `/api/v1/drafts/${id}`, { method: 'PUT', body: { values: emptyDraft() }, cookie: writer.cookie });
    expect(late.status).toBe(409);
  });
});
