// The PostgreSQL search provider on the demo world: codes, corrections, filters, facets, scope, order, paging, upkeep.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/server/core/db';
import { PostgresSearchProvider } from '@/server/search/pg-provider';
import { recordSearchMiss, listWantedFixes } from '@/server/search/misses';
import { nearMatches } from '@/server/search/near-matches';
import { similarFixes } from '@/server/search/similar';
import { findNamedChassis, findNamedMachine } from '@/server/search/context';
import type { SearchQuery } from '@/lib/search/query-schema';
import type { SearchResult } from '@/lib/search/result-types';

const knex = db();
const provider = new PostgresSearchProvider(knex);
const ask = (over: Partial<SearchQuery>): SearchQuery => ({ text: '', scope: 'machine', filters: {}, page: 1, perPage: 10, ...over });
const search = (over: Partial<SearchQuery>): Promise<SearchResult> => provider.search(ask(over));

/** Fix ids of the hits whose live row matches a raw condition on fix_search. */
async function idsWhere(result: SearchResult, condition: string, bindings: unknown[] = []): Promise<number[]> {
  const ids = result.hits.map((h) => h.fixId);
  if (ids.length === 0) return [];
  return knex('fix_search')
    .whereIn('fix_id', ids)
    .whereRaw(condition, bindings as never[])
    .pluck('fix_id');
}

describe('codes', () => {
  it('finds a model number however it is typed', async () => {
    for (const typed of ['KT-44', 'kt44', 'KT 44', 'kt.44']) {
      const result = await search({ text: typed });
      expect(
        result.hits.map((h) => h.slug),
        typed,
      ).toContain('kt44-play-stops-idler-tyre');
    }
  });

  it('never matches a neighbour whose digits differ', async () => {
    for (const typed of ['KT-45', 'TD-551', 'DR-4121', 'E-22', 'LD ERR 4']) {
      expect((await search({ text: typed })).total, typed).toBe(0);
    }
  });

  it('keeps every hit of a model search on that model or its suffix variants', async () => {
    const result = await search({ text: 'DR 4120' });
    expect(result.total).toBeGreaterThan(0);
    const off = await idsWhere(result, `NOT (code_list && ARRAY['dr4120', 'dr4120k'])`);
    expect(off).toEqual([]);
  });

  it('ranks a full match of code and words above fixes that have only the code', async () => {
    const result = await search({ text: 'e21 tray' });
    expect(result.hits[0]?.slug).toBe('tl2-tray-will-not-open-e21');
    expect(result.hits[0]?.matchedAll).toBe(true);
  });
});

describe('words', () => {
  it('corrects a misspelt word and then applies its word family', async () => {
    const result = await search({ text: 'drawr opens then closes' });
    expect(result.corrections).toEqual([{ from: 'drawr', to: 'drawer' }]);
    // "drawer" is in the tray family, so tray fixes come up too.
    expect(result.hits.slice(0, 3).map((h) => h.slug)).toEqual(
      expect.arrayContaining(['tl2-tray-opens-then-closes', 'kl9-drawer-opens-then-closes']),
    );
  });

  it('leaves out an unknown first word and returns what the other words find', async () => {
    const result = await search({ text: 'qwxyzv rewind' });
    expect(result.ignored).toEqual(['qwxyzv']);
    expect(result.hits.map((h) => h.slug)).toContain('qm7-no-rewind-glazed-idler');
  });

  it('leaves out fixes with an excluded word', async () => {
    const result = await search({ text: 'tray -disc' });
    expect(result.total).toBeGreaterThan(0);
    expect(await idsWhere(result, `document @@ to_tsquery('english', 'disc')`)).toEqual([]);
  });

  it('answers a query of stop words only with nothing rather than everything', async () => {
    expect((await search({ text: 'the and of' })).total).toBe(0);
  });

  it('highlights matched words, family terms included, and escapes everything else', async () => {
    const result = await search({ text: 'drawer' });
    const hit = result.hits.find((h) => h.slug === 'tl2-tray-opens-then-closes');
    expect(hit?.titleHtml).toBe('<mark>Tray</mark> opens then closes again by itself');
    expect(hit?.snippetHtml).toContain('won&#39;t');
  });
});

