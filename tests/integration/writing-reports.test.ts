// Reports on fixes (a plain form on a script-free fix page), and moderators resolving them, locking and hiding fixes.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { postForm } from '../support/sign-in';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let member: Session;
let unverified: Session;
let moderator: Session;
let slug: string;
let fixId: number;

beforeAll(async () => {
  member = await session(knex, base, 'member', 'rep-member');
  unverified = await session(knex, base, 'member', 'rep-unverified', false);
  moderator = await session(knex, base, 'moderator', 'rep-mod');
  const author = await session(knex, base, 'member', 'rep-author');
  ({ slug } = await publishFix(base, author, moderator, completeValues(await someMachineId(knex, 3))));
  fixId = (await knex('fixes').where({ slug }).first('id')).id;
});
afterAll(() => knex.destroy());

describe('the fix page', () => {
  it('offers the edit link and the report form to a verified member, and stays free of script for everyone', async () => {
    const signedIn = await (await fetch(`${base}/fixes/${slug}`, { headers: { cookie: member.cookie } })).text();
    expect(signedIn).toContain(`href="/fixes/${slug}/edit"`);
    expect(signedIn).toContain(`action="/fixes/${slug}?_action=reportFix"`);
    expect(scriptsBesideRegistration(signedIn)).toEqual([]);
    const anonymous = await fetch(`${base}/fixes/${slug}`);
    const html = await anonymous.text();
    expect(html).not.toContain(`href="/fixes/${slug}/edit"`);
    expect(html).not.toContain(`action="/fixes/${slug}?_action=reportFix"`);
    expect(html).toContain('to report a fix');
    expect(scriptsBesideRegistration(html)).toEqual([]);
    const unconfirmed = await (await fetch(`${base}/fixes/${slug}`, { headers: { cookie: unverified.cookie } })).text();
    expect(unconfirmed).toContain('Confirm your e-mail address');
    expect(unconfirmed).not.toContain(`href="/fixes/${slug}/edit"`);
  });
});

describe('reporting a fix', () => {
  it('takes a form post, refuses the same open report twice, and needs a reason', async () => {
    const sent = await postForm(
      base,
      `/api/v1/fixes/${slug}/reports`,
      { reason: 'dangerous', detail: 'The remedy has you probe the primary side with no caution about stored charge.' },
      { cookie: member.cookie },
    );
    expect(sent.status).toBe(303);
    expect(sent.headers.get('location')).toBe(`/fixes/${slug}?report=sent#report`);
    expect(await (await fetch(`${base}/fixes/${slug}?report=sent`, { headers: { cookie: member.cookie } })).text()).toContain(
      'your report reached the moderators',
    );
    const again = await postForm(
      base,
      `/api/v1/fixes/${slug}/reports`,
      { reason: 'dangerous', detail: 'Same again, for the same reason.' },
      { cookie: member.cookie },
    );
    expect(again.status).toBe(303);
    // Only the code travels in the address; the page shows its fixed sentence.
    expect(new URL(again.headers.get('location') ?? '', base).searchParams.get('report_error')).toBe('conflict');
    const noReason = await call(base, `/api/v1/fixes/${slug}/reports`, { body: { reason: 'boring', detail: 'x' }, cookie: member.cookie });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBeDefined();
    const tooShort = await call(base, `/api/v1/fixes/${slug}/reports`, { body: { reason: 'wrong', detail: 'bad' }, cookie: member.cookie });
    expect(tooShort.body.error.fields.detail[0]).toMatch(/Say in a sentence/);
    expect((await call(base, `/api/v1/fixes/${slug}/reports`, { body: { reason: 'spam' }, cookie: unverified.cookie })).status).toBe(403);
    expect((await call(base, `/api/v1/fixes/${slug}/reports`, { body: { reason: 'spam' } })).status).toBe(401);
    expect(await knex('reports').where({ fix_id: fixId, state: 'open' }).count('* as n').first()).toEqual({ n: '1' });
  });

  it('shows open reports on the desk and lets a moderator resolve one, with an audit entry', async () => {
    const report = await knex('reports').where({ fix_id: fixId, state: 'open' }).first('id');
    const desk = await (await fetch(`${base}/proofing`, { headers: { cookie: moderator.cookie } })).text();
    expect(desk).toContain(`data-report="${report.id}"`);
    const resolved = await postForm(
      base,
      `/api/v1/proofing/reports/${report.id}`,
      { outcome: 'resolved', note: 'Caution added in r2.' },
      { cookie: moderator.cookie },
    );
    expect(resolved.status).toBe(303);
    const row = await knex('reports').where({ id: report.id }).first('state', 'resolved_by', 'resolution_note');
    expect(row).toEqual({ state: 'resolved', resolved_by: moderator.id, resolution_note: 'Caution added in r2.' });
    const actions = await knex('audit_log')
      .where({ subject_type: 'report', subject_id: String(report.id) })
      .pluck('action');
    expect(actions).toEqual(expect.arrayContaining(['report.create', 'report.resolve']));
    expect(
      (await postForm(base, `/api/v1/proofing/reports/${report.id}`, { outcome: 'dismissed' }, { cookie: member.cookie })).status,
    ).toBe(403);
  });
});

