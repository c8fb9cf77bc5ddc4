// Every page form that moved to an Astro Action, posted as a browser without JavaScript posts it: a refused form
// comes back on the same page (no redirect) with what was typed and the message beside its field, and nothing
// typed ever travels in a Location header; a saved one answers 303. Actions also answer at /_actions/<name>,
// past the page's route rule, so each checks who may send it again.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Window } from 'happy-dom';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { createUser, postForm, uniqueClientIp } from '../support/sign-in';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let member: Session;
let author: Session;
let moderator: Session;
let admin: Session;
let machineId: number;
let fixSlug: string;

beforeAll(async () => {
  member = await session(knex, base, 'member', 'fa-member');
  author = await session(knex, base, 'member', 'fa-author');
  moderator = await session(knex, base, 'moderator', 'fa-mod');
  admin = await session(knex, base, 'admin', 'fa-admin');
  machineId = await someMachineId(knex, 3);
  fixSlug = (await publishFix(base, author, moderator, completeValues(machineId))).slug;
});
afterAll(() => knex.destroy());

function documentOf(html: string): Document {
  const window = new Window({ url: base });
  window.document.write(html);
  return window.document as unknown as Document;
}

interface Answer {
  status: number;
  location: string | null;
  html: string;
  doc: Document;
}

async function post(path: string, fields: Record<string, string>, cookie: string): Promise<Answer> {
  const res = await postForm(base, path, fields, { cookie, ip: uniqueClientIp() });
  const html = await res.text();
  return { status: res.status, location: res.headers.get('location'), html, doc: documentOf(html) };
}

/** A refusal rendered in place: a 4xx page, no Location, nothing typed in the address. */
function expectRefusedInPlace(answer: Answer, status: number): void {
  expect(answer.location).toBeNull();
  expect(answer.status).toBe(status);
}

/** The text of the elements a control names in aria-describedby: where its message sits beside it. */
function messageBeside(doc: Document, selector: string): string {
  const control = doc.querySelector(selector);
  expect(control, selector).not.toBeNull();
  expect(control!.getAttribute('aria-invalid')).toBe('true');
  const ids = (control!.getAttribute('aria-describedby') ?? '').split(' ').filter(Boolean);
  return ids.map((id) => doc.getElementById(id)?.textContent ?? '').join(' ');
}

const valueOf = (doc: Document, selector: string): string => (doc.querySelector(selector) as HTMLInputElement | null)?.value ?? '';

/** A Location header carries only a path and fixed codes, never a word of what was typed. */
function expectCleanLocation(location: string | null, typed: string[]): void {
  expect(location).not.toBeNull();
  for (const text of typed) {
    expect(location).not.toContain(text);
    expect(decodeURIComponent(location!)).not.toContain(text);
  }
}

async function submitted(who: Session): Promise<number> {
  const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: who.cookie });
  expect(created.status).toBe(201);
  const id: number = created.body.revision.id;
  expect((await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: who.cookie })).status).toBe(200);
  return id;
}