describe('filters and facets', () => {
  it('keeps only fixes with the filter, for each kind of filter', async () => {
    const cd = await search({ text: 'skips', filters: { deviceType: 'cd_player' } });
    expect(cd.total).toBeGreaterThan(0);
    expect(await idsWhere(cd, `NOT (device_types @> ARRAY['cd_player'])`)).toEqual([]);
    const laser = await search({ text: 'no disc', filters: { caution: 'laser' } });
    expect(await idsWhere(laser, `NOT (caution_kinds @> ARRAY['laser'])`)).toEqual([]);
    const photos = await search({ text: 'tray', filters: { hasPhotos: true } });
    expect(photos.hits.length).toBeGreaterThan(0);
    expect(photos.hits.every((h) => h.thumbnail !== null)).toBe(true);
    const maker = await search({ text: 'tray', filters: { maker: 'kestrune' } });
    expect(maker.hits.every((h) => h.machines.some((m) => m.label.startsWith('Kestrune')))).toBe(true);
  });

  it('counts facets over the full matches, agreeing with the filtered searches', async () => {
    const all = await search({ text: 'belt' });
    // Counted to the end (not a broad query's sample), so the counts must agree exactly.
    expect(all.totalIsLowerBound).toBe(false);
    expect(all.facetsFromSample).toBe(false);
    expect(all.facets.maker.length).toBeGreaterThan(1);
    for (const facet of all.facets.maker) {
      const narrowed = await search({ text: 'belt', filters: { maker: facet.value } });
      expect(narrowed.totalMatchingAll, facet.value).toBe(facet.count);
    }
  });

  it('says when a broad query was counted only so far and its facets come from its best matches', async () => {
    const broad = await search({ text: 'remove' });
    expect(broad.totalIsLowerBound).toBe(true);
    expect(broad.facetsFromSample).toBe(true);
    expect(broad.total).toBeGreaterThanOrEqual(30);
  });

  it('finds nothing for a maker that does not exist, rather than ignoring the filter', async () => {
    expect((await search({ text: 'tray', filters: { maker: 'no-such-maker' } })).total).toBe(0);
  });
});

describe('the named machine', () => {
  const machine = 'tamberlyn-dr4120-pal';

  it('searches the machine and its family-wide fixes by default, the family or everything when asked', async () => {
    const own = await search({ text: 'tray', machine });
    const family = await search({ text: 'tray', machine, scope: 'family' });
    const everything = await search({ text: 'tray', machine, scope: 'all' });
    expect(own.hits.length).toBeGreaterThan(0);
    expect(own.machine?.chassis?.slug).toBe('tamberlyn-tl2-loader');
    expect(own.total).toBeLessThanOrEqual(family.total);
    expect(family.total).toBeLessThan(everything.total);
    expect(own.hits.every((h) => h.proximity >= 2)).toBe(true);
  });

  it('orders nearest first among hits that match equally: same machine, then family, then maker, then others', async () => {
    const result = await search({ text: 'tray', machine, scope: 'all', perPage: 50 });
    const full = result.hits.filter((h) => h.matchedAll);
    expect(full[0]?.proximity).toBe(3);
    expect(full.some((h) => h.proximity === 0)).toBe(true);
  });

  it('lists the machine’s fixes when only the machine is given', async () => {
    const result = await search({ machine });
    expect(result.hits.map((h) => h.slug)).toContain('tl2-tray-will-not-open-e21');
  });

  it('answers an unknown machine with nothing', async () => {
    expect((await search({ text: 'tray', machine: 'no-such-machine' })).total).toBe(0);
  });
});

describe('order and paging', () => {
  it('gives the same order every time, and pages that do not overlap', async () => {
    const first = await search({ text: 'capacitor', perPage: 5 });
    const again = await search({ text: 'capacitor', perPage: 5 });
    const second = await search({ text: 'capacitor', perPage: 5, page: 2 });
    expect(again.hits.map((h) => h.slug)).toEqual(first.hits.map((h) => h.slug));
    expect(first.hits).toHaveLength(5);
    expect(second.hits.length).toBeGreaterThan(0);
    expect(second.hits.filter((h) => first.hits.some((f) => f.slug === h.slug))).toEqual([]);
    expect(first.pageCount).toBe(Math.ceil(first.total / 5));
  });

  it('shows the bench score with its report count on every hit', async () => {
    const result = await search({ text: 'belt' });
    for (const hit of result.hits) {
      const row = await knex('fix_search').where({ fix_id: hit.fixId }).first('bench_score', 'report_count');
      expect(hit.benchScore).toEqual({ score: row.bench_score, reports: row.report_count });
    }
  });
});

