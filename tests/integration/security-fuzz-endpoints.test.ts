// Fuzzing every JSON endpoint under src/pages/api from its own zod schemas, as a member, a moderator and a signed-out
// caller: never a 5xx, every refusal in the one error shape, and no table changed by a batch of refused requests.
// npm test runs FUZZ_CASES (default 1,000) cases per endpoint in total; BENCHLORE_FUZZ_FULL=1 runs that many per
// endpoint method and role (the issue's full count, a few minutes).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Knex } from 'knex';
import { statusOf } from '@/server/http/responses';
import { bodyLimits } from '@/server/http/body';
import { routeAccess } from '@/server/auth/route-access';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { call, completeValues, session, someMachineId, type Session } from '../fixtures/writing';
import { discoverEndpoints, type Endpoint } from '../fixtures/endpoint-schemas';
import { fuzzCases, validSamples, type FuzzCase } from '../fixtures/fuzz-cases';
import { uniqueClientIp } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
const full = process.env.BENCHLORE_FUZZ_FULL === '1';
const casesPerEndpoint = Number(process.env.FUZZ_CASES ?? 1000);
const seed = Number(process.env.FUZZ_SEED ?? 1223);
const concurrency = 6;
const batchSize = 30;
const roles = ['member', 'moderator', 'anonymous'] as const;
type Role = (typeof roles)[number];

let endpoints: Endpoint[] = [];
const cookies: Record<Role, string | undefined> = { member: undefined, moderator: undefined, anonymous: undefined };
const params: Record<string, string> = {};
let fixups: Record<string, unknown> = {};
let member: Session;

/** Tables a refused request may touch: rate-limit counters are spent before a request is read. */
const countersOnly = new Set(['rate_limits']);

async function checksum(db: Knex): Promise<Map<string, string>> {
  const tables: string[] = (await db.raw(`select tablename from pg_tables where schemaname = 'public' order by 1`)).rows
    .map((r: { tablename: string }) => r.tablename)
    .filter((t: string) => !countersOnly.has(t));
  const sql = tables
    .map((t) => `select '${t}' as t, count(*)::text || ':' || coalesce(sum(hashtext(x::text)::bigint), 0)::text as sum from "${t}" x`)
    .join(' union all ');
  return new Map((await db.raw(sql)).rows.map((r: { t: string; sum: string }) => [r.t, r.sum]));
}

function changedTables(before: Map<string, string>, after: Map<string, string>): string[] {
  return [...after.keys()].filter((t) => before.get(t) !== after.get(t));
}

beforeAll(async () => {
  endpoints = await discoverEndpoints();
  member = await session(knex, base, 'member', 'fuzz');
  const moderator = await session(knex, base, 'moderator', 'fuzz');
  cookies.member = member.cookie;
  cookies.moderator = moderator.cookie;
  const machineId = await someMachineId(knex);
  const machine = await knex('machines').where({ id: machineId }).first('slug');
  const fix = await knex('fixes').whereNotNull('current_revision_id').whereNull('deleted_at').orderBy('id').first('slug');
  const chassis = await knex('chassis_families').orderBy('id').first('slug');
  // The member's own things, so cases reach past "not found" to the work itself.
  const draft = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: member.cookie });
  const waiting = await call(base, '/api/v1/drafts', { body: { values: completeValues(machineId) }, cookie: member.cookie });
  await call(base, `/api/v1/drafts/${waiting.body.revision.id}/submit`, { body: {}, cookie: member.cookie });
  const job = await call(base, '/api/v1/job-sheets', { body: { customerRef: 'Fuzz bench 1' }, cookie: member.cookie });
  const note = await call(base, '/api/v1/handover-notes', { body: { fix: fix.slug }, cookie: member.cookie });
  const report = await call(base, `/api/v1/fixes/${fix.slug}/reports`, {
    body: { reason: 'wrong', detail: 'The reading at TP12 looks wrong to me.' },
    cookie: member.cookie,
  });
  const photo = await knex('photos').orderBy('id').first('id');
  for (const [name, answer] of Object.entries({ draft, waiting, job, note, report }))
    if (answer.status >= 300) throw new Error(`setting up ${name}: ${answer.status} ${JSON.stringify(answer.body)}`);
  Object.assign(params, {
    '/api/v1/drafts/[id]': String(draft.body.revision.id),
    '/api/v1/revisions/[id]': String(waiting.body.revision.id),
    '/api/v1/proofing/[id]': String(waiting.body.revision.id),
    '/api/v1/job-sheets/[id]': String(job.body.jobSheet?.id ?? job.body.id),
    '/api/v1/handover-notes/[code]': String(note.body.note?.code ?? note.body.code),
    '/api/v1/proofing/reports/[id]': String(report.body.id ?? report.body.report?.id),
    '/api/v1/photos/[id]': String(photo?.id ?? 1),
    '/api/v1/machines/[slug]': machine.slug,
    '/api/v1/chassis/[slug]': chassis.slug,
    '/api/v1/fixes/[slug]': fix.slug,
    '/api/v1/proofing/fixes/[slug]': fix.slug,
  });
  fixups = { fix: fix.slug, fixSlug: fix.slug, machine: machine.slug, values: completeValues(machineId) };
});
afterAll(() => knex.destroy());