describe('the account Action', () => {
  it('keeps the shop name as typed and puts the name message beside the name field, then saves with a 303', async () => {
    const shop = 'Wrenfield Tape Bench, unit 4';
    const refused = await post('/account?_action=account', { intent: 'profile', name: '', shopName: shop }, member.cookie);
    expectRefusedInPlace(refused, 400);
    expect(valueOf(refused.doc, '#shopName')).toBe(shop);
    expect(messageBeside(refused.doc, '#name')).toMatch(/name/i);

    const long = 'q'.repeat(500);
    const tooLong = await post('/account?_action=account', { intent: 'profile', name: 'Ada Quillfeather', shopName: long }, member.cookie);
    expectRefusedInPlace(tooLong, 400);
    expect(valueOf(tooLong.doc, '#shopName')).toBe(long);
    expect(valueOf(tooLong.doc, '#name')).toBe('Ada Quillfeather');
    expect(messageBeside(tooLong.doc, '#shopName')).toMatch(/at most 120 characters/);

    const saved = await post('/account?_action=account', { intent: 'profile', name: 'Ada Quillfeather', shopName: shop }, member.cookie);
    expect(saved.status).toBe(303);
    expectCleanLocation(saved.location, ['Quillfeather', 'Wrenfield']);
    expect((await knex('users').where({ id: member.id }).first('name')).name).toBe('Ada Quillfeather');
  });

  it('never sends a typed password back to the browser', async () => {
    const secret = 'not-my-password-at-all-9';
    const refused = await post(
      '/account?_action=account',
      { intent: 'password', currentPassword: secret, newPassword: 'short' },
      member.cookie,
    );
    expectRefusedInPlace(refused, 400);
    expect(refused.html).not.toContain(secret);
    expect(messageBeside(refused.doc, '#newPassword')).toMatch(/at least 10 characters/);
  });

  it('answers a post that names no Action with 400 and changes nothing, and refuses a signed-out call to the Action', async () => {
    const unnamed = await post('/account', { intent: 'profile', name: 'Ada', shopName: '' }, member.cookie);
    expectRefusedInPlace(unnamed, 400);
    expect(unnamed.html).toContain('please send the form from this page');
    expect((await knex('users').where({ id: member.id }).first('name')).name).not.toBe('Ada');
    const rpc = await postForm(base, '/_actions/account', { intent: 'profile', name: 'Ada' }, { ip: uniqueClientIp() });
    const body = await rpc.text();
    expect(body).toMatch(/signed out/);
    expect(rpc.headers.get('location')).toBeNull();
  });
});

describe('the proofing Actions', () => {
  it('returns a revision only with a note, keeping a far too long note as typed beside its message', async () => {
    const id = await submitted(author);
    const empty = await post(
      `/proofing/${id}?_action=proofingDecision`,
      { revision: String(id), decision: 'return', note: '' },
      moderator.cookie,
    );
    expectRefusedInPlace(empty, 400);
    expect(messageBeside(empty.doc, '#decision-note')).toMatch(/Say what the author should change/);

    const long = `Give the polarity of C512. ${'x'.repeat(2100)}`;
    const tooLong = await post(
      `/proofing/${id}?_action=proofingDecision`,
      { revision: String(id), decision: 'return', note: long },
      moderator.cookie,
    );
    expectRefusedInPlace(tooLong, 400);
    expect(valueOf(tooLong.doc, '#decision-note')).toBe(long);
    expect(messageBeside(tooLong.doc, '#decision-note')).toMatch(/at most 2000 characters/);
    expect((await knex('revisions').where({ id }).first('state')).state).toBe('submitted');

    const note = 'Give the polarity of C512 and the reading at TP12.';
    const returned = await post(
      `/proofing/${id}?_action=proofingDecision`,
      { revision: String(id), decision: 'return', note },
      moderator.cookie,
    );
    expect(returned.status).toBe(303);
    expect(returned.location).toBe('/proofing?returned=1');
    expectCleanLocation(returned.location, ['C512', 'TP12']);
    expect((await knex('revisions').where({ id }).first('state')).state).toBe('returned');
  });

  it('keeps a too long lock note on the fix history beside its field, and locks with a 303 back to the panel', async () => {
    const long = `Edit war over the belt size. ${'y'.repeat(2100)}`;
    const path = `/fixes/${fixSlug}/history?_action=fixFlag`;
    const refused = await post(path, { fix: fixSlug, from: 'history', action: 'lock', note: long }, moderator.cookie);
    expectRefusedInPlace(refused, 400);
    expect(valueOf(refused.doc, '#moderation-note')).toBe(long);
    expect(messageBeside(refused.doc, '#moderation-note')).toMatch(/under 2000 characters/);
    expect((await knex('fixes').where({ slug: fixSlug }).first('locked_at')).locked_at).toBeNull();

    const locked = await post(
      path,
      { fix: fixSlug, from: 'history', action: 'lock', note: 'Edit war over the belt size.' },
      moderator.cookie,
    );
    expect(locked.status).toBe(303);
    expect(locked.location).toBe(`/fixes/${fixSlug}/history?fix=lock#moderation`);
    expectCleanLocation(locked.location, ['Edit war']);
    const unlocked = await post(path, { fix: fixSlug, from: 'history', action: 'unlock' }, moderator.cookie);
    expect(unlocked.status).toBe(303);

    // The history page is public, its POST is not: a member is refused by the route rule, and by the Action itself.
    expect((await post(path, { fix: fixSlug, from: 'history', action: 'lock' }, member.cookie)).status).toBe(403);
    const rpc = await postForm(base, '/_actions/fixFlag', { fix: fixSlug, action: 'lock' }, { cookie: member.cookie });
    expect(await rpc.text()).toMatch(/cannot do this/);
    expect((await knex('fixes').where({ slug: fixSlug }).first('locked_at')).locked_at).toBeNull();
  });

  it('keeps a too long resolution note in its report row on the desk, and closes the report with a 303', async () => {
    const fix = await knex('fixes').where({ slug: fixSlug }).first('id');
    const [report] = await knex('reports')
      .insert({ fix_id: fix.id, reporter_id: member.id, reason: 'wrong', detail: 'The belt size in the parts list is wrong.' })
      .returning('id');
    const long = `Checked against the bench. ${'z'.repeat(2100)}`;
    const refused = await post(
      '/proofing?_action=reportResolution',
      { report: String(report.id), outcome: 'resolved', note: long },
      moderator.cookie,
    );
    expectRefusedInPlace(refused, 400);
    expect(valueOf(refused.doc, `#report-note-${report.id}`)).toBe(long);
    expect(messageBeside(refused.doc, `#report-note-${report.id}`)).toMatch(/under 2000 characters/);

    const closed = await post(
      '/proofing?_action=reportResolution',
      { report: String(report.id), outcome: 'dismissed', note: 'Checked.' },
      moderator.cookie,
    );
    expect(closed.status).toBe(303);
    expect(closed.location).toBe('/proofing?report=closed#reports');
    expect((await knex('reports').where({ id: report.id }).first('state')).state).toBe('dismissed');
  });
});

