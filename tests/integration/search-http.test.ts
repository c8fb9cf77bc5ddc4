// Search through the built server: the page without JavaScript, the JSON endpoints, wanted fixes and word families.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, postForm, signIn, uniqueClientIp } from '../support/sign-in';
import { scriptsBesideRegistration } from '../support/scripts';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
const letters = () => [...String(Date.now() % 1_000_000)].map((d) => 'bcdfghjklm'[Number(d)]).join('');

async function page(path: string, cookie?: string): Promise<{ status: number; html: string; headers: Headers }> {
  const res = await fetch(`${base}${path}`, { redirect: 'manual', headers: cookie ? { cookie } : {} });
  return { status: res.status, html: await res.text(), headers: res.headers };
}
async function api(path: string): Promise<{ status: number; body: any }> {
  const res = await fetch(`${base}${path}`);
  return { status: res.status, body: await res.json() };
}

let editorCookie: string;
let memberCookie: string;
beforeAll(async () => {
  const editor = await createUser(knex, { role: 'editor', tag: 'search-editor' });
  editorCookie = await signIn(base, editor.email, editor.password);
  const member = await createUser(knex, { tag: 'search-member' });
  memberCookie = await signIn(base, member.email, member.password);
});
afterAll(() => knex.destroy());

describe('the search page', () => {
  it('answers a misspelt query with results from a plain GET, rendered on the server', async () => {
    const { status, html } = await page('/search?q=tary+wont+close');
    expect(status).toBe(200);
    expect(html).toContain('href="/fixes/orx5-tray-will-not-close-ld-err-1"');
    expect(html).toContain('Searched for <strong>tray</strong>');
    expect(html).toMatch(/<form[^>]*method="get"[^>]*action="\/search"/);
    // The island's input is rendered on the server too, so the form works with JavaScript off.
    expect(html).toMatch(/<input[^>]*name="q"[^>]*value="tary wont close"/);
    expect(html).toContain('<mark>Tray</mark>');
    expect(html).toMatch(/Bench score [01]\.\d\d from \d+ bench reports?<\/span>/);
  });

  it('shows facets as links that narrow the search, keeping the query', async () => {
    const { html } = await page('/search?q=no+disc');
    // Astro writes & in attributes as &#38;.
    expect(html).toMatch(/href="\/search\?q=no\+disc&(amp|#38);maker=[a-z-]+"/);
    expect(html).toMatch(/href="\/search\?q=no\+disc&(amp|#38);caution=laser"/);
    const narrowed = await page('/search?q=no+disc&caution=laser');
    expect(narrowed.html).toContain('Remove the filter Laser radiation');
  });

  it('keeps the named machine and offers its family and every machine', async () => {
    const { html } = await page('/search?q=tray&machine=tamberlyn-dr4120-pal');
    expect(html).toContain('Tamberlyn DR-4120 (PAL)');
    expect(html).toContain('<input type="hidden" name="machine" value="tamberlyn-dr4120-pal"');
    expect(html).toContain('scope=family');
    expect(html).toContain('scope=all');
  });

  it('when nothing matches, suggests wider searches, writing the fault up, and counts the miss', async () => {
    const words = `wobbulating ${letters()} fizzgig`;
    const path = `/search?q=${encodeURIComponent(words)}&machine=tamberlyn-dr4120-pal`;
    const { status, html } = await page(path);
    expect(status).toBe(200);
    expect(html).toContain('No fix matches this search');
    expect(html).toContain('Search the whole TL-2 DVD recorder loader platform family');
    expect(html).toContain('Search every machine');
    expect(html).toContain(`href="/write?symptom=${encodeURIComponent(words).replace(/%20/g, '+')}&#38;machine=tamberlyn-dr4120-pal"`);
    await page(path);
    const miss = await knex('search_misses as sm')
      .join('machines as m', 'm.id', 'sm.machine_id')
      .where('sm.query_norm', words)
      .first('sm.count', 'm.slug');
    expect(miss).toEqual({ count: 2, slug: 'tamberlyn-dr4120-pal' });
  });

  it('never stores an e-mail address or phone number from a query that found nothing', async () => {
    const marker = `glorbix${letters()}`;
    // The address and the number are made of nothing any fix could hold, so the search finds nothing at all.
    await page(`/search?q=${encodeURIComponent(`${marker} ${marker}@${marker}.zzq 0712 345 678`)}`);
    const row = await knex('search_misses').where('query_norm', 'like', `${marker}%`).first('query_norm', 'query_text');
    expect(row).toEqual({ query_norm: marker, query_text: marker });
  });

  it('answers bad parameters with 400 and an unknown machine with 404, each with a message', async () => {
    const bad = await page('/search?q=tray&page=0');
    expect(bad.status).toBe(400);
    expect(bad.html).toContain('role="alert"');
    const unknown = await page('/search?q=tray&machine=no-such-machine');
    expect(unknown.status).toBe(404);
    expect(unknown.html).toContain('There is no machine');
  });

  it('is the only page with the search island: reading pages stay free of scripts', async () => {
    expect((await page('/search?q=belt')).html).toMatch(/<script|astro-island/);
    expect(scriptsBesideRegistration((await page('/machines/tamberlyn-dr4120-pal')).html)).toEqual([]);
  });
});

