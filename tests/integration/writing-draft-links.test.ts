// What a draft applies to and the photos it holds follow every save exactly: links dropped in the editor go, new ones
// come, a photo moved changes place, a repeated id counts once, and links that stay are left as they were. A save of
// a draft that is no longer open is refused without writing anything.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { call, completeValues, session, someMachineId, type Session } from '../fixtures/writing';
import { phoneJpeg } from '../fixtures/photo-files';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let writer: Session;
let other: Session;
const machines: number[] = [];
let chassisId: number;
const photos: number[] = [];

async function upload(alt: string): Promise<number> {
  const form = new FormData();
  form.append('alt', alt);
  form.append('file', new Blob([new Uint8Array(await phoneJpeg())]), 'bench.jpg');
  const res = await fetch(`${base}/api/v1/photos`, { method: 'POST', headers: { cookie: writer.cookie, origin: base }, body: form });
  expect(res.status).toBe(202);
  return ((await res.json()) as { photo: { id: number } }).photo.id;
}

/** The draft's link rows as stored, with each row's version (xmin changes whenever a row is written). */
async function stored(revisionId: number) {
  const rows = async (table: string, column: string, order = column) =>
    (
      await knex.raw<{ rows: { id: number; xmin: string; position?: number }[] }>(
        `SELECT ${column} AS id, xmin::text AS xmin${table === 'revision_photos' ? ', position' : ''}
           FROM ${table} WHERE revision_id = ? ORDER BY ${order}`,
        [revisionId],
      )
    ).rows;
  return {
    machines: await rows('revision_machines', 'machine_id'),
    chassis: await rows('revision_chassis', 'chassis_family_id'),
    photos: await rows('revision_photos', 'photo_id', 'position'),
  };
}

beforeAll(async () => {
  writer = await session(knex, base, 'member', 'links');
  other = await session(knex, base, 'member', 'links-other');
  for (const offset of [11, 12, 13]) machines.push(await someMachineId(knex, offset));
  chassisId = (await knex('chassis_families').whereNull('deleted_at').orderBy('id').first('id')).id;
  photos.push(await upload('Pinch roller before cleaning, glazed band visible'));
  photos.push(await upload('Pinch roller after cleaning'));
});
afterAll(() => knex.destroy());

