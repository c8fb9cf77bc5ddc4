// PostgreSQL going away under load (through a proxy of this test's own): a clear 503 within 5 s, never a hang or a
// stack trace, and the app serving again by itself within 5 s of the database's return. Slow: about 30 s.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type TestApp } from '../support/server';
import { startDbProxy, type DbProxy } from '../support/tcp-proxy';
import { INTEGRATION_PORT } from '../support/test-env';
import { uniqueClientIp } from '../support/sign-in';

const port = INTEGRATION_PORT + 13;
const PG_PORT = Number(process.env.BENCHLORE_PG_PORT ?? 54329);
let proxy: DbProxy;
let app: TestApp;

beforeAll(async () => {
  proxy = await startDbProxy(PG_PORT);
  app = await startApp(port, { BENCHLORE_PG_PORT: String(proxy.port) });
  // Warm: each page's code loaded once, so the figures below are about the database, not a cold start.
  for (const path of paths)
    expect((await fetch(`${app.base}${path}`, { headers: { 'x-forwarded-for': uniqueClientIp() } })).status).toBe(200);
}, 60_000);
afterAll(async () => {
  await app?.stop();
  await proxy?.close();
});

/** Pages and JSON reads that all need the database. */
const paths = ['/machines', '/search?q=tray+will+not+close', '/api/v1/machines', '/api/v1/search?q=capstan', '/'];

interface Answer {
  path: string;
  startedAt: number;
  ms: number;
  status: number;
  body: string;
  type: string;
}

/** Keeps `workers` requests in flight until stopped, each with a 15 s limit of its own (a hang shows as status 0). */
function load(workers: number): { answers: Answer[]; stop(): Promise<void> } {
  const answers: Answer[] = [];
  let running = true;
  const loops = Array.from({ length: workers }, async (_, w) => {
    for (let i = w; running; i++) {
      const path = paths[i % paths.length]!;
      const startedAt = Date.now();
      try {
        const res = await fetch(`${app.base}${path}`, {
          headers: { 'x-forwarded-for': uniqueClientIp(), accept: path.startsWith('/api/') ? 'application/json' : 'text/html' },
          signal: AbortSignal.timeout(15_000),
        });
        const body = await res.text();
        answers.push({
          path,
          startedAt,
          ms: Date.now() - startedAt,
          status: res.status,
          body,
          type: res.headers.get('content-type') ?? '',
        });
      } catch (error) {
        answers.push({ path, startedAt, ms: Date.now() - startedAt, status: 0, body: String(error), type: '' });
      }
    }
  });
  return {
    answers,
    async stop() {
      running = false;
      await Promise.all(loops);
    },
  };
}

const stackTrace = /\n\s+at .+:\d+:\d+|node_modules|\.mjs:\d+/;

function expectCleanOutage(answers: Answer[], from: number, to: number): void {
  const during = answers.filter((a) => a.startedAt >= from && a.startedAt < to);
  expect(during.length).toBeGreaterThan(5);
  for (const a of answers) {
    expect([200, 503], `${a.path} answered ${a.status}: ${a.body.slice(0, 200)}`).toContain(a.status);
    expect(a.ms, `${a.path} took ${a.ms} ms`).toBeLessThan(5_000);
    expect(a.body).not.toMatch(stackTrace);
  }
  const unavailable = during.filter((a) => a.status === 503);
  expect(unavailable.length).toBeGreaterThan(0);
  for (const a of unavailable) {
    if (a.path.startsWith('/api/')) expect(JSON.parse(a.body).error.code).toBe('unavailable');
    else expect(a.body).toContain('cannot reach its database');
  }
}

/** Milliseconds from `since` to the first 200 of a request that started after it, for every path. */
function recovery(answers: Answer[], since: number): number {
  const worst = paths.map((path) => {
    const ok = answers.find((a) => a.path === path && a.startedAt >= since && a.status === 200);
    return ok ? ok.startedAt + ok.ms - since : Infinity;
  });
  return Math.max(...worst);
}

describe('the database going away under load', () => {
  it('answers 503 within 5 s while PostgreSQL is stopped and serves again within 5 s of its return', async () => {
    const traffic = load(8);
    await new Promise((r) => setTimeout(r, 1_500));
    const cutAt = Date.now();
    await proxy.cut();
    await new Promise((r) => setTimeout(r, 4_000));
    const backAt = Date.now();
    await proxy.restore();
    await new Promise((r) => setTimeout(r, 6_000));
    await traffic.stop();

    expect(traffic.answers.filter((a) => a.startedAt < cutAt && a.status === 200).length).toBeGreaterThan(0);
    // What the server logged for any answer that was not 200 or 503, so a failure says why.
    for (const line of app
      .output()
      .split('\n')
      .filter((l) => l.includes('unhandled error')))
      console.log(line.slice(0, 1500));
    expectCleanOutage(traffic.answers, cutAt, backAt);
    const back = recovery(traffic.answers, backAt);
    console.log(
      `stopped: ${traffic.answers.length} requests, worst ${Math.max(...traffic.answers.map((a) => a.ms))} ms, serving again ${back} ms after the return`,
    );
    expect(back).toBeLessThan(5_000);
  }, 40_000);

  it('answers 503 within 5 s while PostgreSQL stops answering (connections hang) and recovers within 5 s', async () => {
    const traffic = load(8);
    await new Promise((r) => setTimeout(r, 1_500));
    const stallAt = Date.now();
    proxy.stall();
    await new Promise((r) => setTimeout(r, 6_000));
    const backAt = Date.now();
    await proxy.restore();
    await new Promise((r) => setTimeout(r, 6_000));
    await traffic.stop();

    console.log(
      app
        .output()
        .split('\n')
        .filter((l) => l.includes('unhandled error'))
        .slice(0, 3)
        .join('\n')
        .slice(0, 3000),
    );
    expectCleanOutage(traffic.answers, stallAt, backAt);
    const back = recovery(traffic.answers, backAt);
    console.log(
      `hung: ${traffic.answers.length} requests, worst ${Math.max(...traffic.answers.map((a) => a.ms))} ms, serving again ${back} ms after the return`,
    );
    expect(back).toBeLessThan(5_000);
  }, 40_000);
});