describe('locking and hiding', () => {
  it('locks a fix against edits by members (moderators still write), and unlocks it', async () => {
    expect((await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'lock' }, { cookie: member.cookie })).status).toBe(403);
    expect(
      (await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'lock', note: 'Edit war' }, { cookie: moderator.cookie })).status,
    ).toBe(303);
    const refused = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(await someMachineId(knex, 3)) },
      cookie: member.cookie,
    });
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/locked by a moderator/);
    expect(await (await fetch(`${base}/fixes/${slug}/edit`, { headers: { cookie: member.cookie } })).text()).toContain(
      'This fix is locked',
    );
    expect(await (await fetch(`${base}/fixes/${slug}`, { headers: { cookie: member.cookie } })).text()).not.toContain(
      `href="/fixes/${slug}/edit"`,
    );
    const byModerator = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(await someMachineId(knex, 3)) },
      cookie: moderator.cookie,
    });
    expect(byModerator.status).toBe(201);
    expect((await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'unlock' }, { cookie: moderator.cookie })).status).toBe(303);
    expect((await knex('fixes').where({ id: fixId }).first('locked_at')).locked_at).toBeNull();
  });

  it('hides a fix from readers and search, and shows it again', async () => {
    expect((await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'hide' }, { cookie: moderator.cookie })).status).toBe(303);
    expect((await fetch(`${base}/fixes/${slug}`)).status).toBe(404);
    expect(await knex('fix_search').where({ fix_id: fixId }).first()).toBeUndefined();
    const desk = await (await fetch(`${base}/proofing`, { headers: { cookie: moderator.cookie } })).text();
    expect(desk).toContain(`data-flagged="${slug}"`);
    expect((await postForm(base, `/api/v1/proofing/fixes/${slug}`, { action: 'unhide' }, { cookie: moderator.cookie })).status).toBe(303);
    expect((await fetch(`${base}/fixes/${slug}`)).status).toBe(200);
    expect(await knex('fix_search').where({ fix_id: fixId }).first('fix_id')).toEqual({ fix_id: fixId });
    const actions = await knex('audit_log')
      .where({ subject_type: 'fix', subject_id: String(fixId) })
      .pluck('action');
    expect(actions).toEqual(expect.arrayContaining(['fix.lock', 'fix.unlock', 'fix.hide', 'fix.unhide']));
  });
});

describe('reports on a deleted fix', () => {
  it('leave the desk with the fix: nothing is left there for a moderator to act on', async () => {
    const author = await session(knex, base, 'member', 'rep-gone-author');
    const gone = await publishFix(base, author, moderator, completeValues(await someMachineId(knex, 4)));
    const sent = await postForm(
      base,
      `/api/v1/fixes/${gone.slug}/reports`,
      { reason: 'wrong', detail: 'The belt size in the parts list does not match the pulley.' },
      { cookie: member.cookie },
    );
    expect(sent.status).toBe(303);
    const report = await knex('reports as rp').join('fixes as f', 'f.id', 'rp.fix_id').where('f.slug', gone.slug).first('rp.id');
    const before = await (await fetch(`${base}/proofing`, { headers: { cookie: moderator.cookie } })).text();
    expect(before).toContain(`data-report="${report.id}"`);
    // Deleted as the data rules have it: the fix row marked and its search row gone with it.
    const [row] = await knex('fixes').where({ slug: gone.slug }).update({ deleted_at: new Date() }).returning('id');
    await knex('fix_search').where({ fix_id: row.id }).delete();
    const after = await (await fetch(`${base}/proofing`, { headers: { cookie: moderator.cookie } })).text();
    expect(after).not.toContain(`data-report="${report.id}"`);
  });
});
