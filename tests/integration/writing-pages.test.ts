// The writing pages through the built server: compare any two revisions, history, restore, prefill, type-ahead.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';
import { phoneJpeg } from '../fixtures/photo-files';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let writer: Session;
let moderator: Session;
let machineId: number;
let slug: string;

async function uploadReadyPhoto(): Promise<number> {
  const form = new FormData();
  form.append('alt', 'New capacitor fitted at C512, stripe towards the edge');
  form.append('file', new Blob([new Uint8Array(await phoneJpeg())]), 'c512.jpg');
  const answer = await (
    await fetch(`${base}/api/v1/photos`, { method: 'POST', headers: { cookie: writer.cookie, origin: base }, body: form })
  ).json();
  for (let i = 0; i < 120; i++) {
    const { photo } = await (await fetch(`${base}/api/v1/photos/${answer.photo.id}`, { headers: { cookie: writer.cookie } })).json();
    if (photo.state === 'ready') return photo.id;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error('photo not ready');
}

beforeAll(async () => {
  writer = await session(knex, base, 'member', 'pages');
  moderator = await session(knex, base, 'moderator', 'pages-mod');
  machineId = await someMachineId(knex, 5);
  ({ slug } = await publishFix(base, writer, moderator, completeValues(machineId)));
  const photoId = await uploadReadyPhoto();
  const second = completeValues(machineId, {
    parts: [
      { ref: 'C512', kind: 'capacitor', value: '470uF', rating: '16V 105C', quantity: 2, notes: '' },
      { ref: 'R510', kind: 'resistor', value: '2k2', rating: '0.25W', quantity: 1, notes: 'check first' },
    ],
    photoIds: [photoId],
    editSummary: 'Second capacitor and a photo',
  });
  const draft = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: second }, cookie: writer.cookie });
  await call(base, `/api/v1/drafts/${draft.body.revision.id}/submit`, { body: {}, cookie: writer.cookie });
  const proofed = await call(base, `/api/v1/proofing/${draft.body.revision.id}/proof`, { body: {}, cookie: moderator.cookie });
  expect(proofed.status).toBe(200);
});
afterAll(() => knex.destroy());

describe('comparing revisions', () => {
  it('compares two proofed revisions field by field, parts cell by cell, photos, with the JSON source in a details element', async () => {
    const numbers = await knex('revisions as r')
      .join('fixes as f', 'f.id', 'r.fix_id')
      .where('f.slug', slug)
      .orderBy('r.number')
      .pluck('r.number');
    const [a, b] = numbers as [number, number];
    const response = await fetch(`${base}/fixes/${slug}/compare?a=${a}&b=${b}`);
    expect(response.status).toBe(200);
    const html = await response.text();
    expect(html).toMatch(/data-changed-sections="[^"]*Parts[^"]*Photos/);
    expect(html).toMatch(/data-row-status="changed"[\s\S]*?\[was: <\/span>1[\s\S]*?\[now: <\/span>2/);
    expect(html).toContain('data-row-status="added"');
    expect(html).toMatch(/data-photo-added="\d+"/);
    expect(html).toMatch(/<details[\s\S]*Source \(JSON\)[\s\S]*&quot;editSummary&quot;: &quot;Second capacitor and a photo&quot;/);
    expect(scriptsBesideRegistration(html)).toEqual([]);
    // Any two, in either order; a number that is not a proofed revision is a 404.
    expect((await fetch(`${base}/fixes/${slug}/compare?a=${b}&b=${a}`)).status).toBe(200);
    expect((await fetch(`${base}/fixes/${slug}/compare?a=${a}&b=999`)).status).toBe(404);
  });

  it('shows the history with a compare form, and a plain restore link for writers only', async () => {
    const anonymous = await (await fetch(`${base}/fixes/${slug}/history`)).text();
    expect(anonymous).toContain(`action="/fixes/${slug}/compare"`);
    expect(anonymous).not.toContain('Restore r');
    expect(scriptsBesideRegistration(anonymous)).toEqual([]);
    const signedIn = await (await fetch(`${base}/fixes/${slug}/history`, { headers: { cookie: writer.cookie } })).text();
    expect(signedIn).toMatch(/href="\/fixes\/[^"]+\/edit\?from=\d+">\s*Restore r\d+ as a new revision/);
    expect(signedIn).toContain('proofed like any other');
  });

  it('starts a restore from the older revision’s text, as a new revision on top of the live one', async () => {
    const first = await knex('revisions as r')
      .join('fixes as f', 'f.id', 'r.fix_id')
      .where('f.slug', slug)
      .orderBy('r.number')
      .first('r.number');
    const html = await (await fetch(`${base}/fixes/${slug}/edit?from=${first.number}`, { headers: { cookie: writer.cookie } })).text();
    expect(html).toContain(`You are restoring r${first.number}`);
    expect(html).toContain(`Restores r${first.number} as a new revision.`);
  });
});

describe('the writing pages', () => {
  it('prefill a new fix from a search link and load the editor only there', async () => {
    const machine = await knex('machines').where({ id: machineId }).first('slug');
    const write = await fetch(`${base}/write?symptom=${encodeURIComponent('No rewind, fast forward fine')}&machine=${machine.slug}`, {
      headers: { cookie: writer.cookie },
    });
    expect(write.status).toBe(200);
    const html = await write.text();
    expect(html).toContain('Started from your search');
    expect(html).toContain('No rewind, fast forward fine');
    expect(html).toMatch(/<astro-island[^>]*component-url="[^"]*FixEditor/);
    const fixPage = await (await fetch(`${base}/fixes/${slug}`, { headers: { cookie: writer.cookie } })).text();
    expect(fixPage).not.toContain('FixEditor');
    expect(scriptsBesideRegistration(fixPage)).toEqual([]);
  });

  it('offers a type-ahead over the catalogue by loose model number', async () => {
    const machine = await knex('machines').where({ id: machineId }).first('model_number', 'model_code');
    const loose = machine.model_code.slice(0, Math.max(3, machine.model_code.length - 1)).toUpperCase();
    const answer = await call(base, `/api/v1/catalogue-lookup?q=${encodeURIComponent(loose)}`);
    expect(answer.status).toBe(200);
    expect(answer.body.hits.some((h: { kind: string; id: number }) => h.kind === 'machine' && h.id === machineId)).toBe(true);
    const empty = await call(base, '/api/v1/catalogue-lookup?q=');
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.q).toBeDefined();
  });

  it('lists the writer’s revisions with their states', async () => {
    const html = await (await fetch(`${base}/write/mine`, { headers: { cookie: writer.cookie } })).text();
    expect(html).toMatch(/data-state="proofed"/);
    expect(scriptsBesideRegistration(html)).toEqual([]);
  });
});
