// The Meilisearch adapter against a local fake of its HTTP API: settings, documents, requests, escaping, the sync queue.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/server/core/db';
import { MeiliIndex } from '@/server/search/meili/index-client';
import { MeiliSearchProvider } from '@/server/search/meili/meili-provider';
import { buildFilter } from '@/server/search/meili/filter';
import { reindexMeili } from '@/server/search/reindex';
import { refreshFixSearchRow } from '@/server/search/fix-search-row';
import { sendSearchSync } from '@/server/search/sync-queue';
import { startSearchSyncWorker, type SyncWorker } from '@/server/search/sync-worker';
import type { SearchQuery } from '@/lib/search/query-schema';
import { startFakeMeili, type FakeMeili } from '../support/fake-meili';
import { testConnectionString } from '../support/db';

const KEY = 'adapter-test-key';
const INDEX = 'fixes_adapter';
const knex = db();
let fake: FakeMeili;
let meili: MeiliIndex;
let provider: MeiliSearchProvider;

const ask = (over: Partial<SearchQuery>): SearchQuery => ({ text: '', scope: 'machine', filters: {}, page: 1, perPage: 10, ...over });
const searchRequests = () => fake.requests.filter((r) => r.method === 'POST' && r.path === `/indexes/${INDEX}/search`);

beforeAll(async () => {
  fake = await startFakeMeili(KEY);
  meili = new MeiliIndex({ url: fake.url, key: KEY, index: INDEX });
  await reindexMeili(knex, meili);
  provider = new MeiliSearchProvider(knex, meili);
});
afterAll(async () => {
  await fake?.stop();
});

describe('index settings and documents', () => {
  it('sets searchable, filterable and sortable attributes, our ranking rules, and synonyms from word families', () => {
    const settings = fake.indexes.get(INDEX)!.settings as Record<string, any>;
    expect(settings.filterableAttributes).toEqual(
      expect.arrayContaining(['makers', 'machines', 'chassis', 'deviceTypes', 'formats', 'cautions', 'hasPhotos']),
    );
    expect(settings.rankingRules).toEqual(['words', 'typo', 'proximity', 'attribute', 'exactness', 'benchRank:desc']);
    expect(settings.typoTolerance.disableOnAttributes).toEqual(['codes']);
    // The demo world's "tray" family (src/server/seed/demo/word-families.ts).
    expect(settings.synonyms.tray).toEqual(expect.arrayContaining(['drawer', 'loader']));
    expect(settings.synonyms.drawer).toContain('tray');
  });

  it('holds one document per live fix, with the same content PostgreSQL searches', async () => {
    const live = await knex('fix_search').count<{ n: string }[]>('* as n').first();
    const docs = [...fake.indexes.get(INDEX)!.docs.values()];
    expect(docs).toHaveLength(Number(live?.n));
    const e21 = docs.find((d) => d.slug === 'tl2-tray-will-not-open-e21')!;
    expect(e21).toMatchObject({
      codes: expect.arrayContaining(['e21', 'dr4120', 'tl2']),
      makers: ['tamberlyn'],
      familyChassis: ['tamberlyn-tl2-loader'],
    });
    expect(e21.machines).toContain('tamberlyn-dr4120-pal');
  });

  it('rebuilds beside the live index and swaps, leaving no building index behind', () => {
    expect(fake.requests.some((r) => r.path === '/swap-indexes')).toBe(true);
    expect(fake.indexes.has(`${INDEX}_reindex`)).toBe(false);
  });

  it('sends the API key: the fake refuses a client without it, and every step above succeeded', async () => {
    await expect(new MeiliIndex({ url: fake.url, index: INDEX }).index.search('tray')).rejects.toThrow(/invalid/i);
    const failed = fake.tasks.filter((t) => t.status === 'failed').map((t) => t.error?.code);
    // Only the expected "nothing to drop yet" and "already exists" answers of a first reindex.
    expect(failed.every((code) => code === 'index_not_found' || code === 'index_already_exists')).toBe(true);
  });
});

