// `npm run search:eval`: the blind evaluation set (tests/search-eval) through both search providers, as a table.
/*
  Builds a database of its own (benchlore_search_eval, or BENCHLORE_EVAL_DB), fresh on every run, with the
  demo world seeded as `npm start` seeds it; never the app's or a test database. Then runs every case through
  the PostgreSQL provider and through the Meilisearch provider against the local fake of its HTTP API
  (tests/support/fake-meili.ts), and prints recall in the top 1, 3 and 10, mean reciprocal rank, the goals
  beside them, and every failing case.
  Usage: npm run search:eval [-- --provider postgres|meilisearch] [-- --scopes machine,all] [-- --set tuned,holdout,fresh]
  All three query sets run by default: tuned (search was tuned against it), held-out, and fresh (never read).
*/
import { migrateAndSeed, useOwnDatabase } from './lib/prepare.ts';

const arg = (name: string, fallback: string) => {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? (process.argv[at + 1] ?? fallback) : fallback;
};
const providers = arg('provider', 'postgres,meilisearch').split(',');
const scopes = arg('scopes', 'machine,all').split(',') as ('machine' | 'family' | 'all')[];
const sets = arg('set', 'tuned,holdout,fresh').split(',') as ('tuned' | 'holdout' | 'fresh')[];

const env = await useOwnDatabase(process.env.BENCHLORE_EVAL_DB ?? 'benchlore_search_eval');
migrateAndSeed(env);

// Imported only now: the app's Knex reads BENCHLORE_DB_NAME when it is first loaded.
const { db, closeDb } = await import('../src/server/core/db.ts');
const { PostgresSearchProvider } = await import('../src/server/search/pg-provider.ts');
const { MeiliSearchProvider } = await import('../src/server/search/meili/meili-provider.ts');
const { MeiliIndex } = await import('../src/server/search/meili/index-client.ts');
const { reindexMeili } = await import('../src/server/search/reindex.ts');
const { startFakeMeili } = await import('../tests/support/fake-meili.ts');
const { loadCases, querySets, floorOf, reportLines, runEval, figuresOf } = await import('../tests/search-eval/eval.ts');

const knex = db();
try {
  for (const set of sets) {
    const cases = loadCases(set);
    console.log(`\nSearch evaluation, ${querySets[set].label}: ${cases.length} blind cases (${new Date().toISOString().slice(0, 16)}Z)\n`);

    if (providers.includes('postgres')) {
      const run = await runEval(knex, new PostgresSearchProvider(knex), cases, scopes);
      console.log(reportLines('PostgreSQL provider', run).join('\n'));
      {
        const floor = floorOf(set);
        const noMachine = figuresOf(run.results.filter((r) => r.group === 'noMachine')).at3;
        const named = figuresOf(run.results.filter((r) => r.group === 'machineNamed')).at3;
        console.log(
          `  committed floor (tests/search-eval/floor.json, ${set} set, top-3): no machine ${(100 * floor.noMachine).toFixed(1)} %, machine named ${(100 * floor.machineNamed).toFixed(1)} %; this run ${(100 * noMachine).toFixed(1)} %, ${(100 * named).toFixed(1)} %\n`,
        );
      }
    }
    if (providers.includes('meilisearch')) {
      const fake = await startFakeMeili('eval-key');
      try {
        const meili = new MeiliIndex({ url: fake.url, key: 'eval-key', index: 'fixes_eval' });
        await reindexMeili(knex, meili);
        const run = await runEval(knex, new MeiliSearchProvider(knex, meili), cases, scopes);
        console.log(reportLines('Meilisearch provider against the local fake (tests/support/fake-meili.ts)', run).join('\n'));
        console.log(
          '  The fake matches whole lower-case words and their synonyms, without stemming, typo tolerance, proximity or attribute\n' +
            '  ranking; it drops words from the end of the query (any strategy but "all"). Its figures measure our requests and\n' +
            '  our re-ranking over a crude matcher, not what a real Meilisearch server would find.\n',
        );
      } finally {
        await fake.stop();
      }
    }
  }
} finally {
  await closeDb();
}
