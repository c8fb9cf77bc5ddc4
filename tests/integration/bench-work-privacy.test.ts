// Bad input and privacy through the built server: pinned notes, guessed codes, other members' sheets, field messages.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { signIn, uniqueClientIp } from '../support/sign-in';
import { as, makeFix, makeMember, makeWorld, PASSWORD, proofNewRevision, type TestFix, type TestWorld } from './bench-work-support';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
const anonymous = as(base, '');
let world: TestWorld;
let fix: TestFix;
let owner: ReturnType<typeof as>;
let stranger: ReturnType<typeof as>;

beforeAll(async () => {
  world = await makeWorld(knex);
  fix = await makeFix(knex, {
    authorId: (await makeMember(knex)).id,
    machineIds: [world.machines[0]!.id],
    cautions: [{ kind: 'stored_charge' }],
  });
  owner = as(base, await signIn(base, (await makeMember(knex)).email, PASSWORD));
  stranger = as(base, await signIn(base, (await makeMember(knex)).email, PASSWORD));
});
afterAll(() => knex.destroy());

async function newNote(body: Record<string, unknown>): Promise<string> {
  const res = await owner.post('/api/v1/handover-notes', body);
  if (res.status !== 201) throw new Error(`note: ${res.status} ${await res.text()}`);
  return (await res.json()).note.code;
}

describe('a note for a fix that changed later', () => {
  it('still shows the revision the repair followed', async () => {
    const code = await newNote({ fix: fix.slug });
    await proofNewRevision(knex, fix, (await makeMember(knex)).id);
    const page = await (await anonymous.get(`/n/${code}`)).text();
    expect(page).toContain('Symptom seen in r1');
    expect(page).toContain('Worn drive belt, as found in r1.');
    expect(page).not.toContain('Symptom rewritten in r2');
    expect(page).toContain(`href="/fixes/${fix.slug}/r/1"`);
    expect(page).toContain('has been revised since');
    expect(page).toContain('Unplugging it does not make the inside safe');
  });
});

describe('guessing codes', () => {
  it('finds nothing for a guessed code, and answers 429 after a burst of misses from one address', async () => {
    const ip = uniqueClientIp();
    const guess = (n: number) => `ZZZZ${String(n).padStart(6, '2').replace(/[01]/g, '3')}`;
    const first = await anonymous.get(`/n/${guess(2)}`, { 'x-forwarded-for': ip });
    expect(first.status).toBe(404);
    expect(await first.text()).toContain('No note has this code');
    // 20 misses per 15 minutes: the page and the API count in the same bucket.
    for (let i = 3; i <= 20; i++) await anonymous.get(`/api/v1/handover-notes/${guess(i)}`, { 'x-forwarded-for': ip });
    expect((await anonymous.get(`/n/${guess(21)}`, { 'x-forwarded-for': ip })).status).toBe(404);
    const blockedPage = await anonymous.get(`/n/${guess(22)}`, { 'x-forwarded-for': ip });
    expect(blockedPage.status).toBe(429);
    expect(Number(blockedPage.headers.get('retry-after'))).toBeGreaterThan(0);
    const blockedApi = await anonymous.get(`/api/v1/handover-notes/${guess(23)}`, { 'x-forwarded-for': ip });
    expect(blockedApi.status).toBe(429);
    expect((await blockedApi.json()).error.code).toBe('too_many_requests');
    // Another address is not held up by the first one's guessing.
    expect((await anonymous.get(`/n/${guess(24)}`, { 'x-forwarded-for': uniqueClientIp() })).status).toBe(404);
  });

  it('says a revoked note is withdrawn with 410, and shows none of its content', async () => {
    const code = await newNote({ fix: fix.slug, message: 'Private words for the customer' });
    await owner.delete(`/api/v1/handover-notes/${code}`);
    const res = await anonymous.get(`/n/${code}`);
    expect(res.status).toBe(410);
    const page = await res.text();
    expect(page).toContain('has been withdrawn');
    expect(page).not.toContain('Private words for the customer');
  });
});