describe('searching', () => {
  it('sends the scope and filters as escaped filter expressions, asks for scores, and relaxes by dropping the commonest words', async () => {
    await provider.search(ask({ text: 'tray', machine: 'tamberlyn-dr4120-pal', filters: { caution: 'laser', hasPhotos: true } }));
    const body = searchRequests().at(-1)!.body as Record<string, any>;
    expect(body.q).toBe('tray');
    expect(body.filter).toEqual([
      '(machines = "tamberlyn-dr4120-pal" OR familyChassis = "tamberlyn-tl2-loader")',
      'hasPhotos = true',
      'cautions = "laser"',
    ]);
    expect(body).toMatchObject({ showRankingScore: true, matchingStrategy: 'frequency' });
  });

  it('filters on the codes a query spells and sends only its words as text', async () => {
    const result = await provider.search(ask({ text: 'dr 4120 tray' }));
    const body = searchRequests().at(-1)!.body as Record<string, any>;
    expect(body.q).toBe('tray');
    expect(body.filter).toEqual(['codes IN ["dr4120", "dr4120k"]']);
    expect(result.hits.length).toBeGreaterThan(0);
    for (const hit of result.hits) expect(hit.machines.some((m) => m.slug.startsWith('tamberlyn-dr4120'))).toBe(true);
  });

  it('answers a code no fix carries with nothing, never its neighbour', async () => {
    const before = searchRequests().length;
    const result = await provider.search(ask({ text: 'DR-4121' }));
    expect(result.total).toBe(0);
    expect(searchRequests().length).toBe(before + 1);
    // The literal is sent as an exact phrase that must match, which no document holds.
    expect(searchRequests().at(-1)!.body).toMatchObject({ q: '"dr 4121"', matchingStrategy: 'all' });
  });

  it('orders nearest machine first among equally relevant hits, and labels facets from the catalogue', async () => {
    const result = await provider.search(ask({ text: 'tray', machine: 'tamberlyn-dr4120-pal', scope: 'all' }));
    const proximities = result.hits.map((h) => h.proximity);
    expect(proximities[0]).toBe(3);
    expect(result.facets.maker.find((m) => m.value === 'tamberlyn')?.label).toBe('Tamberlyn');
    expect(result.facets.deviceType.find((d) => d.value === 'dvd_recorder')?.label).toBe('DVD recorder');
  });

  it('escapes quotes and backslashes in filter values, so a hostile value cannot widen the filter', async () => {
    const odd = 'say "hi" \\ there';
    fake.indexes.get(INDEX)!.docs.set('9999001', {
      id: 9999001,
      slug: 'odd',
      title: 'odd maker test',
      makers: [odd],
      machines: [],
      chassis: [],
      familyChassis: [],
    });
    try {
      const quoted = buildFilter(ask({ filters: { maker: odd } }), null, []);
      expect(quoted).toEqual(['makers = "say \\"hi\\" \\\\ there"']);
      const found = await meili.index.search('', { filter: quoted });
      expect(found.hits.map((h) => h.id)).toEqual([9999001]);
      const hostile = buildFilter(ask({ filters: { maker: 'nobody" OR makers = "tamberlyn' } }), null, []);
      expect((await meili.index.search('', { filter: hostile })).hits).toEqual([]);
    } finally {
      fake.indexes.get(INDEX)!.docs.delete('9999001');
    }
  });
});

