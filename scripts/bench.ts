// `npm run bench`: every benchmark, side by side in one run on this machine, with the goals beside the figures.
/*
  1. Pages: the built app (production mode, demo world in a database of its own, benchlore_bench_pages) serving
     the anonymous fix page, a machine page, the catalogue, a search and a hand-over note, beside an Astro endpoint
     returning the fix page's bytes (built here with the project's own Astro and adapter: the framework's floor)
     and plain node:http serving the same bytes. autocannon, 50 connections, a warm-up then --seconds each.
  2. Photos: one 12-megapixel JPEG through the upload API: answered, renditions ready, server peak RSS.
  3. Search: scripts/bench-search.ts (10,000 and 100,000 synthetic fixes beside a naive ILIKE scan).
  4. News: one proofing fanned out to 10,000 followers and their 10,000 weekly digests rendered (scripts/bench/notifications.ts).
  Usage: npm run bench [-- --only pages,photos,search --seconds 10 --connections 50 --sizes 10000,100000]
         [--port 4480] (the app; the floors take the next two ports; another port also means a database of its own)
         [--cpu-prof DIR] (runs the app under `node --cpu-prof`, writing its V8 profile into DIR when it stops)
  `npm run bench -- --load` runs only the mixed load benchmark instead (scripts/bench/mixed-load.ts; 100 connections,
  60 s unless --connections/--seconds say otherwise).
  The machine matters: the figures are for comparing side by side in one run, not absolute.
*/
import { spawnSync } from 'node:child_process';
import { cpus, totalmem } from 'node:os';
import { parseArgs } from 'node:util';
import { buildIfStale, migrateAndSeed, useOwnDatabase } from './lib/prepare.ts';

const { values } = parseArgs({
  options: {
    only: { type: 'string', default: 'pages,photos,search,news' },
    seconds: { type: 'string', default: '10' },
    connections: { type: 'string', default: '50' },
    sizes: { type: 'string' },
    rounds: { type: 'string' },
    port: { type: 'string', default: '4480' },
    'cpu-prof': { type: 'string' },
    load: { type: 'boolean', default: false },
  },
});
if (values.load) {
  const { benchMixedLoad } = await import('./bench/mixed-load.ts');
  const argv = process.argv.slice(2).join(' ');
  const load = await benchMixedLoad({
    connections: argv.includes('--connections') ? Number(values.connections) : 100,
    seconds: argv.includes('--seconds') ? Number(values.seconds) : 60,
    port: 4485,
  });
  console.log(load);
  process.exit(0);
}
const only = new Set(values.only.split(','));
const seconds = Number(values.seconds);
const connections = Number(values.connections);
const PORT = Number(values.port);

console.log(`Machine: ${cpus().length} × ${cpus()[0]?.model.trim()}, ${(totalmem() / 2 ** 30).toFixed(0)} GB, Node ${process.version}\n`);

if (only.has('pages') || only.has('photos')) {
  const env = await useOwnDatabase(PORT === 4480 ? 'benchlore_bench_pages' : `benchlore_bench_pages_${PORT}`, {
    AUTH_SECRET: process.env.AUTH_SECRET ?? 'bench-secret-not-for-production-0123456789',
  });
  migrateAndSeed(env);
  buildIfStale(env);
  const { startBenchServer } = await import('./bench/server.ts');
  const { benchPages, pagesTable } = await import('./bench/pages.ts');
  const { benchPhoto, photoTable } = await import('./bench/photos.ts');
  const { signIn } = await import('../tests/support/sign-in.ts');
  const { db, closeDb } = await import('../src/server/core/db.ts');
  const server = await startBenchServer(
    PORT,
    env,
    'dist',
    values['cpu-prof'] ? ['--require', './scripts/bench/exit-on-signal.cjs', '--cpu-prof', '--cpu-prof-dir', values['cpu-prof']] : [],
  );
  try {
    const cookie = await signIn(server.base, 'member@example.test', 'bench-demo-2026', '127.0.0.1');
    // The photo is measured first, on a server not yet loaded: after tens of thousands of page answers V8 holds a heap
    // grown to a few hundred MB (about 125 MB of it live) until its next full collection, and the peak RSS would tell
    // when that collection happened rather than what a photo costs. Printed after the pages, as before.
    const photo = only.has('photos') ? await benchPhoto(server.base, cookie, server.child.pid!) : null;
    if (only.has('pages')) {
      const fix = await db()('fixes as f')
        .join('revision_photos as rp', 'rp.revision_id', 'f.current_revision_id')
        .whereNull('f.hidden_at')
        .orderBy('f.slug')
        .first('f.slug');
      const machine = await db()('machines').orderBy('slug').first('slug');
      const note = await fetch(`${server.base}/api/v1/handover-notes`, {
        method: 'POST',
        headers: { cookie, origin: server.base, 'content-type': 'application/json' },
        body: JSON.stringify({ fix: fix.slug }),
      });
      const noteBody = (await note.json()) as { note?: { code: string }; error?: { message: string } };
      if (!noteBody.note) throw new Error(`Could not make a hand-over note: ${noteBody.error?.message ?? note.status}`);
      const targets = [
        { label: 'fix page, anonymous', path: `/fixes/${fix.slug}` },
        { label: 'machine page', path: `/machines/${machine.slug}` },
        { label: 'catalogue', path: '/machines' },
        { label: 'search page, "tray will not close"', path: '/search?q=tray+will+not+close' },
        { label: 'hand-over note', path: `/n/${noteBody.note.code}` },
      ];
      const result = await benchPages(server.base, targets, { connections, seconds, floorPort: PORT + 1, plainPort: PORT + 2 });
      console.log(`${pagesTable(result, connections)}\n`);
    }
    if (photo) console.log(`${photoTable(photo)}\n`);
  } finally {
    await server.stop();
    await closeDb();
  }
}

if (only.has('news')) {
  const res = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/bench/notifications.ts'], { stdio: 'inherit' });
  if (res.status !== 0) process.exitCode = res.status ?? 1;
}

if (only.has('search')) {
  const args = [...(values.sizes ? ['--sizes', values.sizes] : []), ...(values.rounds ? ['--rounds', values.rounds] : [])];
  const res = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/bench-search.ts', ...args], { stdio: 'inherit' });
  if (res.status !== 0) process.exitCode = res.status ?? 1;
}
