// Bad input to the writing API gets the one error shape with field messages, and leaves the stored draft as it was.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { call, completeValues, session, someMachineId, type Session } from '../fixtures/writing';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let writer: Session;
let draftId: number;
let stored: Record<string, unknown>;

beforeAll(async () => {
  writer = await session(knex, base, 'member', 'input');
  const created = await call(base, '/api/v1/drafts', {
    body: { values: completeValues(await someMachineId(knex, 4)) },
    cookie: writer.cookie,
  });
  draftId = created.body.revision.id;
  stored = await knex('revisions').where({ id: draftId }).first();
});
afterAll(() => knex.destroy());

async function expectUntouched(): Promise<void> {
  expect(await knex('revisions').where({ id: draftId }).first()).toEqual(stored);
}

describe('saving a draft with bad input', () => {
  it('answers 400 to malformed JSON', async () => {
    const answer = await call(base, `/api/v1/drafts/${draftId}`, {
      method: 'PUT',
      raw: '{"values": {"title": "cut off',
      cookie: writer.cookie,
    });
    expect(answer.status).toBe(400);
    expect(answer.body.error.message).toMatch(/not valid JSON/);
    await expectUntouched();
  });

  it('names the body when the editor JSON is not a document', async () => {
    const answer = await call(base, `/api/v1/drafts/${draftId}`, {
      method: 'PUT',
      body: { values: { ...completeValues(1), body: { type: 'paragraph', content: 'oops' } } },
      cookie: writer.cookie,
    });
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields.body[0]).toMatch(/remedy could not be read/);
    await expectUntouched();
  });

  it('holds a quantity that is not a number as typed, and names a machine not in the catalogue and a photo that is not the writer’s', async () => {
    const values = completeValues(1, {
      parts: [{ ref: 'C1', kind: 'capacitor', value: '10uF', rating: '', quantity: 'two' as unknown as number, notes: '' }],
    });
    const answer = await call(base, `/api/v1/drafts/${draftId}`, { method: 'PUT', body: { values }, cookie: writer.cookie });
    // A draft keeps what was typed: the quantity waits, marked, for submission (see writing-drafts-held.test.ts).
    expect(answer.status).toBe(200);
    expect(Object.keys(answer.body.revision.held)).toEqual(['parts.0.quantity']);
    expect(answer.body.revision.held['parts.0.quantity'].typed).toBe('two');
    const unknownMachine = await call(base, `/api/v1/drafts/${draftId}`, {
      method: 'PUT',
      body: { values: completeValues(987654321) },
      cookie: writer.cookie,
    });
    expect(unknownMachine.body.error.fields.machineIds[0]).toMatch(/not in the catalogue/);
    const someonesPhoto = await knex('photos').where('owner_id', '<>', writer.id).first('id');
    const notMine = await call(base, `/api/v1/drafts/${draftId}`, {
      method: 'PUT',
      body: { values: completeValues(1, { photoIds: [someonesPhoto.id] }) },
      cookie: writer.cookie,
    });
    // A seeded illustration is on a proofed revision, so it is public and may be reused; an unknown id may not.
    expect(notMine.status).toBe(200);
    const missing = await call(base, `/api/v1/drafts/${draftId}`, {
      method: 'PUT',
      body: { values: completeValues(1, { photoIds: [987654321] }) },
      cookie: writer.cookie,
    });
    expect(missing.body.error.fields.photoIds[0]).toMatch(/no longer exists/);
    stored = await knex('revisions').where({ id: draftId }).first();
  });

  it('refuses other content types and bodies over the limit', async () => {
    const plain = await fetch(`${base}/api/v1/drafts/${draftId}`, {
      method: 'PUT',
      headers: { cookie: writer.cookie, 'content-type': 'text/plain', origin: base },
      body: '{}',
    });
    expect(plain.status).toBe(415);
    const huge = JSON.stringify({ values: { ...completeValues(1), cause: 'x'.repeat(3 * 1024 * 1024) } });
    const big = await call(base, `/api/v1/drafts/${draftId}`, { method: 'PUT', raw: huge, cookie: writer.cookie });
    expect(big.status).toBe(413);
    await expectUntouched();
  });

  it('refuses a submission with a reading that has no value, and one whose part value does not decode', async () => {
    const values = completeValues(1, {
      readings: [{ testPoint: 'TP4', expected: '', measured: '', note: '' }],
      parts: [{ ref: 'C7', kind: 'capacitor', value: '4,700uF', rating: '', quantity: 1, notes: '' }],
    });
    const answer = await call(base, `/api/v1/drafts/${draftId}/submit`, { body: { values }, cookie: writer.cookie });
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields['readings.0.expected'][0]).toMatch(/expected value/);
    expect(answer.body.error.fields['parts.0.value'][0]).toMatch(/comma[\s\S]*For example/);
    expect((await knex('revisions').where({ id: draftId }).first('state')).state).toBe('draft');
  });

  it('refuses a submission while one of its photos is still being processed', async () => {
    const sha = randomBytes(32).toString('hex');
    const [{ id: photoId }] = await knex('photos')
      .insert({
        owner_id: writer.id,
        storage_key: `uploads/${sha}`,
        mime_type: 'image/jpeg',
        byte_size: 10,
        width: 10,
        height: 10,
        sha256: sha,
        alt_text: 'Still waiting',
        processing_state: 'pending',
      })
      .returning('id');
    const answer = await call(base, `/api/v1/drafts/${draftId}/submit`, {
      body: { values: completeValues(1, { photoIds: [photoId] }) },
      cookie: writer.cookie,
    });
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields.photoIds[0]).toMatch(/“Still waiting” is still being processed/);
    expect((await knex('revisions').where({ id: draftId }).first('state')).state).toBe('draft');
  });
});
