// `npm run bench:search`: PostgreSQL search latency at 10,000 and 100,000 synthetic fixes, beside a naive ILIKE scan.
/*
  Creates (and afterwards keeps, for inspection) a database of its own, benchlore_bench (or BENCHLORE_BENCH_DB),
  on the local cluster; never the app's or a test database. Fixes come from a seeded generator, so every run builds the same world.
  Each size runs the same query set (broad one-word queries matching a large share of all fixes, narrow
  phrases, codes, misspellings, a named machine) once to warm up and then ROUNDS times, timing:
    provider – PostgresSearchProvider.search(): analysis, candidates, ranking, facets, highlights, hydration
    naive    – one ILIKE per word over the text columns, AND-ed, best bench score first, LIMIT 10 (no facets)
  Usage: npm run bench:search [-- --sizes 10000,100000 --rounds 5] [-- --reuse]
  --reuse measures again, at the largest size only, the database a previous run left (no generation): for
  comparing code changes side by side on the same data.
*/
import { run, useOwnDatabase } from './lib/prepare.ts';

const DB = process.env.BENCHLORE_BENCH_DB ?? 'benchlore_bench';
const arg = (name: string, fallback: string) => {
  const at = process.argv.indexOf(`--${name}`);
  return at >= 0 ? (process.argv[at + 1] ?? fallback) : fallback;
};
const SIZES = arg('sizes', '10000,100000').split(',').map(Number);
const ROUNDS = Number(arg('rounds', '5'));
const REUSE = process.argv.includes('--reuse');

const env = await useOwnDatabase(DB, {}, { fresh: !REUSE });
run(process.execPath, ['--import', 'tsx', 'scripts/migrate.ts'], env);

// Imported only now: the app's Knex reads BENCHLORE_DB_NAME when it is first loaded.
const { db, closeDb } = await import('../src/server/core/db.ts');
const { seedCatalogue } = await import('../src/server/seed/seed-catalogue.ts');
const { seededRandom, pick } = await import('../src/server/seed/prng.ts');
const { PostgresSearchProvider } = await import('../src/server/search/pg-provider.ts');
const { refreshVocabulary } = await import('../src/server/search/vocabulary.ts');
const { wilsonLowerBound } = await import('../src/lib/bench/bench-score.ts');
const { normaliseCode } = await import('../src/lib/schemas/catalogue.ts');

const knex = db();
const random = seededRandom(20261202);
const chance = (p: number) => random() < p;
const some = <T>(items: readonly T[], min: number, max: number): T[] =>
  Array.from({ length: min + Math.floor(random() * (max - min + 1)) }, () => pick(random, items));

// Invented trade vocabulary for the synthetic fixes.
const parts = [
  'tray',
  'drawer',
  'loading belt',
  'idler tyre',
  'pinch roller',
  'capstan',
  'spindle motor',
  'laser pickup',
  'mode switch',
  'cam gear',
  'reel sensor',
  'clutch felt',
  'head drum',
  'audio head',
  'sled motor',
  'flex cable',
  'relay',
  'fan',
  'display',
  'tuner',
];
const supplies = [
  'power supply',
  'standby supply',
  'smoothing capacitor',
  'regulator',
  'bridge rectifier',
  'fuse',
  'switch-mode controller',
  'output capacitor',
];
const symptomForms = [
  (p: string) => `${p} won't open`,
  (p: string) => `${p} will not close`,
  (p: string) => `noise from the ${p}`,
  (p: string) => `${p} slips`,
  (p: string) => `${p} stops after a few seconds`,
  (p: string) => `grinding ${p}`,
  () => 'no power',
  () => 'power cuts out when warm',
  () => 'display flickers',
  () => 'tray opens then closes',
  () => 'loud noise on play',
  () => 'clicks then shuts down',
  () => 'slow to start',
  () => 'chews tapes',
  () => 'picture freezes',
  () => 'hum in the sound',
];
const causeForms: { about: 'part' | 'supply'; text: (name: string) => string }[] = [
  { about: 'part', text: (p) => `The ${p} hardens with age and loses its grip under load.` },
  { about: 'part', text: (p) => `Old grease on the ${p} turns to glue and the motor cannot move it.` },
  { about: 'part', text: (p) => `A cracked ${p} slips on its shaft, so the controller gives up.` },
  { about: 'supply', text: (s) => `The ${s} beside the heatsink dries out and the rails carry too much ripple.` },
  { about: 'supply', text: (s) => `A failed ${s} leaves the controller without a steady supply, so it resets.` },
];
const remedySentences = [
  'Unplug the unit and wait before opening it; measure the primary capacitor before touching anything.',
  'Remove the top cover and the front panel, keeping the screws in order.',
  'Lift the mechanism out on its three screws and lay it on a soft mat.',
  'Clean the old grease off with isopropyl alcohol and a lint-free swab.',
  'Fit the new part, check it runs true, and refit the retaining clip.',
  'Run the mechanism through a full cycle with the cover off and listen for noise.',
  'Check the supply rails under load; the ripple should be a few tens of millivolts.',
  'Reflow any cracked joints on the connector while the board is out.',
  'Play a test tape for twenty minutes and confirm the fault does not come back.',
  'Record the readings on the job sheet before handing the unit back.',
];
const letters = 'ABCDEFGHJKLMNPRSTUVWXZ';

