// The fix page's and job sheet's forms as a browser without script sends them: a refused form comes back with
// everything typed and the message beside its field, no address carries typed text, and the page shows only
// fixed messages whatever its address says.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Window } from 'happy-dom';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { signIn } from '../support/sign-in';
import { as, makeFix, makeMember, makeWorld, PASSWORD, type TestFix, type TestWorld } from './bench-work-support';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let world: TestWorld;
let fix: TestFix;
let member: { id: number; email: string };
let cookie: string;

/** A technician's long write-up: over 20 kB, with indented lines, blank lines and characters HTML escapes. */
const longNote = Array.from(
  { length: 330 },
  (_, i) =>
    `${i % 7 === 0 ? '    ' : ''}Step ${i + 1}: checked the <reel> motor & idler, 11.8 V at TP${i % 9}; "fine".${i % 5 === 0 ? '\n' : ''}`,
).join('\n');

beforeAll(async () => {
  world = await makeWorld(knex);
  fix = await makeFix(knex, {
    authorId: (await makeMember(knex)).id,
    machineIds: [world.machines[0]!.id],
    revisions: 2,
    cautions: [{ kind: 'mains' }],
  });
  member = await makeMember(knex);
  cookie = await signIn(base, member.email, PASSWORD);
});
afterAll(() => knex.destroy());

function documentOf(html: string): Document {
  const window = new Window({ url: base });
  window.document.write(html);
  return window.document as unknown as Document;
}

interface Sent {
  /** Every status and Location seen, the last being the page shown. */
  hops: { status: number; location: string | null }[];
  html: string;
  url: string;
}

/**
 * Sends the form holding `fieldSelector` as a browser would: its controls' values with `fields` over them, to its
 * action, then follows redirects with GET. Nothing about where the form posts is assumed.
 */
async function sendForm(pagePath: string, fieldSelector: string, fields: Record<string, string>): Promise<Sent> {
  const page = await (await fetch(`${base}${pagePath}`, { headers: { Cookie: cookie } })).text();
  const form = documentOf(page).querySelector(fieldSelector)?.closest('form');
  if (!form) throw new Error(`no form with ${fieldSelector} on ${pagePath}`);
  const body = new URLSearchParams();
  const names = new Set<string>();
  for (const control of Array.from(form.querySelectorAll('input, select, textarea')) as HTMLInputElement[]) {
    if (!control.name || control.name in fields) continue;
    if ((control.type === 'radio' || control.type === 'checkbox') && !control.checked) continue;
    names.add(control.name);
    body.append(control.name, control.value);
  }
  for (const [name, value] of Object.entries(fields)) body.append(name, value);
  let url = new URL(form.getAttribute('action') ?? pagePath, `${base}${pagePath}`).href;
  const hops: Sent['hops'] = [];
  let res = await fetch(url, {
    method: 'POST',
    redirect: 'manual',
    headers: { Cookie: cookie, Origin: base, 'Content-Type': 'application/x-www-form-urlencoded' },
    body,
  });
  for (let i = 0; i < 5; i++) {
    const location = res.headers.get('location');
    hops.push({ status: res.status, location });
    if (res.status < 300 || res.status >= 400 || !location) break;
    url = new URL(location, url).href;
    res = await fetch(url, { redirect: 'manual', headers: { Cookie: cookie } });
  }
  return { hops, html: await res.text(), url };
}

function expectNoTypedTextInAddresses(sent: Sent, typed: string[]): void {
  for (const hop of sent.hops) {
    expect(hop.status).not.toBe(431);
    expect(hop.status).toBeLessThan(500);
    for (const text of typed) expect(decodeURIComponent(hop.location ?? '')).not.toContain(text.slice(0, 24));
  }
  for (const text of typed) expect(decodeURIComponent(sent.url)).not.toContain(text.slice(0, 24));
}

describe('bench report form on the fix page', () => {
  it('keeps a 20 kB note and the readings when one field is refused, with the message beside that field', async () => {
    expect(longNote.length).toBeGreaterThan(20_000);
    const typed = {
      machine: world.machines[0]!.slug,
      outcome: 'came_back',
      heldDays: '',
      note: longNote,
      'readings.0.testPoint': 'TP3 on the servo board',
      'readings.0.expected': '12 V',
      'readings.0.measured': '11.8 V',
    };
    const sent = await sendForm(`/fixes/${fix.slug}`, '#bench-note', typed);
    expectNoTypedTextInAddresses(sent, [longNote, 'TP3 on the servo board']);
    const doc = documentOf(sent.html);
    // What was typed is all there, to the character.
    expect((doc.querySelector('#bench-note') as HTMLTextAreaElement).value).toBe(longNote);
    expect((doc.querySelector('input[name="readings.0.testPoint"]') as HTMLInputElement).value).toBe('TP3 on the servo board');
    expect((doc.querySelector('input[name="readings.0.measured"]') as HTMLInputElement).value).toBe('11.8 V');
    expect((doc.querySelector('input[name="outcome"][value="came_back"]') as HTMLInputElement).checked).toBe(true);
    // The refused field is marked and its message is beside it.
    const held = doc.querySelector('#bench-held') as HTMLInputElement;
    expect(held.getAttribute('aria-invalid')).toBe('true');
    const describedBy = (held.getAttribute('aria-describedby') ?? '').split(' ').filter(Boolean);
    const messages = describedBy.map((id) => doc.getElementById(id)?.textContent ?? '').join(' ');
    expect(messages).toMatch(/how many days/i);
    expect(await knex('bench_reports').where({ member_id: member.id, fix_id: fix.id }).first()).toBeUndefined();
  });

  it('saves the whole note as typed once the refused field is filled in, and shows it on the fix page', async () => {
    const sent = await sendForm(`/fixes/${fix.slug}`, '#bench-note', {
      machine: world.machines[0]!.slug,
      outcome: 'came_back',
      heldDays: '45',
      note: longNote,
    });
    expectNoTypedTextInAddresses(sent, [longNote]);
    const row = await knex('bench_reports').where({ member_id: member.id, fix_id: fix.id }).first('note', 'held_days');
    // Saving trims the ends of what was typed and adds nothing.
    expect(row).toEqual({ note: longNote.trim(), held_days: 45 });
    expect(sent.html).toContain('Your bench report is saved');
  });
});