describe('the sync queue', () => {
  let worker: SyncWorker;
  let fixId: number;

  beforeAll(async () => {
    worker = await startSearchSyncWorker(knex, meili, { connectionString: testConnectionString(), pollingIntervalSeconds: 0.5 });
    const author = await knex('users').where({ email: 'member@example.test' }).first('id');
    const proofer = await knex('users').where({ email: 'moderator@example.test' }).first('id');
    const machine = await knex('machines').where({ slug: 'kestrune-kt44-multi' }).first('id');
    const [fix] = await knex('fixes')
      .insert({ slug: `search-sync-check-${Date.now()}`, created_by: author.id })
      .returning('id');
    fixId = fix.id;
    const [revision] = await knex('revisions')
      .insert({
        fix_id: fixId,
        number: 1,
        author_id: author.id,
        title: 'Sync check: take-up idler slips',
        body: JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Clean the idler tyre.' }] }] }),
        symptoms: ['take-up not turning'],
        state: 'proofed',
        proofer_id: proofer.id,
        submitted_at: new Date(),
        proofed_at: new Date(),
      })
      .returning('id');
    await knex('fixes').where({ id: fixId }).update({ current_revision_id: revision.id });
    await knex('fix_machines').insert({ fix_id: fixId, machine_id: machine.id });
    await refreshFixSearchRow(knex, fixId);
  });
  afterAll(async () => {
    await worker?.stop();
    if (fixId) {
      await knex('fixes').where({ id: fixId }).update({ current_revision_id: null });
      await knex('fixes').where({ id: fixId }).delete();
    }
  });

  const docs = () => fake.indexes.get(INDEX)!.docs;
  async function until(check: () => boolean, seconds: number): Promise<boolean> {
    for (let waited = 0; waited < seconds * 1000; waited += 250) {
      if (check()) return true;
      await new Promise((r) => setTimeout(r, 250));
    }
    return check();
  }
  const quickRetry = { retryLimit: 10, retryDelay: 1, retryBackoff: false };

  it('applies an update made while Meilisearch is down once it answers again', async () => {
    await fake.stop();
    await sendSearchSync(knex, { fixId }, quickRetry);
    // The worker tries, fails against the closed port, and pg-boss keeps the job for a retry.
    await new Promise((r) => setTimeout(r, 2500));
    const job = await knex.raw(
      `SELECT state, retry_count FROM pgboss.job WHERE name = 'search-sync' AND data->>'fixId' = ? ORDER BY created_on DESC LIMIT 1`,
      [String(fixId)],
    );
    expect(job.rows[0].state).toBe('retry');
    expect(job.rows[0].retry_count).toBeGreaterThanOrEqual(1);
    expect(docs().has(String(fixId))).toBe(false);
    await fake.start();
    expect(await until(() => docs().has(String(fixId)), 20)).toBe(true);
    expect(docs().get(String(fixId))?.title).toBe('Sync check: take-up idler slips');
  }, 60_000);

  it('sends a job inside the caller’s transaction: a rolled-back change leaves no job behind', async () => {
    const marker = 987654321;
    await knex
      .transaction(async (trx) => {
        await sendSearchSync(trx, { fixId: marker }, quickRetry);
        throw new Error('roll back');
      })
      .catch(() => undefined);
    const count = async (id: number) =>
      (await knex.raw(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'search-sync' AND data->>'fixId' = ?`, [String(id)])).rows[0]
        .n;
    expect(await count(marker)).toBe(0);
    // The same call in a transaction that commits does leave its job (the worker then finds no such fix).
    await knex.transaction((trx) => sendSearchSync(trx, { fixId: marker + 1 }, quickRetry));
    expect(await count(marker + 1)).toBe(1);
  });

  it('removes the document when the fix is no longer live', async () => {
    await knex('fixes').where({ id: fixId }).update({ deleted_at: new Date() });
    await refreshFixSearchRow(knex, fixId);
    await sendSearchSync(knex, { fixId }, quickRetry);
    expect(await until(() => !docs().has(String(fixId)), 20)).toBe(true);
  }, 30_000);
});

// A real server is only checked where one is configured; none can be installed on the development machines.
describe.skipIf(!process.env.MEILI_URL)(
  'against a real Meilisearch server (skipped unless MEILI_URL is set: none can be installed here)',
  () => {
    let real: MeiliIndex;
    beforeAll(() => {
      real = new MeiliIndex({ url: process.env.MEILI_URL ?? '', key: process.env.MEILI_KEY, index: `benchlore_test_${Date.now()}` });
    });
    afterAll(async () => {
      await real?.drop();
    });

    it('takes our settings and documents and answers a code-filtered search', async () => {
      const sent = await reindexMeili(knex, real);
      expect(sent).toBeGreaterThan(40);
      const result = await new MeiliSearchProvider(knex, real).search(ask({ text: 'E-21' }));
      expect(result.hits.map((h) => h.slug)).toContain('tl2-tray-will-not-open-e21');
      const typo = await new MeiliSearchProvider(knex, real).search(ask({ text: 'KX-45N' }));
      expect(typo.total).toBe(0);
    });
  },
);