/** The address of a pattern with the test world's values; a parameter with no value gets a made-up one. */
function pathOf(pattern: string): string {
  const prefix = Object.keys(params)
    .sort((a, b) => b.length - a.length)
    .find((p) => pattern.startsWith(p));
  const filled = prefix ? prefix.replace(/\[[^\]]+\]$/, params[prefix]!) + pattern.slice(prefix.length) : pattern;
  return filled.replace(/\[[^\]]+\]/g, '999999');
}

interface Outcome {
  status: number;
  problem?: string;
  /** The connection was cut because the body was far over its cap. */
  cut?: boolean;
}

/** Eight times the smallest JSON cap: a body larger than this may be cut off rather than answered. */
const cutOffBytes = 8 * Math.min(...Object.values(bodyLimits));

function checkAnswer(status: number, contentType: string, text: string): string | undefined {
  if (status >= 500) return `answered ${status}: ${text.slice(0, 300)}`;
  if (status < 400) return undefined;
  if (!contentType.startsWith('application/json')) return `refused ${status} as ${contentType}, not the JSON error shape`;
  let body: { error?: { code?: string; message?: unknown; fields?: unknown } };
  try {
    body = JSON.parse(text);
  } catch {
    return `refused ${status} with a body that is not JSON: ${text.slice(0, 200)}`;
  }
  const error = body.error;
  if (!error || typeof error.code !== 'string' || !(error.code in statusOf))
    return `refused ${status} without a known error code: ${text.slice(0, 200)}`;
  if (statusOf[error.code as keyof typeof statusOf] !== status) return `code ${error.code} came with status ${status}`;
  if (typeof error.message !== 'string' || error.message.length < 10) return `refused ${status} without a message a person can read`;
  if (error.fields !== undefined) {
    const fields = error.fields as Record<string, unknown>;
    if (typeof fields !== 'object' || fields === null) return 'fields is not an object';
    for (const [name, messages] of Object.entries(fields))
      if (!Array.isArray(messages) || messages.some((m) => typeof m !== 'string')) return `fields.${name} is not a list of sentences`;
  }
  return undefined;
}

const totals = { cases: 0, refused: 0, comparedRefused: 0, cut: 0, retried: 0 };

function staleSocket(error: unknown): boolean {
  const code = (error as { cause?: { code?: string } }).cause?.code;
  return code === 'UND_ERR_SOCKET' || code === 'ECONNRESET';
}

async function send(method: string, path: string, role: Role, fuzz: FuzzCase): Promise<Outcome> {
  const headers: Record<string, string> = { origin: base, accept: 'application/json', 'x-forwarded-for': uniqueClientIp() };
  const cookie = cookies[role];
  if (cookie) headers.cookie = cookie;
  let body: string | undefined;
  if (fuzz.body && method !== 'GET') {
    if ('json' in fuzz.body) {
      headers['content-type'] = 'application/json';
      body = JSON.stringify(fuzz.body.json);
    } else {
      headers['content-type'] = fuzz.body.contentType;
      body = fuzz.body.raw;
    }
  }
  const query = fuzz.query.toString();
  const url = `${base}${path}${query ? `?${query}` : ''}`;
  try {
    let res: Response;
    try {
      res = await fetch(url, { method, headers, body, redirect: 'manual' });
    } catch (error) {
      // A pooled connection the server closed while idle (its keep-alive timeout passes while samples are made on a
      // loaded machine) fails before any byte is sent: send once more on a fresh one. A server that is down fails again.
      if (!staleSocket(error)) throw error;
      totals.retried++;
      res = await fetch(url, { method, headers, body, redirect: 'manual' });
    }
    const text = await res.text();
    const problem = checkAnswer(res.status, res.headers.get('content-type') ?? '', text);
    return { status: res.status, problem: problem && `${method} ${path} as ${role} (${fuzz.mutation}): ${problem}` };
  } catch (error) {
    // The body reader cuts the connection once a body runs past eight times its cap (bodyLimits in http/body.ts), by
    // design: nothing larger is read. Any other dropped connection is a failure.
    if ((body?.length ?? 0) > cutOffBytes) return { status: 0, cut: true };
    const cause = (error as { cause?: { code?: string; message?: string } }).cause;
    return {
      status: 0,
      problem: `${method} ${path} as ${role} (${fuzz.mutation}): no answer (${String(error)}: ${cause?.code ?? ''} ${cause?.message ?? ''})`,
    };
  }
}

