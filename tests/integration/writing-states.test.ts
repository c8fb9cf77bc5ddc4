// A revision's life through the built server with real sign-in: draft → submitted → proofed (live) or returned → amended.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { waitForMail } from '../support/mail';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let author: Session;
let moderator: Session;
let machineId: number;

beforeAll(async () => {
  author = await session(knex, base, 'member', 'states-author');
  moderator = await session(knex, base, 'moderator', 'states-mod');
  machineId = await someMachineId(knex);
});
afterAll(() => knex.destroy());

describe('a new fix from draft to live', () => {
  it('keeps a draft private, refuses a submission without a symptom, and goes live only when proofed', async () => {
    const values = completeValues(machineId, { symptoms: [] });
    const created = await call(base, '/api/v1/drafts', { body: { values }, cookie: author.cookie });
    expect(created.status).toBe(201);
    const id: number = created.body.revision.id;
    expect(created.body.revision.state).toBe('draft');
    expect(created.body.revision.fixSlug).toBeNull();
    expect(JSON.stringify(created.body)).not.toContain(author.email);

    const notReady = await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: author.cookie });
    expect(notReady.status).toBe(400);
    expect(notReady.body.error.fields.symptoms[0]).toMatch(/at least one symptom/);
    expect((await knex('revisions').where({ id }).first('state')).state).toBe('draft');

    const saved = await call(base, `/api/v1/drafts/${id}`, {
      method: 'PUT',
      body: { values: { ...values, symptoms: ['Capstan stops after ten minutes'] } },
      cookie: author.cookie,
    });
    expect(saved.status).toBe(200);
    const submitted = await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: author.cookie });
    expect(submitted.status).toBe(200);
    expect(submitted.body.revision.state).toBe('submitted');

    // Waiting: on the desk, nowhere public, and no longer editable in place.
    const desk = await fetch(`${base}/proofing`, { headers: { cookie: moderator.cookie } });
    expect(await desk.text()).toContain(`data-desk-revision="${id}"`);
    const fix = await knex('revisions as r')
      .join('fixes as f', 'f.id', 'r.fix_id')
      .where('r.id', id)
      .first('f.id', 'f.slug', 'f.current_revision_id');
    expect(fix.current_revision_id).toBeNull();
    expect((await fetch(`${base}/fixes/${fix.slug}`)).status).toBe(404);
    const late = await call(base, `/api/v1/drafts/${id}`, { method: 'PUT', body: { values }, cookie: author.cookie });
    expect(late.status).toBe(409);

    const proofed = await call(base, `/api/v1/proofing/${id}/proof`, { body: { note: 'Clear and complete.' }, cookie: moderator.cookie });
    expect(proofed.status).toBe(200);
    const slug: string = proofed.body.slug;
    expect(slug).toMatch(/^capstan-motor-stalls-after-warm-up/);
    const page = await fetch(`${base}/fixes/${slug}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain(values.title);
    expect(scriptsBesideRegistration(html)).toEqual([]);

    const live = await knex('fixes').where({ slug }).first('id', 'current_revision_id');
    expect(live.current_revision_id).toBe(id);
    expect(await knex('fix_machines').where({ fix_id: live.id }).pluck('machine_id')).toEqual([machineId]);
    expect((await knex('fix_search').where({ fix_id: live.id }).first('revision_id')).revision_id).toBe(id);
    const audit = await knex('audit_log')
      .where({ subject_type: 'revision', subject_id: String(id) })
      .pluck('action');
    expect(audit).toEqual(expect.arrayContaining(['revision.submit', 'revision.proof']));
    const mail = await waitForMail(INTEGRATION_PORT, author.email, { subject: 'is live' });
    expect(mail.text).toContain('Clear and complete.');
    expect(mail.text).toContain(`/fixes/${slug}`);
  });
});

describe('returning and amending', () => {
  it('needs a note to return, keeps the returned revision unchanged, and resubmits an amendment on top', async () => {
    const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: author.cookie });
    const id: number = created.body.revision.id;
    await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: author.cookie });

    const noNote = await call(base, `/api/v1/proofing/${id}/return`, { body: { note: '  ' }, cookie: moderator.cookie });
    expect(noNote.status).toBe(400);
    expect(noNote.body.error.fields.note[0]).toMatch(/always carries a note/);
    const returned = await call(base, `/api/v1/proofing/${id}/return`, {
      body: { note: 'Say which way round C512 goes.' },
      cookie: moderator.cookie,
    });
    expect(returned.status).toBe(200);
    const mail = await waitForMail(INTEGRATION_PORT, author.email, { subject: 'returned' });
    expect(mail.text).toContain('Say which way round C512 goes.');

    const mine = await (await fetch(`${base}/write/mine`, { headers: { cookie: author.cookie } })).text();
    expect(mine).toContain('Say which way round C512 goes.');
    const before = await knex('revisions').where({ id }).first();

    const amended = await call(base, `/api/v1/revisions/${id}/amend`, { body: {}, cookie: author.cookie });
    expect(amended.status).toBe(201);
    const draftId: number = amended.body.revision.id;
    expect(draftId).not.toBe(id);
    expect(amended.body.editorPath).toBe(`/write?draft=${draftId}`);
    const row = await knex('revisions').where({ id: draftId }).first('amends_revision_id', 'parent_revision_id', 'number');
    expect(row.amends_revision_id).toBe(id);
    expect(row.number).toBe(before.number + 1);

    const values = { ...amended.body.revision.values, cause: `${amended.body.revision.values.cause} Fit it with the stripe towards R510.` };
    expect((await call(base, `/api/v1/drafts/${draftId}/submit`, { body: { values }, cookie: author.cookie })).status).toBe(200);
    const after = await knex('revisions').where({ id }).first();
    expect(after).toEqual(before);
    expect(after.state).toBe('returned');
  });

  it('refuses, in the database itself, to change a submitted revision in place', async () => {
    const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: author.cookie });
    const id: number = created.body.revision.id;
    await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: author.cookie });
    const error = await knex('revisions')
      .where({ id })
      .update({ cause: 'changed behind everyone’s back' })
      .catch((e: { constraint?: string }) => e);
    expect((error as { constraint?: string }).constraint).toBe('revisions_frozen_check');
    const backwards = await knex('revisions')
      .where({ id })
      .update({ state: 'draft' })
      .catch((e: { constraint?: string }) => e);
    expect((backwards as { constraint?: string }).constraint).toBe('revisions_transition_check');
  });
});

describe('editing a live fix', () => {
  it('starts from the live revision, keeps readers on the proofed text while the edit waits, then shows the new one', async () => {
    const { slug, revisionId } = await publishFix(base, author, moderator, completeValues(machineId));
    const editPage = await fetch(`${base}/fixes/${slug}/edit`, { headers: { cookie: author.cookie } });
    expect(editPage.status).toBe(200);
    expect(await editPage.text()).toContain('astro-island');

    const created = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(machineId, { cause: 'A second, better explained cause.' }) },
      cookie: author.cookie,
    });
    expect(created.status).toBe(201);
    expect(created.body.revision.baseRevisionId).toBe(revisionId);
    const id: number = created.body.revision.id;
    expect((await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: author.cookie })).status).toBe(200);
    expect(await (await fetch(`${base}/fixes/${slug}`)).text()).not.toContain('A second, better explained cause.');

    expect((await call(base, `/api/v1/proofing/${id}/proof`, { body: {}, cookie: moderator.cookie })).status).toBe(200);
    expect(await (await fetch(`${base}/fixes/${slug}`)).text()).toContain('A second, better explained cause.');
    const history = await (await fetch(`${base}/fixes/${slug}/history`)).text();
    expect(history).toMatch(/r1[\s\S]*r2|r2[\s\S]*r1/);
  });
});