describe('bench report form on a job sheet', () => {
  it('comes back with the typed note and the message when refused, without the note in any address', async () => {
    const me = as(base, cookie);
    const created = await me.post('/api/v1/job-sheets', { customerRef: 'Forms test 1', machine: world.machines[0]!.slug });
    const jobId = (await created.json()).jobSheet?.id;
    expect(jobId).toBeTruthy();
    expect((await me.post(`/api/v1/job-sheets/${jobId}/fixes`, { fix: fix.slug })).status).toBeLessThan(300);
    const note = `Job note kept: ${longNote.slice(0, 3000)}`;
    const sent = await sendForm(`/jobs/${jobId}`, `#${fix.slug}-note`, { outcome: 'came_back', heldDays: '', note });
    expectNoTypedTextInAddresses(sent, [note]);
    const doc = documentOf(sent.html);
    expect((doc.querySelector(`#${fix.slug}-note`) as HTMLTextAreaElement).value).toBe(note);
    expect(doc.querySelector(`#${fix.slug}-heldDays`)?.getAttribute('aria-invalid')).toBe('true');
    expect(sent.html).toMatch(/how many days/i);
  });
});

describe('report form on the fix page', () => {
  it('keeps the typed detail when the report is refused', async () => {
    // Too long for the detail field: refused, and the text comes back to be shortened, not retyped.
    const detail = `The mains caution names the wrong fuse. ${'x'.repeat(2100)}`;
    const sent = await sendForm(`/fixes/${fix.slug}`, '#report-detail', { reason: 'wrong', detail });
    expectNoTypedTextInAddresses(sent, [detail]);
    const doc = documentOf(sent.html);
    expect((doc.querySelector('#report-detail') as HTMLTextAreaElement).value).toBe(detail);
    expect(doc.querySelector('#report-detail')?.getAttribute('aria-invalid')).toBe('true');
  });
});

describe('messages from the address', () => {
  it('never shows text given in the address on the fix page', async () => {
    const planted = 'this fix was withdrawn';
    for (const query of [
      `report_error=${encodeURIComponent(planted)}`,
      `bench=${encodeURIComponent(planted)}`,
      `report=${encodeURIComponent(planted)}`,
      `typed.note=${encodeURIComponent(planted)}&bench=need_days`,
    ]) {
      for (const who of ['', cookie]) {
        const html = await (await fetch(`${base}/fixes/${fix.slug}?${query}`, { headers: who ? { Cookie: who } : {} })).text();
        expect(html.toLowerCase()).not.toContain(planted);
      }
    }
  });
});

describe('messages from the address on the history page', () => {
  it('shows a moderator a fixed sentence for a refused change, never the text given in the address', async () => {
    const moderator = await signIn(base, 'moderator@example.test', PASSWORD);
    const planted = 'this fix was withdrawn';
    const html = await (
      await fetch(`${base}/fixes/${fix.slug}/history?error=${encodeURIComponent(planted)}`, { headers: { Cookie: moderator } })
    ).text();
    expect(html.toLowerCase()).not.toContain(planted);
    expect(html).toContain('That change was not made');
  });
});

describe('a form sent after the session ended', () => {
  it('answers 401 and keeps the bench report note on the page to copy, never in the address', async () => {
    const note = `Written while the session ran out: ${'belt and idler, '.repeat(50)}`;
    const res = await fetch(`${base}/fixes/${fix.slug}?_action=benchReport`, {
      method: 'POST',
      redirect: 'manual',
      headers: { Origin: base, 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ fix: fix.slug, machine: world.machines[0]!.slug, outcome: 'fixed', note }),
    });
    expect(res.status).toBe(401);
    expect(res.headers.get('location')).toBeNull();
    const doc = documentOf(await res.text());
    expect((doc.querySelector('#bench-note-kept') as HTMLTextAreaElement).value).toBe(note);
    expect(doc.querySelector('[role="alert"]')?.textContent).toMatch(/signed out/);
  });
});

describe('messages from the address on the order list', () => {
  it('never lists part text that a link carries, only parts read from the fix it names', async () => {
    const planted = 'this fix was withdrawn';
    // A link made by hand, in the shape the add button once used: rows of parts as base64url JSON.
    const rows = Buffer.from(JSON.stringify([{ kind: 'other', value: planted, quantity: 1, source: planted }])).toString('base64url');
    const html = await (await fetch(`${base}/order-list?add=${rows}&from=${fix.slug}`)).text();
    expect(html.toLowerCase()).not.toContain(planted);
  });
});
