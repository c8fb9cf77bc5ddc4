// Codes typed loosely, snippets that keep whole symptoms, and words a dictionary knows, on the demo world.
import { describe, expect, it } from 'vitest';
import { db } from '@/server/core/db';
import { PostgresSearchProvider } from '@/server/search/pg-provider';
import type { SearchQuery } from '@/lib/search/query-schema';

const knex = db();
const provider = new PostgresSearchProvider(knex);
const search = (text: string, over: Partial<SearchQuery> = {}) =>
  provider.search({ text, scope: 'machine', filters: {}, page: 1, perPage: 10, ...over });
const plain = (html: string) =>
  html
    .replace(/<[^>]+>/g, '')
    .replace(/&#39;/g, "'")
    .replace(/&amp;/g, '&');

describe('error codes with or without their leading zero', () => {
  it.each(['F7', 'f-7', 'F 07', 'F-07', 'f07'])('finds F-07 for %s, and no fix that carries only another F code', async (typed) => {
    const result = await search(typed);
    expect(result.hits[0]?.slug).toBe('kl9-no-disc-f07-worn-laser');
    const codes: string[][] = await knex('fix_search')
      .whereIn(
        'fix_id',
        result.hits.map((h) => h.fixId),
      )
      .pluck('code_list');
    for (const list of codes) expect(list).toContain('f07');
  });
  it.each([
    ['H4', 'hm2-dew-lockout-h04'],
    ['h-4', 'hm2-dew-lockout-h04'],
    ['Er 7', 'qc3-er-07-mode-switch'],
    ['er7', 'qc3-er-07-mode-switch'],
  ])('finds the padded code for %s', async (typed, slug) => {
    expect((await search(typed)).hits.map((h) => h.slug)).toContain(slug);
  });
  it('never reads one code as another whose digits differ: F1 is not F-12, F-17 or F-21', async () => {
    for (const typed of ['F1', 'F2', 'E2', 'E4', 'F70', 'H40']) expect((await search(typed)).total, typed).toBe(0);
  });
});

describe('snippets keep whole symptoms', () => {
  it.each([
    ['no rewind', 'no rewind'],
    ['dvd side no disc', 'no disc'],
    ['slow start-up', 'slow start-up'],
    ["tray won't open", "tray won't open"],
  ])('shows "%s" with the whole symptom "%s"', async (query, symptom) => {
    const result = await search(query);
    const snippets = result.hits.slice(0, 3).map((h) => plain(h.snippetHtml));
    expect(
      snippets.some((s) => s.split(/ · | … |^… | …$/).includes(symptom)),
      snippets.join(' | '),
    ).toBe(true);
  });
  it('explains a match found through a word family', async () => {
    const result = await search('drawer bounces back in', { machine: 'tamberlyn-dr4120-pal' });
    const hit = result.hits.find((h) => h.slug === 'tl2-tray-opens-then-closes');
    expect(hit?.matched).toContain('drawer ≈ tray');
    expect(hit?.snippetHtml).toContain('<mark class="concept" title="matched: drawer ≈ tray">');
  });
});

describe('words and negations', () => {
  it('keeps "tray won\'t close" on tray fixes: the negation alone brings in no disc-reading fix', async () => {
    const result = await search("tray won't close");
    expect(result.hits.length).toBeGreaterThan(0);
    for (const hit of result.hits.filter((h) => h.matchedAll))
      expect(plain(`${hit.title} ${hit.snippetHtml}`)).toMatch(/tray|drawer|loader/i);
    expect(result.hits.slice(0, 3).map((h) => h.slug)).toContain('orx5-tray-will-not-close-ld-err-1');
  });
  it('never turns an English word into another: "gobbles" stays, "lace" is not "place"', async () => {
    const gobbles = await search('gobbles tape');
    expect(gobbles.corrections).toEqual([]);
    expect(
      gobbles.hits
        .slice(0, 3)
        .map((h) => h.slug)
        .some((s) => /eats-tape|chews-tape|eats-tape-on-reverse/.test(s)),
    ).toBe(true);
    const lace = await search('lace tape');
    expect(lace.corrections).toEqual([]);
  });
  it('still corrects a slip that is no English word', async () => {
    expect((await search('tary wont close')).corrections).toEqual([{ from: 'tary', to: 'tray' }]);
  });
});