describe('GET /api/v1/search', () => {
  it('answers a code with its fix, the counts, facets and highlights', async () => {
    const { status, body } = await api('/api/v1/search?q=E-21&perPage=5');
    expect(status).toBe(200);
    expect(body.provider).toBe('postgres');
    expect(body.hits[0]).toMatchObject({ slug: 'tl2-tray-will-not-open-e21', benchScore: { reports: expect.any(Number) } });
    expect(body).toMatchObject({
      total: expect.any(Number),
      page: 1,
      perPage: 5,
      facets: expect.objectContaining({ maker: expect.any(Array) }),
    });
  });

  it('answers bad parameters with 400 in the one error shape, naming the fields', async () => {
    const { status, body } = await api('/api/v1/search?q=tray&perPage=999&deviceType=toaster');
    expect(status).toBe(400);
    expect(body.error.code).toBe('bad_request');
    expect(Object.keys(body.error.fields).sort()).toEqual(['deviceType', 'perPage']);
  });

  it('answers an unknown machine with 404', async () => {
    const { status, body } = await api('/api/v1/search?q=tray&machine=no-such-machine');
    expect(status).toBe(404);
    expect(body.error.code).toBe('not_found');
  });

  it('does not count misses: typing passes through half-words', async () => {
    const marker = `zwibble${letters()}`;
    await api(`/api/v1/search?q=${marker}`);
    expect(await knex('search_misses').where({ query_norm: marker }).first()).toBeUndefined();
  });
});

describe('GET /api/v1/search/similar', () => {
  it('answers fixes that look like the symptom, for the machine or its family, in the documented shape', async () => {
    const { status, body } = await api('/api/v1/search/similar?symptom=tray+will+not+open&machine=tamberlyn-dr4120k-pal');
    expect(status).toBe(200);
    expect(body.machine).toEqual({
      slug: 'tamberlyn-dr4120k-pal',
      label: 'Tamberlyn DR-4120K (PAL)',
      chassis: { slug: 'tamberlyn-tl2-loader', name: 'TL-2 DVD recorder loader platform' },
    });
    expect(body.chassis).toBeNull();
    expect(body.items[0]).toEqual({
      slug: 'tl2-tray-will-not-open-e21',
      title: 'Tray will not open, display shows E-21',
      symptoms: expect.arrayContaining(["tray won't open"]),
      machines: expect.arrayContaining(['Tamberlyn DR-4120K (PAL)']),
      sameMachine: true,
      likeness: expect.any(Number),
      benchScore: { score: expect.any(Number), reports: expect.any(Number) },
    });
  });

  it('asks for the symptom and a known machine', async () => {
    const missing = await api('/api/v1/search/similar?machine=tamberlyn-dr4120k-pal');
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toEqual(['symptom']);
    expect((await api('/api/v1/search/similar?symptom=tray&machine=no-such-machine')).status).toBe(404);
  });

  it('answers for a chassis family on its own, as a family-wide fix is written', async () => {
    const { status, body } = await api('/api/v1/search/similar?symptom=tray+will+not+open&chassis=tamberlyn-tl2-loader');
    expect(status).toBe(200);
    expect(body.machine).toBeNull();
    expect(body.chassis).toEqual({ slug: 'tamberlyn-tl2-loader', name: 'TL-2 DVD recorder loader platform' });
    expect(body.items[0]).toMatchObject({ slug: 'tl2-tray-will-not-open-e21', sameMachine: false });
    expect((await api('/api/v1/search/similar?symptom=tray&chassis=no-such-family')).status).toBe(404);
  });

  it('asks for exactly one of a machine and a chassis family', async () => {
    for (const target of ['', '&machine=tamberlyn-dr4120k-pal&chassis=tamberlyn-tl2-loader']) {
      const { status, body } = await api(`/api/v1/search/similar?symptom=tray${target}`);
      expect(status).toBe(400);
      expect(Object.keys(body.error.fields)).toEqual(['machine']);
    }
  });
});

