// Side by side in one run: app pages against the framework's floor (an Astro endpoint built here with the
// project's own Astro and adapter, returning the fix page's bytes) and plain node:http serving the same bytes.
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { measure, type LoadFigures } from './load.ts';

export interface PageTarget {
  label: string;
  path: string;
  headers?: Record<string, string>;
}

export interface Row extends LoadFigures {
  label: string;
}

const DATA = resolve(process.env.BENCHLORE_DATA_DIR ?? '.data');

async function waitForPort(url: string, child: ChildProcess, name: string): Promise<void> {
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`${name} exited before it answered`);
    try {
      const res = await fetch(url);
      await res.arrayBuffer();
      return;
    } catch {
      if (Date.now() > deadline) throw new Error(`${name} did not answer within 30 s`);
      await new Promise((r) => setTimeout(r, 200));
    }
  }
}

function build(env: NodeJS.ProcessEnv): Promise<void> {
  return new Promise((done, fail) => {
    const child = spawn(process.execPath, ['node_modules/astro/astro.js', 'build', '--root', 'scripts/bench/floor-app', '--silent'], {
      env,
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    child.on('exit', (code) => (code === 0 ? done() : fail(new Error(`building the floor app failed (exit ${code})`))));
  });
}

/** Captures the fix page's bytes, builds and starts the two floors, measures every target in turn. */
export async function benchPages(
  base: string,
  targets: PageTarget[],
  options: { connections: number; seconds: number; floorPort: number; plainPort: number },
): Promise<{ rows: Row[]; floor: Row; plain: Row; bytes: number }> {
  const fix = targets[0]!;
  const page = await fetch(`${base}${fix.path}`);
  if (page.status !== 200) throw new Error(`${fix.path} answered ${page.status}`);
  const bytes = await page.text();
  // A folder per port, so two benchmarks on one machine never build into each other's floor.
  const folder = `${DATA}/bench-floor-${options.floorPort}`;
  mkdirSync(folder, { recursive: true });
  const bytesFile = `${folder}/fix-page.html`;
  writeFileSync(bytesFile, bytes);
  const env = {
    ...process.env,
    BENCH_BYTES_FILE: bytesFile,
    BENCH_FLOOR_OUT: `${folder}/dist`,
    BENCH_FLOOR_CACHE: `${folder}/cache`,
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
  };
  await build(env);
  const floorServer = spawn(process.execPath, [`${folder}/dist/server/entry.mjs`], {
    env: { ...env, PORT: String(options.floorPort) },
    stdio: 'ignore',
  });
  const plainServer = spawn(process.execPath, ['--import', 'tsx', 'scripts/bench/plain-server.ts'], {
    env: { ...env, PORT: String(options.plainPort) },
    stdio: 'ignore',
  });
  try {
    const floorUrl = `http://127.0.0.1:${options.floorPort}/floor`;
    const plainUrl = `http://127.0.0.1:${options.plainPort}/`;
    await waitForPort(floorUrl, floorServer, 'the Astro floor');
    await waitForPort(plainUrl, plainServer, 'the node:http server');
    const floorBytes = await (await fetch(floorUrl)).text();
    if (floorBytes !== bytes) throw new Error('the floor does not return the same bytes as the fix page');
    const load = { connections: options.connections, seconds: options.seconds };
    const rows: Row[] = [];
    for (const target of targets) {
      rows.push({ label: target.label, ...(await measure(`${base}${target.path}`, { ...load, headers: target.headers })) });
    }
    const floor = { label: 'Astro endpoint, same bytes (floor)', ...(await measure(floorUrl, load)) };
    const plain = { label: 'node:http, same bytes', ...(await measure(plainUrl, load)) };
    return { rows, floor, plain, bytes: Buffer.byteLength(bytes) };
  } finally {
    floorServer.kill('SIGTERM');
    plainServer.kill('SIGTERM');
  }
}

const pad = (s: string | number, n: number) => String(s).padStart(n);

export function pagesTable(result: { rows: Row[]; floor: Row; plain: Row; bytes: number }, connections: number): string {
  const lines = [
    `Pages at ${connections} connections (the fix page is ${result.bytes} bytes); ratio = requests/s ÷ the Astro floor's`,
    `  ${'target'.padEnd(42)} ${pad('req/s', 8)} ${pad('p50 ms', 7)} ${pad('p99 ms', 7)} ${pad('ratio', 6)} ${pad('errors', 6)}`,
  ];
  for (const row of [...result.rows, result.floor, result.plain]) {
    const ratio = row.requestsPerSecond / result.floor.requestsPerSecond;
    lines.push(
      `  ${row.label.padEnd(42)} ${pad(row.requestsPerSecond.toFixed(0), 8)} ${pad(row.p50, 7)} ${pad(row.p99, 7)} ${pad(ratio.toFixed(2), 6)} ${pad(row.errors + row.non2xx, 6)}`,
    );
  }
  const fix = result.rows[0]!;
  const ratio = fix.requestsPerSecond / result.floor.requestsPerSecond;
  lines.push(
    `  goal: fix page ≥ 0.90 × the floor (now ${ratio.toFixed(3)}: ${ratio >= 0.9 ? 'met' : 'not met'}), p99 ≤ 50 ms (now ${fix.p99}: ${fix.p99 <= 50 ? 'met' : 'not met'})`,
  );
  return lines.join('\n');
}