describe('another member’s job sheet', () => {
  it('answers 404, never 403, on every page and endpoint', async () => {
    const { jobSheet } = await (await owner.post('/api/v1/job-sheets', { customerRef: 'Mrs Example, 12 Harbour Row' })).json();
    const id = jobSheet.id as number;
    const answers = [
      await stranger.get(`/jobs/${id}`),
      await stranger.form(`/jobs/${id}?_action=jobSheet`, { job: String(id), intent: 'delete', confirm: 'yes' }),
      await stranger.get(`/api/v1/job-sheets/${id}`),
      await stranger.patch(`/api/v1/job-sheets/${id}`, { status: 'collected' }),
      await stranger.delete(`/api/v1/job-sheets/${id}`),
      await stranger.post(`/api/v1/job-sheets/${id}/fixes`, { fix: fix.slug }),
      await stranger.get(`/api/v1/job-sheets/${id}/invoice-lines.csv`),
      await stranger.get(`/api/v1/job-sheets/${id}/invoice-lines.json`),
    ];
    expect(answers.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404, 404, 404]);
    for (const answer of answers) expect(await answer.text()).not.toContain('Harbour Row');
    expect((await owner.get(`/api/v1/job-sheets/${id}`)).status).toBe(200);
    // A note made from someone else's sheet is refused too, by field.
    const refused = await stranger.post('/api/v1/handover-notes', { fix: fix.slug, jobSheetId: id });
    expect((await refused.json()).error.fields.jobSheetId).toEqual(['Choose one of your own job sheets.']);
  });

  it('answers a malformed sheet number and another member’s note view with 404 too', async () => {
    expect((await owner.get('/jobs/not-a-number')).status).toBe(404);
    expect((await owner.get('/api/v1/job-sheets/0')).status).toBe(404);
    const code = await newNote({ fix: fix.slug });
    expect((await stranger.get(`/notes/${code}`)).status).toBe(404);
  });
});

describe('deleting a job sheet', () => {
  it('removes the job details from the notes made from it, which keep working', async () => {
    const { jobSheet } = await (
      await owner.post('/api/v1/job-sheets', {
        customerRef: 'Ticket 881',
        machine: world.machines[0]!.slug,
        serialNumber: 'SN-440022',
        findings: 'Cracked solder at the regulator',
      })
    ).json();
    const code = await newNote({ fix: fix.slug, jobSheetId: jobSheet.id, includeJobDetails: true });
    const before = await (await anonymous.get(`/n/${code}`)).text();
    expect(before).toContain('SN-440022');
    expect(before).toContain('Cracked solder at the regulator');
    expect(before).not.toContain('Ticket 881');
    expect((await owner.delete(`/api/v1/job-sheets/${jobSheet.id}`)).status).toBe(204);
    const after = await anonymous.get(`/n/${code}`);
    expect(after.status).toBe(200);
    const page = await after.text();
    expect(page).not.toContain('SN-440022');
    expect(page).not.toContain('Cracked solder at the regulator');
    expect(page).toContain('What was wrong');
  });
});

describe('invalid fields', () => {
  it('shows field messages on the new job sheet form', async () => {
    const res = await owner.form('/jobs/new?_action=newJob', { customerRef: '   ', machine: 'no-such-machine', status: 'lost' });
    expect(res.status).toBe(400);
    const page = await res.text();
    expect(page).toContain('Give a customer reference, e.g. an invoice or ticket number.');
    expect(page).toContain('Choose a status from the list.');
    expect(page).toContain('aria-invalid="true"');
  });

  it('shows field messages on the note form and keeps what was typed', async () => {
    const res = await owner.form('/notes/new?_action=handoverNote', {
      fix: 'Tray will not open',
      message: 'Typed message stays',
      warranty: 'w'.repeat(301),
    });
    expect(res.status).toBe(400);
    const page = await res.text();
    expect(page).toContain('Use lower-case letters, digits and dashes.');
    expect(page).toContain('Keep the warranty line under 300 characters.');
    expect(page).toContain('Typed message stays');
  });

  it('names each bad field of a job sheet in the API answer', async () => {
    const res = await owner.post('/api/v1/job-sheets', {
      customerRef: '',
      labourMinutes: 1.5,
      partsUsed: [{ kind: 'gizmo', value: '', quantity: 0 }],
    });
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(Object.keys(error.fields).sort()).toEqual([
      'customerRef',
      'labourMinutes',
      'partsUsed.0.kind',
      'partsUsed.0.quantity',
      'partsUsed.0.value',
    ]);
    const broken = await owner.raw('/api/v1/job-sheets', '{"customerRef": ', 'application/json');
    expect(broken.status).toBe(400);
    expect((await broken.json()).error.message).toBe('The body is not valid JSON.');
    expect((await owner.raw('/api/v1/job-sheets', 'customerRef=x', 'text/plain')).status).toBe(415);
  });
});