interface Machine {
  id: number;
  makerId: number;
  makerName: string;
  chassisId: number | null;
  model: string;
  deviceType: string;
  formats: string[];
}

/** A synthetic catalogue beside the demo one: 400 invented machines on 40 invented chassis families. */
async function syntheticCatalogue(): Promise<Machine[]> {
  await seedCatalogue(knex);
  const makers: { id: number; slug: string; name: string }[] = await knex('makers').select('id', 'slug', 'name');
  const chassisIds: number[] = [];
  for (let i = 0; i < 40; i++) {
    const maker = pick(random, makers);
    const [row] = await knex('chassis_families')
      .insert({ slug: `bench-chassis-${i}`, maker_id: maker.id, name: `Bench platform ${i}`, code: `BP-${i}`, device_type: 'dvd_recorder' })
      .returning('id');
    chassisIds.push(row.id);
  }
  const rows = Array.from({ length: 400 }, (_, i) => {
    const model = `${pick(random, [...letters])}${pick(random, [...letters])}-${1000 + i * 7}${chance(0.3) ? pick(random, ['K', 'H', 'S']) : ''}`;
    return {
      slug: `bench-${normaliseCode(model)}-pal`,
      maker_id: pick(random, makers).id,
      chassis_family_id: chance(0.8) ? pick(random, chassisIds) : null,
      model_number: model,
      model_code: normaliseCode(model),
      region: 'PAL',
      device_type: pick(random, ['vcr', 'dvd_recorder', 'cd_player', 'cassette_deck']),
      formats: [pick(random, ['VHS', 'DVD-R', 'CD', 'Compact Cassette'])],
    };
  });
  await knex.batchInsert('machines', rows, 200);
  const machines = await knex('machines as m')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .select('m.id', 'm.maker_id', 'mk.name as maker_name', 'm.chassis_family_id', 'm.model_number', 'm.device_type', 'm.formats');
  return machines.map((m) => ({
    id: m.id,
    makerId: m.maker_id,
    makerName: m.maker_name,
    chassisId: m.chassis_family_id,
    model: m.model_number,
    deviceType: m.device_type,
    formats: m.formats,
  }));
}

/** The catalogue a previous run built (--reuse). */
async function existingCatalogue(): Promise<Machine[]> {
  const machines = await knex('machines as m')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .select('m.id', 'm.maker_id', 'mk.name as maker_name', 'm.chassis_family_id', 'm.model_number', 'm.device_type', 'm.formats');
  return machines.map((m) => ({
    id: m.id,
    makerId: m.maker_id,
    makerName: m.maker_name,
    chassisId: m.chassis_family_id,
    model: m.model_number,
    deviceType: m.device_type,
    formats: m.formats,
  }));
}

function syntheticFix(i: number, machines: Machine[]) {
  const part = pick(random, parts);
  const supply = pick(random, supplies);
  const symptoms = [...new Set(some(symptomForms, 2, 4).map((f) => f(chance(0.6) ? part : pick(random, parts))))];
  const cause = some(causeForms, 1, 2)
    .map((form) => form.text(form.about === 'supply' ? supply : part))
    .join(' ');
  const remedy = some(remedySentences, 5, 9).join(' ');
  const errorCode = chance(0.3) ? `${pick(random, ['E', 'F', 'H'])}-${10 + Math.floor(random() * 80)}` : null;
  const refs = some(['C', 'R', 'D', 'Q'], 1, 3).map((l) => `${l}${100 + Math.floor(random() * 1800)}`);
  const onMachines = [...new Map(some(machines, 1, 3).map((m) => [m.id, m])).values()];
  const fixed = Math.floor(random() * 12);
  const reports = fixed + Math.floor(random() * 5);
  const score = reports > 0 && chance(0.8) ? wilsonLowerBound(fixed, reports) : null;
  return {
    slug: `bench-fix-${i}`,
    title: `${symptoms[0]![0]!.toUpperCase()}${symptoms[0]!.slice(1)}, ${part} at fault`,
    symptoms,
    cause,
    remedy,
    parts: refs.map((r) => `${r} ${pick(random, ['470uF', '1000uF', '22uF', '1N4007', '4.7k'])}`).join(' . '),
    codes: [
      ...new Set([
        ...onMachines.map((m) => normaliseCode(m.model)),
        ...refs.map(normaliseCode),
        ...(errorCode ? [normaliseCode(errorCode)] : []),
      ]),
    ].join(' '),
    errorCode,
    machines: onMachines,
    benchScore: score && score.ok ? score.value : null,
    reports: score && score.ok ? reports : 0,
  };
}

