// Who may write, proof and see what, through the built server: signed out, unverified, member, moderator.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { call, completeValues, publishFix, session, someMachineId, type Session } from '../fixtures/writing';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let member: Session;
let other: Session;
let unverified: Session;
let moderator: Session;
let machineId: number;

beforeAll(async () => {
  member = await session(knex, base, 'member', 'perm-member');
  other = await session(knex, base, 'member', 'perm-other');
  unverified = await session(knex, base, 'member', 'perm-unverified', false);
  moderator = await session(knex, base, 'moderator', 'perm-mod');
  machineId = await someMachineId(knex, 2);
});
afterAll(() => knex.destroy());

describe('writing', () => {
  it('sends a signed-out reader to sign in and answers the API with 401', async () => {
    const page = await fetch(`${base}/write`, { redirect: 'manual' });
    expect(page.status).toBe(302);
    expect(page.headers.get('location')).toMatch(/^\/sign-in\?next=%2Fwrite/);
    expect((await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) } })).status).toBe(401);
  });

  it('refuses an unconfirmed account', async () => {
    expect((await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: unverified.cookie })).status).toBe(
      403,
    );
    expect((await fetch(`${base}/write`, { headers: { cookie: unverified.cookie }, redirect: 'manual' })).status).toBe(403);
  });

  it('keeps each draft to its writer', async () => {
    const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: member.cookie });
    const id = created.body.revision.id;
    expect((await call(base, `/api/v1/drafts/${id}`, { cookie: other.cookie })).status).toBe(404);
    expect(
      (await call(base, `/api/v1/drafts/${id}`, { method: 'PUT', body: { values: completeValues(machineId) }, cookie: other.cookie }))
        .status,
    ).toBe(404);
    expect((await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: other.cookie })).status).toBe(404);
    expect((await fetch(`${base}/write?draft=${id}`, { headers: { cookie: other.cookie } })).status).toBe(404);
    // Drafts stay private even from moderators.
    expect((await fetch(`${base}/proofing/${id}`, { headers: { cookie: moderator.cookie } })).status).toBe(404);
    const own = await fetch(`${base}/write?draft=${id}`, { headers: { cookie: member.cookie } });
    expect(own.status).toBe(200);
    expect(own.headers.get('cache-control')).toMatch(/private/);
  });

  it('opens the one draft a writer has of a fix rather than starting a second', async () => {
    const { slug } = await publishFix(base, member, moderator, completeValues(machineId));
    const firstDraft = await call(base, '/api/v1/drafts', {
      body: { fixSlug: slug, values: completeValues(machineId) },
      cookie: other.cookie,
    });
    expect(firstDraft.status).toBe(201);
    const second = await call(base, '/api/v1/drafts', { body: { fixSlug: slug, values: completeValues(machineId) }, cookie: other.cookie });
    expect(second.status).toBe(409);
    const edit = await (await fetch(`${base}/fixes/${slug}/edit`, { headers: { cookie: other.cookie } })).text();
    expect(edit).toContain(`&quot;id&quot;:[0,${firstDraft.body.revision.id}]`.replace('[0,', '[0,'));
  });
});

describe('proofing', () => {
  it('is for moderators only', async () => {
    const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: member.cookie });
    const id = created.body.revision.id;
    await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: member.cookie });
    expect((await fetch(`${base}/proofing`, { headers: { cookie: member.cookie }, redirect: 'manual' })).status).toBe(403);
    expect((await fetch(`${base}/proofing/${id}`, { headers: { cookie: member.cookie }, redirect: 'manual' })).status).toBe(403);
    expect((await call(base, `/api/v1/proofing/${id}/proof`, { body: {}, cookie: other.cookie })).status).toBe(403);
    expect((await call(base, `/api/v1/proofing/${id}/return`, { body: { note: 'no' }, cookie: member.cookie })).status).toBe(403);
    expect((await call(base, `/api/v1/proofing/${id}/proof`, { body: {} })).status).toBe(401);
    const review = await fetch(`${base}/proofing/${id}`, { headers: { cookie: moderator.cookie } });
    expect(review.status).toBe(200);
    const html = await review.text();
    expect(html).toContain('Everything in this new fix');
    expect(html).toContain(`action="/proofing/${id}?_action=proofingDecision"`);
    expect(html).toContain('name="decision" value="proof"');
  });

  it('lets a moderator proof with a plain form post and comes back to the desk', async () => {
    const created = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: member.cookie });
    const id = created.body.revision.id;
    await call(base, `/api/v1/drafts/${id}/submit`, { body: {}, cookie: member.cookie });
    const form = await fetch(`${base}/api/v1/proofing/${id}/proof`, {
      method: 'POST',
      headers: { cookie: moderator.cookie, origin: base, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ note: '' }),
      redirect: 'manual',
    });
    expect(form.status).toBe(303);
    expect(form.headers.get('location')).toBe('/proofing?proofed=1');
    const crossSite = await fetch(`${base}/api/v1/proofing/${id}/return`, {
      method: 'POST',
      headers: { cookie: moderator.cookie, origin: 'https://elsewhere.example', 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ note: 'forged' }),
      redirect: 'manual',
    });
    expect(crossSite.status).toBe(403);
  });
});