describe('the writer’s Actions on /write/mine', () => {
  it('withdraws a waiting revision with a 303, and refuses someone else’s in place', async () => {
    const id = await submitted(author);
    const notMine = await post('/write/mine?_action=withdraw', { revision: String(id) }, member.cookie);
    expectRefusedInPlace(notMine, 404);
    expect(notMine.doc.querySelector('[role="alert"]')?.textContent).toMatch(/no such revision/i);
    const withdrawn = await post('/write/mine?_action=withdraw', { revision: String(id) }, author.cookie);
    expect(withdrawn.status).toBe(303);
    expect(withdrawn.location).toBe('/write/mine?withdrawn=1');
  });

  it('amends a returned revision into a new draft and opens the editor', async () => {
    const id = await submitted(author);
    await post(
      `/proofing/${id}?_action=proofingDecision`,
      { revision: String(id), decision: 'return', note: 'Name the belt.' },
      moderator.cookie,
    );
    const amended = await post('/write/mine?_action=amend', { revision: String(id) }, author.cookie);
    expect(amended.status).toBe(303);
    const draft = Number(amended.location!.match(/^\/write\?draft=(\d+)$/)![1]);
    expect((await knex('revisions').where({ id: draft }).first('state')).state).toBe('draft');
  });
});

describe('the bench work Actions', () => {
  it('books in a machine only with a customer reference, keeping the rest as typed', async () => {
    const symptom = 'Tape spills out on rewind after ten minutes';
    const refused = await post(
      '/jobs/new?_action=newJob',
      { customerRef: '  ', reportedSymptom: symptom, status: 'booked_in' },
      member.cookie,
    );
    expectRefusedInPlace(refused, 400);
    expect(valueOf(refused.doc, '[name="reportedSymptom"]')).toBe(symptom);
    expect(messageBeside(refused.doc, '[name="customerRef"]')).toMatch(/customer reference/);
    const created = await post(
      '/jobs/new?_action=newJob',
      { customerRef: 'Bench 31', reportedSymptom: symptom, status: 'booked_in' },
      member.cookie,
    );
    expect(created.status).toBe(303);
    expectCleanLocation(created.location, ['Bench 31', 'Tape spills']);
    const id = created.location!.match(/\/jobs\/(\d+)/)![1]!;

    const findings = 'Pinch roller glazed; idler tyre slipping.';
    const bad = await post(
      `/jobs/${id}?_action=jobSheet`,
      { job: id, intent: 'save', customerRef: 'Bench 31', findings, labourMinutes: 'forty' },
      member.cookie,
    );
    expectRefusedInPlace(bad, 400);
    expect(valueOf(bad.doc, '[name="findings"]')).toBe(findings);
    expect(messageBeside(bad.doc, '[name="labourMinutes"]')).toMatch(/whole minutes/);

    // Another member's sheet is refused like one that does not exist, and nothing changes.
    const stranger = await post(`/jobs/${id}?_action=jobSheet`, { job: id, intent: 'delete', confirm: 'yes' }, author.cookie);
    expect(stranger.status).toBe(404);
    expect(
      await knex('job_sheets')
        .where({ id: Number(id) })
        .first('id'),
    ).toBeDefined();
  });

  it('writes a hand-over note, keeping the message as typed when the warranty line is far too long', async () => {
    const message = 'Your recorder had a dried-out capacitor; it is replaced.';
    const refused = await post('/notes/new?_action=handoverNote', { fix: fixSlug, message, warranty: 'w'.repeat(400) }, member.cookie);
    expectRefusedInPlace(refused, 400);
    expect(valueOf(refused.doc, '[name="message"]')).toBe(message);
    expect(messageBeside(refused.doc, '[name="warranty"]')).toMatch(/under 300 characters/);

    const written = await post('/notes/new?_action=handoverNote', { fix: fixSlug, message, warranty: '90 days on parts' }, member.cookie);
    expect(written.status).toBe(303);
    expectCleanLocation(written.location, ['dried-out', '90 days']);
    const code = written.location!.match(/\/notes\/([^?]+)/)![1]!;

    const wrong = await post(`/notes/${code}?_action=withdrawNote`, { code: 'ZZZZZZZZ' }, member.cookie);
    expectRefusedInPlace(wrong, 404);
    const withdrawn = await post(`/notes/${code}?_action=withdrawNote`, { code }, member.cookie);
    expect(withdrawn.status).toBe(303);
    expect(withdrawn.location).toBe(`/notes/${code}?note=revoked`);
  });
});