async function addFixes(from: number, to: number, machines: Machine[], users: { author: number; proofer: number }): Promise<void> {
  const BATCH = 500;
  for (let start = from; start < to; start += BATCH) {
    const batch = Array.from({ length: Math.min(BATCH, to - start) }, (_, k) => syntheticFix(start + k, machines));
    await knex.transaction(async (trx) => {
      const fixIds: { id: number }[] = await trx('fixes')
        .insert(batch.map((f) => ({ slug: f.slug, created_by: users.author })))
        .returning('id');
      const now = new Date();
      const revIds: { id: number }[] = await trx('revisions')
        .insert(
          batch.map((f, k) => ({
            fix_id: fixIds[k]!.id,
            number: 1,
            author_id: users.author,
            proofer_id: users.proofer,
            title: f.title,
            body: JSON.stringify({ type: 'doc', content: [] }),
            symptoms: f.symptoms,
            error_codes: f.errorCode ? [f.errorCode] : [],
            cause: f.cause,
            state: 'proofed',
            submitted_at: now,
            proofed_at: now,
          })),
        )
        .returning('id');
      await trx.raw('UPDATE fixes f SET current_revision_id = r.id FROM revisions r WHERE r.fix_id = f.id AND f.id BETWEEN ? AND ?', [
        fixIds[0]!.id,
        fixIds[fixIds.length - 1]!.id,
      ]);
      await trx('fix_machines').insert(batch.flatMap((f, k) => f.machines.map((m) => ({ fix_id: fixIds[k]!.id, machine_id: m.id }))));
      // The search rows are written directly: what refreshFixSearchRow would write, without its per-fix queries.
      await trx('fix_search').insert(
        batch.map((f, k) => ({
          fix_id: fixIds[k]!.id,
          revision_id: revIds[k]!.id,
          title: f.title,
          symptoms: f.symptoms.join(' . '),
          cause: f.cause,
          remedy: f.remedy,
          parts: f.parts,
          codes: f.codes,
          machines_text: [...new Set(f.machines.flatMap((m) => [m.makerName, m.model]))].join(' . '),
          maker_ids: [...new Set(f.machines.map((m) => m.makerId))],
          machine_ids: f.machines.map((m) => m.id),
          chassis_ids: [...new Set(f.machines.flatMap((m) => (m.chassisId ? [m.chassisId] : [])))],
          device_types: [...new Set(f.machines.map((m) => m.deviceType))],
          formats: [...new Set(f.machines.flatMap((m) => m.formats))],
          caution_kinds: chance(0.4) ? ['mains'] : [],
          has_photos: false,
          bench_score: f.benchScore,
          report_count: f.reports,
          proofed_at: now,
        })),
      );
    });
    if ((start + BATCH) % 10_000 === 0) console.log(`  ${start + BATCH} fixes…`);
  }
  await refreshVocabulary(knex);
  await knex.raw('VACUUM ANALYZE fix_search');
  await knex.raw('ANALYZE search_words, search_codes, machines');
}

type Named = { q: string; kind: 'broad' | 'narrow'; machine?: string; scope?: 'machine' | 'all' };

function querySet(machines: Machine[]): Named[] {
  const m = machines[machines.length - 7]!;
  const slug = `bench-${normaliseCode(m.model)}-pal`;
  return [
    ...['tray', 'power', 'noise', 'belt', 'no power', 'capacitor', 'display'].map((q) => ({ q, kind: 'broad' as const })),
    ...[
      'tray wont open',
      'noise from the spindle motor',
      'display flickers',
      'pinch roller slips',
      'clicks then shuts down',
      'tary wont close',
      'smoothing capacitor dries out',
      'grinding sled motor',
      'E-42',
      'F 17 tray',
      m.model.replace('-', ' '),
      `${m.model} no power`,
      'hum in the sound',
      'picture freezes',
    ].map((q) => ({ q, kind: 'narrow' as const })),
    // A machine named: its own fixes (the default scope), and every machine nearest first.
    { q: 'tray', kind: 'broad', machine: slug },
    { q: 'noise', kind: 'broad', machine: slug, scope: 'all' },
    { q: 'belt slips', kind: 'narrow', machine: slug, scope: 'all' },
  ];
}

