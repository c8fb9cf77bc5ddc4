// Real answers of the built server validated against the schemas /api/v1/openapi.json documents for them (Ajv, JSON Schema 2020-12).
import Ajv2020 from 'ajv/dist/2020';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { createUser, signIn } from '../support/sign-in';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
const ajv = new Ajv2020({ strict: false, validateFormats: false, allErrors: true });
let cookie: string;
let doc: { paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, unknown> }> }>> };

/** JSON Pointer escaping (RFC 6901). */
const pointer = (segment: string) => segment.replace(/~/g, '~0').replace(/\//g, '~1');

/** Validates a real answer against the schema documented for its path, method and status. */
async function expectDocumented(method: string, path: string, url: string, init: RequestInit = {}): Promise<unknown> {
  const res = await fetch(`${base}${url}`, {
    ...init,
    method,
    headers: { cookie, origin: base, 'content-type': 'application/json', ...(init.headers as object) },
  });
  const status = String(res.status);
  const documented = doc.paths[path]?.[method.toLowerCase()]?.responses[status];
  expect(documented, `${method} ${url} answered ${status}, which ${path} does not document`).toBeDefined();
  const body = await res.json();
  const ref = `openapi#/paths/${pointer(path)}/${method.toLowerCase()}/responses/${status}/content/${pointer('application/json')}/schema`;
  const validate = ajv.getSchema(ref);
  expect(validate, `no schema at ${ref}`).toBeDefined();
  const valid = validate!(body);
  expect(valid, `${method} ${url} → ${status}: ${ajv.errorsText(validate!.errors)}\n${JSON.stringify(body).slice(0, 400)}`).toBe(true);
  return body;
}

beforeAll(async () => {
  const user = await createUser(knex, { tag: 'api-responses' });
  cookie = await signIn(base, user.email, user.password);
  doc = await (await fetch(`${base}/api/v1/openapi.json`)).json();
  ajv.addSchema(doc, 'openapi');
});
afterAll(() => knex.destroy());

describe('answers match the OpenAPI document', () => {
  it('is served as OpenAPI 3.1 and is itself a documented answer', async () => {
    const body = (await expectDocumented('GET', '/api/v1/openapi.json', '/api/v1/openapi.json')) as { openapi: string };
    expect(body.openapi).toBe('3.1.0');
  });

  it('the one error shape: 400, 401 and 404', async () => {
    await expectDocumented('GET', '/api/v1/job-sheets', '/api/v1/job-sheets?perPage=500');
    await expectDocumented('GET', '/api/v1/job-sheets/{id}', '/api/v1/job-sheets/999999999');
    const anonymous = await fetch(`${base}/api/v1/job-sheets`);
    expect(anonymous.status).toBe(401);
    const validate = ajv.getSchema('openapi#/components/schemas/Error')!;
    expect(validate(await anonymous.json())).toBe(true);
    // A wrong answer is caught: the validator is not a rubber stamp.
    expect(validate({ message: 'no error member' })).toBe(false);
  });

  it('catalogue, fixes, search and bench tools', async () => {
    const machines = (await expectDocumented('GET', '/api/v1/machines', '/api/v1/machines?perPage=3')) as { items: { slug: string }[] };
    const machine = machines.items[0]!.slug;
    await expectDocumented('GET', '/api/v1/machines/{slug}', `/api/v1/machines/${machine}`);
    const fixes = (await expectDocumented('GET', '/api/v1/fixes', '/api/v1/fixes?perPage=2')) as { items: { slug: string }[] };
    await expectDocumented('GET', '/api/v1/fixes/{slug}', `/api/v1/fixes/${fixes.items[0]!.slug}`);
    await expectDocumented('GET', '/api/v1/fixes/{slug}', '/api/v1/fixes/no-such-fix-here');
    const chassis = await knex('chassis_families').first('slug');
    await expectDocumented('GET', '/api/v1/chassis/{slug}', `/api/v1/chassis/${chassis.slug}`);
    await expectDocumented('GET', '/api/v1/search', '/api/v1/search?q=tray');
    await expectDocumented('GET', '/api/v1/catalogue-lookup', '/api/v1/catalogue-lookup?q=t');
    await expectDocumented('GET', '/api/v1/tools/decode', '/api/v1/tools/decode?value=470uF&rating=16V');
  });

  it('job sheets, invoice lines and notes, including a stale update', async () => {
    const created = (await expectDocumented('POST', '/api/v1/job-sheets', '/api/v1/job-sheets', {
      body: JSON.stringify({ customerRef: 'T-204', labourMinutes: 30, partsUsed: [{ kind: 'belt', value: 'flat 2.5 mm', quantity: 1 }] }),
    })) as { jobSheet: { id: number } };
    const id = created.jobSheet.id;
    await expectDocumented('GET', '/api/v1/job-sheets', '/api/v1/job-sheets?page=1&perPage=10');
    await expectDocumented('GET', '/api/v1/job-sheets/{id}', `/api/v1/job-sheets/${id}`);
    await expectDocumented('PATCH', '/api/v1/job-sheets/{id}', `/api/v1/job-sheets/${id}`, {
      headers: { 'if-match': '"v1"' },
      body: JSON.stringify({ status: 'diagnosing' }),
    });
    const stale = (await expectDocumented('PATCH', '/api/v1/job-sheets/{id}', `/api/v1/job-sheets/${id}`, {
      headers: { 'if-match': '"v1"' },
      body: JSON.stringify({ status: 'repaired' }),
    })) as { current: { version: number } };
    expect(stale.current.version).toBe(2);
    await expectDocumented('PATCH', '/api/v1/job-sheets/{id}', `/api/v1/job-sheets/${id}`, { body: JSON.stringify({ labourMinutes: -5 }) });
    await expectDocumented('GET', '/api/v1/job-sheets/{id}/invoice-lines.json', `/api/v1/job-sheets/${id}/invoice-lines.json`);

    const fix = await knex('fixes')
      .whereNotNull('current_revision_id')
      .whereNull('hidden_at')
      .whereNull('deleted_at')
      .orderBy('id')
      .first('slug');
    const note = (await expectDocumented('POST', '/api/v1/handover-notes', '/api/v1/handover-notes', {
      body: JSON.stringify({ fix: fix.slug, jobSheetId: id }),
    })) as { note: { code: string } };
    await expectDocumented('GET', '/api/v1/handover-notes', '/api/v1/handover-notes');
    await expectDocumented('GET', '/api/v1/handover-notes/{code}', `/api/v1/handover-notes/${note.note.code}`);
    await expectDocumented('PATCH', '/api/v1/handover-notes/{code}', `/api/v1/handover-notes/${note.note.code}`, {
      body: JSON.stringify({ message: 'Thank you for waiting.' }),
    });
    await expectDocumented('DELETE', '/api/v1/handover-notes/{code}', `/api/v1/handover-notes/${note.note.code}`);
  });

  it('the order list and the account', async () => {
    await expectDocumented('GET', '/api/v1/order-list', '/api/v1/order-list');
    await expectDocumented('GET', '/api/v1/account', '/api/v1/account');
  });
});