describe('the admin Actions', () => {
  it('keeps a too short suspension reason in its row and suspends with a 303', async () => {
    const subject = await createUser(knex, { tag: 'fa-subject' });
    // The list is searched for the member, so their row (and the form typed in) is on the page shown again.
    const listed = `/admin/users?q=${encodeURIComponent(subject.email)}&_action=adminUser`;
    const refused = await post(listed, { intent: 'suspend', userId: String(subject.id), reason: 'x' }, admin.cookie);
    expectRefusedInPlace(refused, 400);
    expect(valueOf(refused.doc, `#reason-${subject.id}`)).toBe('x');
    expect(messageBeside(refused.doc, `#reason-${subject.id}`)).toMatch(/at least 3 characters/);
    const suspended = await post(
      '/admin/users?_action=adminUser',
      { intent: 'suspend', userId: String(subject.id), reason: 'Spam in reports' },
      admin.cookie,
    );
    expect(suspended.status).toBe(303);
    expectCleanLocation(suspended.location, ['Spam in reports']);
    expect((await knex('users').where({ id: subject.id }).first('suspended_at')).suspended_at).not.toBeNull();
  });

  it('refuses a member who calls the Action directly, past the page’s route rule', async () => {
    const subject = await createUser(knex, { tag: 'fa-subject2' });
    const rpc = await postForm(
      base,
      '/_actions/adminUser',
      { intent: 'suspend', userId: String(subject.id), reason: 'Forged' },
      { cookie: member.cookie },
    );
    expect(await rpc.text()).toMatch(/cannot do this/);
    expect((await knex('users').where({ id: subject.id }).first('suspended_at')).suspended_at).toBeNull();
  });

  it('keeps a word family as typed when it is refused', async () => {
    const name = `Hum family ${Date.now()}`;
    const refused = await post('/admin/word-families?_action=wordFamily', { intent: 'create', name, terms: '' }, admin.cookie);
    expectRefusedInPlace(refused, 400);
    expect(valueOf(refused.doc, `input[name="name"][value="${name}"]`)).toBe(name);
  });
});