describe('wanted fixes', () => {
  it('lists the misses, most asked first, for editors only', async () => {
    const marker = `snorkwhistle${letters()}`;
    for (let i = 0; i < 3; i++) await page(`/search?q=${marker}`);
    const { status, html } = await page('/admin/wanted-fixes', editorCookie);
    expect(status).toBe(200);
    expect(html).toContain(marker);
    expect(html).toContain(`href="/write?symptom=${marker}"`);
    expect((await page('/admin/wanted-fixes', memberCookie)).status).toBe(403);
    const anonymous = await page('/admin/wanted-fixes');
    expect(anonymous.status).toBe(302);
    expect(anonymous.headers.get('location')).toContain('/sign-in');
  });
});

describe('word families', () => {
  const form = (fields: Record<string, string>, cookie = editorCookie) =>
    postForm(base, '/admin/word-families?_action=wordFamily', fields, { cookie, ip: uniqueClientIp() });
  const made: number[] = [];
  afterAll(async () => {
    if (made.length) await knex('word_families').whereIn('id', made).delete();
  });

  it('lists the seeded families to editors and refuses members', async () => {
    const { status, html } = await page('/admin/word-families', editorCookie);
    expect(status).toBe(200);
    expect((html.match(/name="intent" value="update"/g) ?? []).length).toBeGreaterThanOrEqual(30);
    expect((await page('/admin/word-families', memberCookie)).status).toBe(403);
    expect((await form({ intent: 'create', name: 'x', terms: 'a\nb' }, memberCookie)).status).toBe(403);
  });

  it('adds, edits, retires and restores a family; searches follow each change and the audit log keeps before and after', async () => {
    const word = `grumbleflap${letters()}`;
    const name = `test family ${word}`;
    const created = await form({ intent: 'create', name, terms: `${word}\nspindle motor` });
    expect(created.status).toBe(303);
    const family = await knex('word_families').where({ name }).first('id');
    made.push(family.id);
    const search = async () => (await api(`/api/v1/search?q=${word}`)).body;
    expect((await search()).hits.map((h: any) => h.slug)).toContain('kd560-spindle-noisy-f12');

    expect((await form({ intent: 'update', id: String(family.id), name, terms: `${word}\nfishy smell` })).status).toBe(303);
    expect((await search()).hits.map((h: any) => h.slug)).toContain('hc85h-no-power-leaking-capacitors');

    expect((await form({ intent: 'retire', id: String(family.id) })).status).toBe(303);
    expect((await search()).total).toBe(0);
    expect((await form({ intent: 'restore', id: String(family.id) })).status).toBe(303);
    expect((await search()).total).toBeGreaterThan(0);

    const audit = await knex('audit_log')
      .where({ subject_type: 'word_family', subject_id: String(family.id) })
      .orderBy('id')
      .select('action', 'detail', 'actor_id');
    expect(audit.map((a) => a.action)).toEqual(['word_family.create', 'word_family.update', 'word_family.retire', 'word_family.restore']);
    expect(audit[1].detail).toEqual({
      before: { name, terms: [word, 'spindle motor'], retired: false },
      after: { name, terms: [word, 'fishy smell'], retired: false },
    });
    expect(audit[2].detail.after.retired).toBe(true);
    expect(audit.every((a) => a.actor_id !== null)).toBe(true);
  });

  it('shows what was wrong with a family that cannot be saved', async () => {
    const res = await form({ intent: 'create', name: 'tray', terms: 'only one' });
    expect(res.status).toBe(400);
    const html = await res.text();
    expect(html).toContain('A family needs at least two terms');
    const taken = await form({ intent: 'create', name: 'tray', terms: 'tray\ndrawer' });
    expect(taken.status).toBe(400);
    expect(await taken.text()).toContain('Another family already has that name.');
  });
});
