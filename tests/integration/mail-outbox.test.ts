// The mail outbox against the real server and sink: with the relay down nothing is lost, and each message is sent once when it is back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { mailsTo, waitForMail } from '../support/mail';
import { startApp, type TestApp } from '../support/server';
import { INTEGRATION_PORT, sinkPortFor } from '../support/test-env';
import { STRONG_PASSWORD, createUser, postForm, uniqueClientIp, uniqueEmail } from '../support/sign-in';
import { completeValues, publishFix, session, someMachineId } from '../fixtures/writing';

// A server of its own, so stopping its sink touches no other test (+3 background work, +7 the production mail check).
const port = INTEGRATION_PORT + 11;
const knex = testDb();
let app: TestApp;

beforeAll(async () => {
  app = await startApp(port);
}, 40_000);
afterAll(async () => {
  await app?.stop();
  await knex.destroy();
});

const outboxJobs = async (states: string[]): Promise<number> =>
  Number(
    (
      await knex('pgboss.job')
        .where({ name: `mail-outbox-sink-${sinkPortFor(port)}` })
        .whereIn('state', states)
        .count({ n: '*' })
        .first()
    )?.n ?? 0,
  );

describe('the mail outbox', () => {
  it('keeps sign-up, reset, sign-in link and proofing mail while the relay is down and sends each exactly once when it is back', async () => {
    const resetter = await createUser(knex, { tag: 'outbox-reset' });
    const linker = await createUser(knex, { tag: 'outbox-link' });
    const author = await session(knex, app.base, 'member', 'outbox-author');
    const moderator = await session(knex, app.base, 'moderator', 'outbox-mod');
    const joiner = uniqueEmail('outbox-join');
    const pendingBefore = await outboxJobs(['created', 'retry', 'active']);

    await app.sink.stop();
    // Every form answers as usual: the relay being down is nobody's problem but the outbox's.
    const joined = await postForm(
      app.base,
      '/sign-up',
      { name: 'Outbox Joiner', email: joiner, password: STRONG_PASSWORD },
      { ip: uniqueClientIp() },
    );
    expect(joined.status).toBe(303);
    expect((await postForm(app.base, '/reset', { email: resetter.email }, { ip: uniqueClientIp() })).status).toBe(303);
    expect((await postForm(app.base, '/sign-in', { intent: 'link', email: linker.email }, { ip: uniqueClientIp() })).status).toBe(303);
    await publishFix(app.base, author, moderator, completeValues(await someMachineId(knex)));

    const expected = [
      { to: joiner, subject: 'Confirm your e-mail address for Benchlore' },
      { to: resetter.email, subject: 'Choose a new Benchlore password' },
      { to: linker.email, subject: 'Your Benchlore sign-in link' },
      { to: author.email, subject: 'is live' },
    ];
    // The worker has tried and failed: the messages wait in the outbox, none reached the (stopped) sink.
    await new Promise((r) => setTimeout(r, 3_000));
    expect(await outboxJobs(['retry'])).toBeGreaterThanOrEqual(expected.length);
    expect(await outboxJobs(['created', 'retry', 'active'])).toBeGreaterThanOrEqual(pendingBefore + expected.length);
    for (const { to } of expected) expect(await mailsTo(port, to)).toEqual([]);

    await app.sink.start();
    const back = Date.now();
    for (const { to, subject } of expected) await waitForMail(port, to, { subject, timeoutMs: 20_000 });
    const allArrivedMs = Date.now() - back;
    // The relay check runs every 2 s: everything waiting goes within a few seconds, not at the next back-off slot.
    expect(allArrivedMs).toBeLessThan(10_000);
    // Exactly once: nothing arrives a second time after a further pause.
    await new Promise((r) => setTimeout(r, 3_000));
    for (const { to, subject } of expected) {
      const got = (await mailsTo(port, to)).filter((m) => m.subject.includes(subject));
      expect(got, `${subject} to ${to}`).toHaveLength(1);
    }
    expect(await outboxJobs(['created', 'retry', 'active'])).toBe(0);
  }, 60_000);
});