describe('keeping the index current', () => {
  let fixId: number;
  // Letters only: a word with digits would be read as a code.
  const word = `quarvel${[...String(Date.now() % 100000)].map((d) => 'abcdefghij'[Number(d)]).join('')}`;

  beforeAll(async () => {
    const author = await knex('users').where({ email: 'member@example.test' }).first('id');
    const proofer = await knex('users').where({ email: 'moderator@example.test' }).first('id');
    const machine = await knex('machines').where({ slug: 'brindlecote-bcd15-multi' }).first('id');
    const [fix] = await knex('fixes')
      .insert({ slug: `search-upkeep-${Date.now()}`, created_by: author.id })
      .returning('id');
    fixId = fix.id;
    const [revision] = await knex('revisions')
      .insert({
        fix_id: fixId,
        number: 1,
        author_id: author.id,
        title: `<script>alert(1)</script> ${word} display`,
        body: JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'A test remedy.' }] }] }),
        symptoms: [`${word} on the display`],
        error_codes: ['ZQ-907'],
        state: 'proofed',
        proofer_id: proofer.id,
        submitted_at: new Date(),
        proofed_at: new Date(),
      })
      .returning('id');
    await knex('fixes').where({ id: fixId }).update({ current_revision_id: revision.id });
    await knex('fix_machines').insert({ fix_id: fixId, machine_id: machine.id });
  });
  afterAll(async () => {
    if (!fixId) return;
    await knex('fixes').where({ id: fixId }).update({ current_revision_id: null });
    await knex('fixes').where({ id: fixId }).delete();
    await knex('search_words').where({ word }).delete();
    await knex('search_codes').where({ code: 'zq907' }).delete();
  });

  it('finds a newly proofed fix by its words and its new error code, with hostile text escaped', async () => {
    await provider.index(fixId);
    const byWord = await search({ text: word });
    expect(byWord.hits.map((h) => h.fixId)).toEqual([fixId]);
    expect(byWord.hits[0]?.titleHtml).toContain('&lt;script&gt;');
    expect(byWord.hits[0]?.titleHtml.replace(/<\/?mark>/g, '')).not.toMatch(/<|>/);
    expect((await search({ text: 'zq 907' })).hits.map((h) => h.fixId)).toEqual([fixId]);
    // One slip in a long word is corrected to the new word.
    expect((await search({ text: word.replace('quar', 'qaur') })).hits.map((h) => h.fixId)).toEqual([fixId]);
    expect((await search({ text: word.replace('quar', 'qaur') })).corrections).toEqual([{ from: word.replace('quar', 'qaur'), to: word }]);
  });

  it('forgets a fix once it is removed', async () => {
    await provider.remove(fixId);
    expect((await search({ text: word })).total).toBe(0);
  });
});

describe('misses, near matches and similar fixes', () => {
  it('counts a search that found nothing by its folded words and machine only', async () => {
    const text = `Frobnicating Widget ${[...String(Date.now() % 100000)].map((d) => 'abcdefghij'[Number(d)]).join('')}`;
    const machine = await findNamedMachine(knex, 'kestrune-kd560-pal');
    await recordSearchMiss(knex, text, machine!.id);
    await recordSearchMiss(knex, `  ${text.toUpperCase()}!! `, machine!.id);
    const row = await knex('search_misses').where({ query_norm: text.toLowerCase() }).first();
    expect(row).toMatchObject({ count: 2, machine_id: machine!.id, query_text: text.toLowerCase() });
    const { items } = await listWantedFixes(knex, { limit: 500, offset: 0 });
    const counts = items.map((i) => i.count);
    expect([...counts].sort((a, b) => b - a)).toEqual(counts);
    expect(items.find((i) => i.query === text.toLowerCase())?.machine?.slug).toBe('kestrune-kd560-pal');
    await knex('search_misses').where({ id: row.id }).delete();
  });

  it('offers fixes with similar titles when nothing matched', async () => {
    const near = await nearMatches(knex, 'tray wont opn', null);
    expect(near.length).toBeGreaterThan(0);
    expect(near.every((n) => /tray/i.test(n.title))).toBe(true);
  });

  it('warns of existing fixes that look like a symptom being written up, for the machine or its family', async () => {
    const machine = await findNamedMachine(knex, 'tamberlyn-dr4120k-pal');
    const similar = await similarFixes(knex, 'tray will not open', machine!);
    expect(similar[0]?.slug).toBe('tl2-tray-will-not-open-e21');
    expect(similar[0]?.sameMachine).toBe(true);
    expect(similar.every((s) => s.likeness >= 0.5 && s.likeness <= 1)).toBe(true);
    const other = await findNamedMachine(knex, 'brindlecote-td550-multi');
    expect((await similarFixes(knex, 'tray will not open', other!)).map((s) => s.slug)).not.toContain('tl2-tray-will-not-open-e21');
  });

  it('warns of fixes anywhere in a chassis family when the fix being written names only the family', async () => {
    const family = await findNamedChassis(knex, 'tamberlyn-tl2-loader');
    const similar = await similarFixes(knex, 'tray will not open', family!);
    expect(similar[0]?.slug).toBe('tl2-tray-will-not-open-e21');
    expect(similar.every((s) => !s.sameMachine)).toBe(true);
    const elsewhere = await knex('chassis_families').whereNot({ slug: 'tamberlyn-tl2-loader' }).orderBy('id').first('slug');
    const otherFamily = await findNamedChassis(knex, elsewhere.slug);
    expect((await similarFixes(knex, 'tray will not open', otherFamily!)).map((s) => s.slug)).not.toContain('tl2-tray-will-not-open-e21');
  });
});
