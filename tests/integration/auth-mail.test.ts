// Account mail through the local sink: both parts of each message, the dev mail pages, and their absence in production.
import { spawn } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { sanitiseMailHtml } from '@/server/mail/sanitise';
import { confirmAddressMail, resetPasswordMail } from '@/server/mail/templates';
import { DIST_DIR, INTEGRATION_PORT, testEnv } from '../support/test-env';
import { testDb } from '../support/db';
import { waitForMail } from '../support/mail';
import { createUser, postForm, uniqueClientIp } from '../support/sign-in';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
afterAll(() => knex.destroy());

describe('account mail', () => {
  it('has a plain-text and an HTML part with the same link, escaped in the HTML', () => {
    const mail = confirmAddressMail('someone@example.test', 'Ada <Tape> & Reel', 'https://bench.example/verify?token=abc&x=1');
    expect(mail.text).toContain('Hello Ada <Tape> & Reel,');
    expect(mail.text).toContain('https://bench.example/verify?token=abc&x=1');
    expect(mail.html).toContain('Hello Ada &lt;Tape&gt; &amp; Reel,');
    expect(mail.html).toContain('href="https://bench.example/verify?token=abc&amp;x=1"');
    expect(resetPasswordMail('a@example.test', 'https://bench.example/r').text).toContain('one hour');
  });

  it('arrives in the sink with sender, recipient, subject and both parts', async () => {
    const user = await createUser(knex, { tag: 'sinkmail' });
    expect((await postForm(base, '/reset', { email: user.email }, { ip: uniqueClientIp() })).status).toBe(303);
    const mail = await waitForMail(INTEGRATION_PORT, user.email);
    expect(mail.from).toContain('no-reply@benchlore.invalid');
    expect(mail.to).toEqual([user.email]);
    expect(mail.subject).toBe('Choose a new Benchlore password');
    expect(mail.text).toContain('/reset/password?token=');
    expect(mail.html).toContain('Choose a new password</a>');
    expect(new Date(mail.date).getTime()).toBeGreaterThan(Date.now() - 60_000);
  });
});

describe('dev mail pages', () => {
  it('list messages newest first and show one with its text and cleaned HTML', async () => {
    const user = await createUser(knex, { tag: 'devmail' });
    await postForm(base, '/reset', { email: user.email }, { ip: uniqueClientIp() });
    const mail = await waitForMail(INTEGRATION_PORT, user.email);
    const list = await fetch(`${base}/dev/mail`);
    expect(list.status).toBe(200);
    expect(list.headers.get('cache-control')).toBe('private, no-store');
    const listHtml = await list.text();
    expect(listHtml).toContain(`href="/dev/mail/${mail.id}"`);
    expect(scriptsBesideRegistration(listHtml)).toEqual([]);

    const one = await fetch(`${base}/dev/mail/${mail.id}`);
    expect(one.status).toBe(200);
    const html = await one.text();
    expect(html).toContain('Choose a new Benchlore password');
    expect(html).toContain(user.email);
    expect(scriptsBesideRegistration(html)).toEqual([]);
    expect(html).not.toContain('style="background');
  });

  it('answers 404 for an unknown or malformed message id', async () => {
    expect((await fetch(`${base}/dev/mail/0000000000000-00000000`)).status).toBe(404);
    expect((await fetch(`${base}/dev/mail/..%2F..%2Fpackage`)).status).toBe(404);
  });

  it('answers 404 when NODE_ENV is production', async () => {
    const port = INTEGRATION_PORT + 7;
    const child = spawn(process.execPath, [`${DIST_DIR}/serve.mjs`], {
      env: { ...testEnv(), NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), PUBLIC_ORIGIN: `http://127.0.0.1:${port}` },
      stdio: 'ignore',
    });
    try {
      let answer: Response | undefined;
      for (let i = 0; i < 100 && !answer; i++) {
        answer = await fetch(`http://127.0.0.1:${port}/dev/mail`).catch(() => undefined);
        if (!answer) await new Promise((resolve) => setTimeout(resolve, 200));
      }
      expect(answer?.status).toBe(404);
      expect((await fetch(`http://127.0.0.1:${port}/dev/mail/0000000000000-00000000`)).status).toBe(404);
    } finally {
      child.kill('SIGTERM');
    }
  });
});

describe('sanitiseMailHtml', () => {
  it('keeps text, paragraphs and http links and drops scripts, styles, images, handlers and javascript: links', () => {
    const dirty =
      '<p style="color:red" onclick="steal()">Hello <strong>there</strong></p><script>alert(1)</script><img src="x" onerror="steal()"><a href="javascript:steal()">bad</a><a href="https://bench.example/a">good</a><iframe src="https://x.example"></iframe>';
    const clean = sanitiseMailHtml(dirty);
    expect(clean).toBe(
      '<p>Hello <strong>there</strong></p><a rel="noopener noreferrer">bad</a><a href="https://bench.example/a" rel="noopener noreferrer">good</a>',
    );
  });
});
