// The JavaScript budget, read from the built assets: for each page, the scripts its HTML (as the built server sends
// it) asks for and everything they import, gzipped. Reading pages ship none; the search box stays small and free of
// full zod; the writing page paints with at most 120 KB and loads the editor afterwards.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { closeDb } from '@/server/core/db';
import { createHandoverNote } from '@/server/bench-work/handover-notes';
import { handoverNoteInputSchema } from '@/lib/schemas/handover-note';
import { client } from '../support/http';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { createUser, signIn } from '../support/sign-in';
import { hasFullZod, kb, scriptCost } from '../support/js-budget';
import { withoutJsonLd } from '../support/scripts';

const site = client(INTEGRATION_PORT);
const knex = testDb();
const KB = 1024;
/** The budgets of issue 13, in gzipped bytes. */
const budget = { searchIsland: 40 * KB, writingFirstPaint: 120 * KB };
/**
 * The one script every page carries: the service worker's registration (the offline issue's installable app), a
 * module that loads "Keep for the bench", the bench view and sign-out's cache clearing only when used. Reading pages
 * may carry it and nothing else, within this budget.
 */
const registrationBudget = { firstPaint: 2 * KB, later: 6 * KB };
const registrationTag = /<script type="module" src="\/_astro\/BaseLayout\.astro_astro_type_script_index_0_lang\.[\w-]+\.js"><\/script>/g;

let scriptFreePages: string[] = [];
let memberCookie = '';

async function html(path: string, cookie?: string): Promise<string> {
  const response = await site.get(path, cookie ? { headers: { cookie } } : {});
  expect(response.status, `${path} answered ${response.status}`).toBe(200);
  return response.text();
}

beforeAll(async () => {
  const fix = await knex('fixes as f')
    .join('revisions as r', 'r.id', 'f.current_revision_id')
    .whereNotNull('f.current_revision_id')
    .first<{ slug: string; number: number }>('f.slug', 'r.number');
  const machine = await knex('machines').first<{ slug: string }>('slug');
  const chassis = await knex('chassis_families').first<{ slug: string }>('slug');
  const maker = await knex('makers').first<{ slug: string }>('slug');
  if (!fix || !machine || !chassis || !maker) throw new Error('The demo world has no fix, machine, chassis family or maker');
  const member = await createUser(knex, { tag: 'budget' });
  const note = await createHandoverNote({ id: member.id, shopName: null }, handoverNoteInputSchema.parse({ fix: fix.slug }));
  if (!note.ok) throw new Error(note.message);
  memberCookie = await signIn(site.base, member.email, member.password);
  scriptFreePages = [
    '/',
    `/fixes/${fix.slug}`,
    `/fixes/${fix.slug}/r/${fix.number}`,
    `/fixes/${fix.slug}/history`,
    `/machines/${machine.slug}`,
    `/chassis/${chassis.slug}`,
    `/makers/${maker.slug}`,
    '/machines',
    '/makers',
    '/help',
    '/help/working-safely',
    `/n/${note.code}`,
    '/tools',
  ];
});
afterAll(async () => {
  await knex.destroy();
  await closeDb();
});

describe('the JavaScript budget', () => {
  it('ships no script but the service worker registration on reading pages, help, the hand-over note and the tools index', async () => {
    const heavy: string[] = [];
    for (const path of scriptFreePages) {
      const page = await html(path);
      expect(page.match(registrationTag)?.length ?? 0, `${path} carries the registration once`).toBe(1);
      const cost = scriptCost(withoutJsonLd(page).replace(registrationTag, ''));
      if (cost.firstPaint + cost.later > 0) heavy.push(`${path}: ${kb(cost.firstPaint + cost.later)} (${cost.files.join(', ')})`);
    }
    expect(heavy).toEqual([]);
  });

  it('keeps the service worker registration small, loading its bench tools only when used', async () => {
    const page = await html(scriptFreePages[1]!);
    const registration = scriptCost((page.match(registrationTag) ?? []).join(''));
    expect(registration.files.length).toBeGreaterThan(0);
    expect(registration.firstPaint, `registration: ${registration.files.join(', ')}`).toBeLessThanOrEqual(registrationBudget.firstPaint);
    expect(registration.later, `loaded on use: ${registration.lateFiles.join(', ')}`).toBeLessThanOrEqual(registrationBudget.later);
  });

  it('keeps the search box within 40 KB gzipped with everything it loads, and without full zod', async () => {
    const cost = scriptCost(await html('/search?q=belt'));
    expect(cost.files.length, 'the search page loads its box script').toBeGreaterThan(0);
    expect(cost.firstPaint + cost.later, `search page: ${cost.files.join(', ')}`).toBeLessThanOrEqual(budget.searchIsland);
    expect(hasFullZod(cost.text), 'full zod in the search box (use zod/mini or plain checks)').toBe(false);
  });

  it('paints the writing page with at most 120 KB gzipped and loads the editor after', async () => {
    const cost = scriptCost(await html('/write', memberCookie));
    expect(cost.firstPaint, `first paint: ${cost.files.join(', ')}`).toBeLessThanOrEqual(budget.writingFirstPaint);
    // Tiptap (ProseMirror) and the zod check arrive later: the later part holds the editor's module.
    expect(
      cost.lateFiles.some((f) => /BodyEditor/.test(f)),
      `later: ${cost.lateFiles.join(', ')}`,
    ).toBe(true);
    expect(cost.files.some((f) => /BodyEditor/.test(f))).toBe(false);
    expect(hasFullZod(cost.firstText), 'full zod before the first paint').toBe(false);
  });

  it('recognises full zod in a bundle, so the search box check above can fail', () => {
    // Checked on a page that does load it: the account forms run the server's own zod 4 schemas.
    return html('/sign-in').then((page) => expect(hasFullZod(scriptCost(page).text)).toBe(true));
  });
});
