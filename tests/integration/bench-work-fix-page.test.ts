// The fix page as a technician reads it: other benches' notes and readings, each caution and reading once,
// the bench score in words, "before you start" in our own form; and textareas that show stored text exactly.
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
let author: { id: number; email: string };

const laserWords = 'Keep the pickup covered whenever the drive runs outside the case.';
const bodyWithNotes = {
  type: 'doc',
  content: [
    { type: 'caution', attrs: { kind: 'laser' }, content: [{ type: 'paragraph', content: [{ type: 'text', text: laserWords }] }] },
    { type: 'paragraph', content: [{ type: 'text', text: 'Measure the sense resistor before ordering a pickup.' }] },
    {
      type: 'reading',
      attrs: { testPoint: 'Across R612', expected: '0.35-0.50 V', measured: 'over 0.60 V', note: '' },
    },
    { type: 'paragraph', content: [{ type: 'text', text: 'Swap the pickup and run the start-up check.' }] },
  ],
};

function documentOf(html: string): Document {
  const window = new Window({ url: base });
  window.document.write(html);
  return window.document as unknown as Document;
}

const textOf = (html: string): string => (documentOf(html).querySelector('article')?.textContent ?? '').replace(/\s+/g, ' ');
const count = (haystack: string, needle: string): number => haystack.split(needle).length - 1;

beforeAll(async () => {
  world = await makeWorld(knex);
  author = await makeMember(knex);
  fix = await makeFix(knex, {
    authorId: author.id,
    machineIds: [world.machines[0]!.id],
    revisions: 2,
  });
  // A live r3 whose remedy carries a caution and a reading that the structured fields also list.
  const proofer = await knex('users').where({ email: 'moderator@example.test' }).first('id');
  const [r3] = await knex('revisions')
    .insert({
      fix_id: fix.id,
      number: 3,
      parent_revision_id: fix.revisionIds[1],
      author_id: author.id,
      title: 'Laser current over its limit at start-up',
      body: JSON.stringify(bodyWithNotes),
      symptoms: ['Error at start-up'],
      cause: 'The pickup has aged.',
      cautions: JSON.stringify([{ kind: 'laser', detail: laserWords }, { kind: 'mains' }]),
      readings: JSON.stringify([
        { testPoint: 'Across R612', expected: '0.35-0.50 V', measured: 'over 0.60 V', note: '' },
        { testPoint: 'Focus drive at CN201', expected: '1.2 V p-p', measured: '', note: '' },
      ]),
      difficulty: 'skilled',
      time_minutes: 75,
      state: 'proofed',
      proofer_id: proofer.id,
      proofed_at: new Date(),
    })
    .returning('id');
  fix.revisionIds.push(r3.id);
  await knex('fixes').where({ id: fix.id }).update({ current_revision_id: r3.id });
  // Five counted reports, all fixed, and older notes with readings; the author's own is shown, not counted.
  const reporters = await Promise.all([1, 2, 3, 4, 5].map(() => makeMember(knex)));
  const day = 86_400_000;
  await knex('bench_reports').insert(
    reporters.map((r, i) => ({
      fix_id: fix.id,
      revision_id: fix.revisionIds[2],
      machine_id: world.machines[i % world.machines.length]!.id,
      member_id: r.id,
      outcome: 'fixed',
      note:
        i === 0
          ? 'Oldest note: the sense resistor read 0.62 V before the swap.'
          : i === 4
            ? 'Newest note: pickup swapped, 0.41 V after.'
            : '',
      readings: JSON.stringify(i === 4 ? [{ testPoint: 'R612', expected: '0.35-0.50 V', measured: '0.41 V', note: '' }] : []),
      updated_at: new Date(Date.now() - (10 - i) * day),
      created_at: new Date(Date.now() - (10 - i) * day),
    })),
  );
});
afterAll(() => knex.destroy());

