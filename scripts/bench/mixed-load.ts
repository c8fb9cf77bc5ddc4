// `npm run bench -- --load`: 100 connections for 60 s of mixed reading, searching and signed-in writing against the
// built app started through its real server entry, printing errors (goal 0) and p99 latency (goal ≤ 200 ms).
import { spawn } from 'node:child_process';
import autocannon from 'autocannon';
import { signIn } from '../../tests/support/sign-in.ts';
import { completeValues } from '../../tests/fixtures/writing.ts';
import { buildIfStale, migrateAndSeed, useOwnDatabase } from '../lib/prepare.ts';

interface MixedRequest {
  method: 'GET' | 'PUT';
  path: string;
  headers?: Record<string, string>;
  body?: string;
  /** autocannon's per-request hook; `context` lives as long as the connection does. */
  setupRequest?: (request: MixedRequest, context: Record<string, unknown>) => MixedRequest;
}
interface MixedResult {
  requests: { total: number; average: number };
  latency: { p50: number; p97_5: number; p99: number; max: number };
  errors: number;
  timeouts: number;
  non2xx: number;
  statusCodeStats: Record<string, { count: number }>;
}
type Run = (options: { url: string; connections: number; duration: number; requests: MixedRequest[] }) => Promise<MixedResult>;

export interface LoadOptions {
  connections: number;
  seconds: number;
  port: number;
}

const PASSWORD = 'bench-demo-2026';

async function startApp(port: number, env: NodeJS.ProcessEnv): Promise<{ base: string; stop(): Promise<void> }> {
  const child = spawn(process.execPath, [`${process.env.BENCHLORE_DIST ?? 'dist'}/serve.mjs`], {
    env: { ...env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), PUBLIC_ORIGIN: `http://127.0.0.1:${port}` },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('The app did not start within 30 s.')), 30_000);
    child.stdout?.on('data', (d: Buffer) => {
      if (d.toString().includes('Benchlore is listening')) {
        clearTimeout(timer);
        resolve();
      }
    });
    child.once('exit', (code) => reject(new Error(`The app exited (${code}).`)));
  });
  return {
    base: `http://127.0.0.1:${port}`,
    stop: async () => {
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await exited;
    },
  };
}

/**
 * Reads (pages), searches (page and API) and a signed-in member's draft autosaves, in about 5 : 3 : 2. Each connection
 * saves a draft of its own, as a writer's editor does (one save after another on their own draft): many connections
 * saving one draft would only measure them queueing for its row lock.
 */
async function mixOf(base: string, knex: import('knex').Knex, connections: number): Promise<MixedRequest[]> {
  const fixes: { slug: string }[] = await knex('fixes')
    .whereNotNull('current_revision_id')
    .whereNull('hidden_at')
    .orderBy('slug')
    .limit(3)
    .select('slug');
  const machine = await knex('machines').orderBy('slug').first('slug');
  const machineId: number = (await knex('machines').orderBy('id').first('id')).id;
  const cookie = await signIn(base, 'member@example.test', PASSWORD, '127.0.0.1');
  const json = { cookie, origin: base, 'content-type': 'application/json', accept: 'application/json' };
  const drafts: number[] = [];
  for (let i = 0; i < connections; i++) {
    const res = await fetch(`${base}/api/v1/drafts`, {
      method: 'POST',
      headers: json,
      body: JSON.stringify({ values: completeValues(machineId) }),
    });
    const body = (await res.json()) as { revision?: { id: number }; error?: { message: string } };
    if (!body.revision) throw new Error(`Could not start a draft: ${body.error?.message ?? res.status}`);
    drafts.push(body.revision.id);
  }
  let handedOut = 0;
  const save: MixedRequest = {
    method: 'PUT',
    path: '/api/v1/drafts/0',
    headers: json,
    body: JSON.stringify({ values: completeValues(machineId, { cause: 'Saved again by the load benchmark while typing.' }) }),
    setupRequest: (request, context) => {
      context.draft ??= drafts[handedOut++ % drafts.length];
      return { ...request, path: `/api/v1/drafts/${context.draft as number}` };
    },
  };
  return [
    { method: 'GET', path: `/fixes/${fixes[0]!.slug}` },
    { method: 'GET', path: '/search?q=tray+will+not+close' },
    { method: 'GET', path: `/machines/${machine.slug}` },
    save,
    { method: 'GET', path: `/fixes/${fixes[1]!.slug}` },
    { method: 'GET', path: '/api/v1/search?q=capstan+speed' },
    { method: 'GET', path: '/machines' },
    save,
    { method: 'GET', path: `/fixes/${fixes[2]!.slug}` },
    { method: 'GET', path: '/search?q=hum+in+both+channels' },
  ];
}

export async function benchMixedLoad(options: LoadOptions): Promise<string> {
  const env = await useOwnDatabase('benchlore_bench_load', {
    AUTH_SECRET: process.env.AUTH_SECRET ?? 'bench-secret-not-for-production-0123456789',
  });
  migrateAndSeed(env);
  buildIfStale(env);
  const { db, closeDb } = await import('../../src/server/core/db.ts');
  const app = await startApp(options.port, env);
  try {
    const requests = await mixOf(app.base, db(), options.connections);
    const run = autocannon as unknown as Run;
    await run({ url: app.base, connections: options.connections, duration: 3, requests }); // warm-up, not counted
    const r = await run({ url: app.base, connections: options.connections, duration: options.seconds, requests });
    const errors = r.errors + r.timeouts + r.non2xx;
    const codes = Object.entries(r.statusCodeStats)
      .map(([code, { count }]) => `${code} × ${count}`)
      .join(', ');
    return [
      `Load: ${options.connections} connections for ${options.seconds} s, mixed reading, searching and signed-in draft saving (5 : 3 : 2)`,
      `  requests      ${r.requests.total} (${r.requests.average.toFixed(0)}/s)   answers: ${codes}`,
      `  errors        ${errors} (socket ${r.errors}, timeouts ${r.timeouts}, non-2xx ${r.non2xx})   goal 0   ${errors === 0 ? 'met' : 'NOT met'}`,
      `  latency (ms)  p50 ${r.latency.p50}   p97.5 ${r.latency.p97_5}   p99 ${r.latency.p99}   max ${r.latency.max}   goal p99 ≤ 200   ${r.latency.p99 <= 200 ? 'met' : 'NOT met'}`,
    ].join('\n');
  } finally {
    await app.stop();
    await closeDb();
  }
}