async function inParallel<T, R>(items: T[], limit: number, work: (item: T) => Promise<R>): Promise<R[]> {
  const results: R[] = new Array(items.length);
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(limit, items.length) }, async () => {
      while (next < items.length) {
        const i = next++;
        results[i] = await work(items[i]!);
      }
    }),
  );
  return results;
}

// Slow: about 8 minutes for 37,000 cases on a shared two-core machine (FUZZ_CASES=200 for a quick run).
describe('every JSON endpoint, fuzzed from its own schemas (slow)', () => {
  it('finds the endpoints on disk and the schema each handler parses with', async () => {
    expect(endpoints.length).toBeGreaterThanOrEqual(35);
    const unresolved = endpoints.flatMap((e) =>
      e.unresolved.map((name) => `${e.file}: ${name} (export it so the fuzz test can sample it)`),
    );
    expect(unresolved).toEqual([]);
    const withSchemas = endpoints.filter((e) => e.methods.some((m) => m.body || m.query)).map((e) => e.pattern);
    expect(withSchemas).toEqual(
      expect.arrayContaining(['/api/v1/job-sheets', '/api/v1/handover-notes', '/api/v1/search', '/api/v1/tools/substitute']),
    );
  });

  it(`answers ${full ? `${casesPerEndpoint} cases per method and role` : `${casesPerEndpoint} cases per endpoint`} without a 5xx, in the one error shape, changing nothing when refused`, async () => {
    const problems: string[] = [];
    const started = Date.now();
    let lastChecksum: Map<string, string> | undefined;
    for (const endpoint of endpoints) {
      const rule = routeAccess[endpoint.pattern];
      const methods = endpoint.methods.filter((m) => rule?.methods[m.method] !== undefined);
      const runs = methods.flatMap((m) => roles.map((role) => ({ m, role })));
      const perRun = full ? casesPerEndpoint : Math.ceil(casesPerEndpoint / Math.max(1, runs.length));
      const samples = new Map(
        methods.map((m) => [m, { bodySamples: validSamples(m.body, fixups, [{}]), querySamples: validSamples(m.query, fixups, [{}]) }]),
      );
      for (const [index, { m, role }] of runs.entries()) {
        const cases = fuzzCases({ readsBody: m.readsBody, ...samples.get(m)! }, perRun, seed + index);
        const path = pathOf(endpoint.pattern);
        const runStarted = Date.now();
        for (let at = 0; at < cases.length; at += batchSize) {
          const batch = cases.slice(at, at + batchSize);
          // Nothing else writes while the batch runs (one test file at a time), so the last checksum is this one's before.
          const before = lastChecksum ?? (await checksum(knex));
          const outcomes = await inParallel(batch, concurrency, (c) => send(m.method, path, role, c));
          totals.cases += outcomes.length;
          totals.cut += outcomes.filter((o) => o.cut).length;
          const refused = outcomes.filter((o) => o.status >= 400 || o.cut).length;
          totals.refused += refused;
          for (const o of outcomes) if (o.problem && problems.length < 40) problems.push(o.problem);
          lastChecksum = await checksum(knex);
          if (refused === outcomes.length) {
            totals.comparedRefused += refused;
            const changed = changedTables(before, lastChecksum);
            if (changed.length > 0)
              problems.push(`${m.method} ${path} as ${role}: a batch of refused requests changed ${changed.join(', ')}`);
          }
        }
        if (process.env.FUZZ_VERBOSE)
          console.info(`${m.method} ${path} as ${role}: ${cases.length} cases in ${Date.now() - runStarted} ms`);
      }
    }
    console.info(
      `fuzzed ${endpoints.length} endpoints: ${totals.cases} cases, ${totals.refused} refused, ${totals.comparedRefused} refused cases checked for changes, ${totals.cut} oversized bodies cut off, ${totals.retried} sent again after a stale connection, in ${Math.round((Date.now() - started) / 1000)} s (seed ${seed})`,
    );
    expect(problems, problems.join('\n')).toEqual([]);
    expect(totals.cases).toBeGreaterThanOrEqual(casesPerEndpoint * endpoints.length * 0.9);
  }, 900_000);
});