describe('bench reports on the fix page', () => {
  it('shows other technicians’ notes and readings, newest first, with machine, outcome and date', async () => {
    const html = await (await fetch(`${base}/fixes/${fix.slug}`)).text();
    const doc = documentOf(html);
    const items = Array.from(doc.querySelectorAll('#bench-notes-section li'));
    expect(items.length).toBe(5);
    const text = items.map((li) => li.textContent?.replace(/\s+/g, ' ') ?? '');
    expect(text[0]).toContain('Newest note: pickup swapped, 0.41 V after.');
    expect(text[0]).toContain('0.41 V');
    expect(text[0]).toMatch(/Fixed/);
    expect(items[0]!.querySelector('time')?.getAttribute('datetime')).toBeTruthy();
    expect(text[4]).toContain('Oldest note');
  });

  it('shows the member’s own report, note included, right after saving', async () => {
    // A fix of its own, so the counts the other tests read stay as they are.
    const other = await makeFix(knex, { authorId: author.id, machineIds: [world.machines[0]!.id] });
    const reporter = await makeMember(knex);
    const me = as(base, await signIn(base, reporter.email, PASSWORD));
    const saved = await me.post('/api/v1/bench-reports', {
      fix: other.slug,
      machine: world.machines[0]!.slug,
      outcome: 'partly',
      note: 'My own note, seen straight away.',
    });
    expect(saved.status).toBe(201);
    const html = await (await me.get(`/fixes/${other.slug}`)).text();
    const first = documentOf(html).querySelector('#bench-notes-section li');
    expect(first?.textContent).toContain('My own note, seen straight away.');
    expect(first?.textContent).toMatch(/your report/i);
  });
});

describe('each caution and reading once', () => {
  it('shows each caution in full once, before the remedy, and the remedy points back to it', async () => {
    const html = await (await fetch(`${base}/fixes/${fix.slug}`)).text();
    const text = textOf(html);
    expect(count(text, laserWords)).toBe(1);
    expect(count(text, 'Never look into the lens')).toBe(1);
    expect(count(text.toLowerCase(), 'follow your local electrical codes and licensed practice')).toBe(1);
    expect(text.indexOf(laserWords)).toBeLessThan(text.indexOf('Measure the sense resistor'));
    const doc = documentOf(html);
    expect(doc.querySelector('.prose-fix a[href="#caution-laser"]')).not.toBeNull();
    expect(doc.getElementById('caution-laser')).not.toBeNull();
  });

  it('shows a reading the remedy already gives once, and the other readings in the table', async () => {
    const text = textOf(await (await fetch(`${base}/fixes/${fix.slug}`)).text());
    expect(count(text, 'Across R612')).toBe(1);
    expect(count(text, 'Focus drive at CN201')).toBe(1);
  });
});

describe('bench score and before you start', () => {
  it('tells the bench score in words beside the number, without a rating out of 100', async () => {
    const html = await (await fetch(`${base}/fixes/${fix.slug}`)).text();
    const text = textOf(html);
    expect(text).toMatch(/5 of 5 technicians fixed it; few reports so far/);
    expect(text).not.toMatch(/\/100|out of 100/);
  });

  it('names skills, tools and bench time before you start, with the cautions, not a difficulty and time row', async () => {
    const html = await (await fetch(`${base}/fixes/${fix.slug}`)).text();
    const doc = documentOf(html);
    const block = doc.querySelector('section[aria-labelledby="before-you-start"]');
    expect(block?.textContent).toMatch(/Skills/);
    expect(block?.textContent).toMatch(/Soldering/);
    expect(block?.textContent).toMatch(/about 75 minutes/);
    expect(block?.querySelector('#caution-laser')).not.toBeNull();
    expect(textOf(html)).not.toMatch(/Difficulty/);
  });
});

describe('server-rendered textareas', () => {
  it('show stored text exactly, without the template’s indentation, and a save adds no whitespace', async () => {
    const owner = await makeMember(knex);
    const cookie = await signIn(base, owner.email, PASSWORD);
    const me = as(base, cookie);
    const findings = 'Belt slipping.\n  Idler tyre glazed, measured 0.2 mm flat.\nReplaced both.';
    const created = await me.post('/api/v1/job-sheets', { customerRef: 'Textarea test', findings });
    const id = (await created.json()).jobSheet.id;
    const page = await (await me.get(`/jobs/${id}`)).text();
    const textarea = documentOf(page).querySelector('textarea[name="findings"]') as HTMLTextAreaElement;
    expect(textarea.value).toBe(findings);
    // The form sent back unchanged keeps the text unchanged.
    const form = textarea.closest('form')!;
    const body = new URLSearchParams();
    for (const control of Array.from(form.querySelectorAll('input, select, textarea')) as HTMLInputElement[]) {
      if (!control.name) continue;
      if ((control.type === 'radio' || control.type === 'checkbox') && !control.checked) continue;
      body.append(control.name, control.value);
    }
    const saved = await me.form(form.getAttribute('action')!, [...body.entries()]);
    expect(saved.status).toBe(303);
    expect((await knex('job_sheets').where({ id }).first('findings')).findings).toBe(findings);
  });
});