const TEXT = `(title || ' ' || symptoms || ' ' || cause || ' ' || remedy)`;
async function naiveSearch(q: string): Promise<number> {
  const words = q.toLowerCase().match(/[a-z0-9]+/g) ?? [];
  const { rows } = await knex.raw(
    `SELECT fix_id, title FROM fix_search WHERE ${words.map(() => `${TEXT} ILIKE ?`).join(' AND ') || 'TRUE'} ORDER BY bench_score DESC NULLS LAST, fix_id LIMIT 10`,
    words.map((w) => `%${w}%`),
  );
  return rows.length;
}

const percentile = (xs: number[], p: number) => {
  const sorted = [...xs].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? 0;
};

async function measure(size: number, queries: Named[]) {
  const provider = new PostgresSearchProvider(knex);
  const timings = { provider: [] as number[], naive: [] as number[], broad: [] as number[], narrow: [] as number[] };
  const perQuery = new Map<string, number[]>();
  let maxTotal = 0;
  for (let round = 0; round <= ROUNDS; round++) {
    for (const query of queries) {
      let t = performance.now();
      const result = await provider.search({
        text: query.q,
        machine: query.machine,
        scope: query.scope ?? 'machine',
        filters: {},
        page: 1,
        perPage: 10,
      });
      const providerMs = performance.now() - t;
      t = performance.now();
      await naiveSearch(query.q);
      const naiveMs = performance.now() - t;
      if (round === 0) continue; // warm-up
      timings.provider.push(providerMs);
      timings.naive.push(naiveMs);
      timings[query.kind].push(providerMs);
      const label = query.machine ? `${query.q} [${query.scope ?? 'machine'} scope]` : query.q;
      perQuery.set(label, [...(perQuery.get(label) ?? []), providerMs]);
      maxTotal = Math.max(maxTotal, result.total);
    }
  }
  const broadMatches: number[] = await Promise.all(
    ['tray', 'power', 'noise'].map(async (w) =>
      Number((await knex.raw(`SELECT count(*) AS n FROM fix_search WHERE document @@ to_tsquery('english', ?)`, [w])).rows[0].n),
    ),
  );
  const slowest = [...perQuery]
    .map(([q, ms]) => ({ q, worst: Math.max(...ms) }))
    .sort((a, b) => b.worst - a.worst)
    .slice(0, 5);
  return { size, timings, broadMatches, slowest };
}

const machines = REUSE ? await existingCatalogue() : await syntheticCatalogue();
const users = {
  author: (await knex('users').where({ email: 'member@example.test' }).first('id')).id as number,
  proofer: (await knex('users').where({ email: 'moderator@example.test' }).first('id')).id as number,
};
const queries = querySet(machines);
const results = [];
let have = 0;
if (REUSE) {
  const size = Number((await knex('fix_search').count<{ n: string }[]>('* as n'))[0]?.n ?? 0);
  console.log(`Measuring the ${size} fixes a previous run left in ${DB}…`);
  // A migration may have rewritten the table: the visibility map lets walks read the index alone.
  await knex.raw('VACUUM ANALYZE fix_search');
  results.push(await measure(size, queries));
}
for (const size of REUSE ? [] : SIZES) {
  console.log(`Generating fixes up to ${size}…`);
  const t = performance.now();
  await addFixes(have, size, machines, users);
  have = size;
  console.log(`  ready in ${((performance.now() - t) / 1000).toFixed(0)} s; measuring ${queries.length} queries × ${ROUNDS} rounds…`);
  results.push(await measure(size, queries));
}

const f = (ms: number) => ms.toFixed(1).padStart(7);
console.log(
  `\nSearch latency in ms (${ROUNDS} rounds of ${queries.length} queries after one warm-up round; ${new Date().toISOString().slice(0, 10)})`,
);
console.log(
  '  fixes | provider p50    p95 | naive ILIKE p50    p95 | p95 ratio naive/provider | provider p95 broad / narrow | matches of tray, power, noise',
);
for (const r of results) {
  const pp95 = percentile(r.timings.provider, 95);
  const np95 = percentile(r.timings.naive, 95);
  console.log(
    `${String(r.size).padStart(7)} | ${f(percentile(r.timings.provider, 50))} ${f(pp95)} | ${f(percentile(r.timings.naive, 50))}     ${f(np95)} | ${(np95 / pp95).toFixed(1).padStart(24)} | ${f(percentile(r.timings.broad, 95))} / ${f(percentile(r.timings.narrow, 95)).trim()}   | ${r.broadMatches.join(', ')}`,
  );
}
const last = results.at(-1);
if (last)
  console.log(
    `Slowest queries at ${last.size} (worst of ${ROUNDS} runs): ${last.slowest.map((s) => `${s.q} ${s.worst.toFixed(1)} ms`).join('; ')}`,
  );
await closeDb();