describe('saving what a draft applies to', () => {
  it('follows each save: removed links go, new ones come, photos change place, repeats count once, the rest are not rewritten', async () => {
    const [a, b, c] = machines as [number, number, number];
    const [p1, p2] = photos as [number, number];
    const first = completeValues(a, { machineIds: [a, b], chassisIds: [chassisId], photoIds: [p1, p2] });
    const created = await call(base, '/api/v1/drafts', { body: { values: first }, cookie: writer.cookie });
    expect(created.status).toBe(201);
    const id = created.body.revision.id as number;
    const before = await stored(id);
    expect(before.machines.map((r) => r.id)).toEqual([a, b].sort((x, y) => x - y));
    expect(before.photos.map((r) => [r.id, r.position])).toEqual([
      [p1, 0],
      [p2, 1],
    ]);

    // The writer drops machine a, adds c (named twice), drops the chassis family and swaps the photos.
    const second = { ...first, machineIds: [b, c, c], chassisIds: [], photoIds: [p2, p1, p2] };
    const saved = await call(base, `/api/v1/drafts/${id}`, { method: 'PUT', body: { values: second }, cookie: writer.cookie });
    expect(saved.status).toBe(200);
    expect(saved.body.revision.values.machineIds.sort()).toEqual([b, c].sort());
    expect(saved.body.revision.machines.map((m: { id: number }) => m.id).sort()).toEqual([b, c].sort());
    expect(saved.body.revision.chassis).toEqual([]);
    expect(saved.body.revision.photos.map((p: { id: number }) => p.id)).toEqual([p2, p1]);
    expect(saved.body.revision.photos[0].alt).toBe('Pinch roller after cleaning');

    const after = await stored(id);
    expect(after.machines.map((r) => r.id)).toEqual([b, c].sort((x, y) => x - y));
    expect(after.chassis).toEqual([]);
    expect(after.photos.map((r) => [r.id, r.position])).toEqual([
      [p2, 0],
      [p1, 1],
    ]);
    // Machine b stayed on the draft: its row is the same row, not deleted and inserted again.
    expect(after.machines.find((r) => r.id === b)!.xmin).toBe(before.machines.find((r) => r.id === b)!.xmin);

    // Read back as the editor does after a reload: the same lists.
    const read = await call(base, `/api/v1/drafts/${id}`, { cookie: writer.cookie });
    expect(read.body.revision.photos.map((p: { id: number }) => p.id)).toEqual([p2, p1]);
    expect(read.body.revision.machines.map((m: { id: number }) => m.id).sort()).toEqual([b, c].sort());
  });

  it('keeps a save whole when another window saved the same draft while it waited: never a mix of the two', async () => {
    const [a, b, c] = machines as [number, number, number];
    const created = await call(base, '/api/v1/drafts', {
      body: { values: completeValues(a, { machineIds: [a, b] }) },
      cookie: writer.cookie,
    });
    const id = created.body.revision.id as number;
    // Another window's save, caught half way: it holds the draft's row and has swapped machine b for c.
    const other = await knex.transaction();
    await other('revisions').where({ id }).update({ cause: 'Saved from the other window.' });
    await other('revision_machines').where({ revision_id: id, machine_id: b }).delete();
    await other('revision_machines').insert({ revision_id: id, machine_id: c });
    // This window saves machine a alone; its statement begins now and waits for the row.
    const values = completeValues(a, { machineIds: [a], cause: 'Saved from this window, machine a only.' });
    const pending = call(base, `/api/v1/drafts/${id}`, { method: 'PUT', body: { values }, cookie: writer.cookie });
    for (let i = 0; i < 100; i++) {
      const waiting = await knex('pg_stat_activity')
        .where({ wait_event_type: 'Lock' })
        .whereLike('query', '%UPDATE revisions r SET%')
        .first('pid');
      if (waiting) break;
      await new Promise((r) => setTimeout(r, 20));
    }
    await other.commit();
    const answer = await pending;
    expect(answer.status).toBe(200);
    // This window's save, whole: its text and its one machine (machine c, added by the other window, is gone).
    expect((await knex('revisions').where({ id }).first('cause')).cause).toBe('Saved from this window, machine a only.');
    expect((await stored(id)).machines.map((r) => r.id)).toEqual([a]);
    expect(answer.body.revision.machines.map((m: { id: number }) => m.id)).toEqual([a]);
  });

  it('refuses a save of someone else’s draft or of a submitted one, and writes nothing', async () => {
    const [a, b] = machines as [number, number];
    const values = completeValues(a, { machineIds: [a] });
    const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: writer.cookie });
    const id = created.body.revision.id as number;

    const stranger = await call(base, `/api/v1/drafts/${id}`, {
      method: 'PUT',
      body: { values: { ...values, machineIds: [b], cause: 'Written by someone else.' } },
      cookie: other.cookie,
    });
    expect(stranger.status).toBe(404);
    expect(stranger.body.error.message).toBe('There is no such draft among yours.');

    const submitted = await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: writer.cookie });
    expect(submitted.status).toBe(200);
    const late = await call(base, `/api/v1/drafts/${id}`, {
      method: 'PUT',
      body: { values: { ...values, machineIds: [b], cause: 'Typed after the submission.' } },
      cookie: writer.cookie,
    });
    expect(late.status).toBe(409);
    expect(late.body.error.message).toMatch(/^This revision is submitted and can no longer change\./);

    const row = await knex('revisions').where({ id }).first('cause', 'state');
    expect(row).toEqual({ cause: values.cause, state: 'submitted' });
    expect((await stored(id)).machines.map((r) => r.id)).toEqual([a]);
  });
});
