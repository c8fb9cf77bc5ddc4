// The read API through the built server: pages of results, one error shape, 400 and 404, never a 500.
import { describe, expect, it } from 'vitest';
import { client } from '../support/http';
import { INTEGRATION_PORT } from '../support/test-env';

const api = client(INTEGRATION_PORT);

function expectErrorShape(body: any, code: string) {
  expect(body).toEqual({ error: expect.objectContaining({ code, message: expect.any(String) }) });
}

describe('GET /api/v1/machines', () => {
  it('answers a page of machines with totals', async () => {
    const { status, body } = await api.json('/api/v1/machines?perPage=5');
    expect(status).toBe(200);
    expect(body.items).toHaveLength(5);
    expect(body.total).toBeGreaterThanOrEqual(24);
    expect(body.pageCount).toBe(Math.ceil(body.total / 5));
    expect(body.items[0]).toEqual(
      expect.objectContaining({ slug: expect.any(String), modelNumber: expect.any(String), maker: expect.any(Object) }),
    );
  });

  it('filters by device type and region', async () => {
    const { body } = await api.json('/api/v1/machines?deviceType=vcr&region=NTSC&perPage=100');
    expect(body.items.length).toBeGreaterThan(0);
    for (const m of body.items) expect([m.deviceType, m.region]).toEqual(['vcr', 'NTSC']);
  });

  it('answers 400 with field messages for bad parameters', async () => {
    const { status, body } = await api.json('/api/v1/machines?page=0&deviceType=toaster');
    expect(status).toBe(400);
    expectErrorShape(body, 'bad_request');
    expect(Object.keys(body.error.fields)).toEqual(expect.arrayContaining(['page', 'deviceType']));
  });
});

describe('GET /api/v1/machines/:slug', () => {
  it('answers the machine with its fixes and its family fixes', async () => {
    const list = await api.json('/api/v1/machines?perPage=100');
    const withFixes = list.body.items.find((m: any) => m.fixCount > 0);
    const { status, body } = await api.json(`/api/v1/machines/${withFixes.slug}`);
    expect(status).toBe(200);
    expect(body.machine.slug).toBe(withFixes.slug);
    expect(body.fixes.length).toBe(withFixes.fixCount);
    expect(Array.isArray(body.familyFixes)).toBe(true);
  });

  it('answers 404 in the error shape for an unknown slug', async () => {
    const { status, body } = await api.json('/api/v1/machines/no-such-machine');
    expect(status).toBe(404);
    expectErrorShape(body, 'not_found');
  });

  it('answers 404, not 500, for a slug with hostile characters', async () => {
    const res = await api.get(`/api/v1/machines/${encodeURIComponent("x' OR 1=1 --")}`);
    expect(res.status).toBe(404);
  });
});

describe('GET /api/v1/fixes', () => {
  it('pages through live fixes', async () => {
    const { status, body } = await api.json('/api/v1/fixes?perPage=10&page=2');
    expect(status).toBe(200);
    expect(body.page).toBe(2);
    expect(body.items).toHaveLength(10);
    expect(body.total).toBeGreaterThanOrEqual(40);
  });

  it('answers 404 for an unknown machine filter and 400 for a bad page size', async () => {
    expect((await api.json('/api/v1/fixes?machine=no-such-machine')).status).toBe(404);
    const bad = await api.json('/api/v1/fixes?perPage=1000');
    expect(bad.status).toBe(400);
    expectErrorShape(bad.body, 'bad_request');
  });
});

describe('GET /api/v1/fixes/:slug', () => {
  it('answers the live revision, and an older one by number with a long cache', async () => {
    const list = await api.json('/api/v1/fixes?perPage=100');
    const withHistory = list.body.items.find((f: any) => f.revisionNumber > 1);
    const live = await api.json(`/api/v1/fixes/${withHistory.slug}`);
    expect(live.status).toBe(200);
    expect(live.body.revision.number).toBe(withHistory.revisionNumber);
    expect(live.body.isLive).toBe(true);
    const first = await api.json(`/api/v1/fixes/${withHistory.slug}?revision=1`);
    expect(first.status).toBe(200);
    expect(first.body.revision.number).toBe(1);
    expect(first.body.isLive).toBe(false);
    expect(first.headers.get('cache-control')).toContain('immutable');
  });

  it('answers 404 for a revision that does not exist and 400 for one that is not a number', async () => {
    const list = await api.json('/api/v1/fixes?perPage=1');
    const slug = list.body.items[0].slug;
    expect((await api.json(`/api/v1/fixes/${slug}?revision=9999`)).status).toBe(404);
    expect((await api.json(`/api/v1/fixes/${slug}?revision=abc`)).status).toBe(400);
  });
});

describe('GET /api/v1/chassis/:slug', () => {
  it('answers the family, its machines and its fixes; 404 when unknown', async () => {
    const machines = await api.json('/api/v1/machines?perPage=100');
    const withFamily = machines.body.items.find((m: any) => m.chassis);
    const { status, body } = await api.json(`/api/v1/chassis/${withFamily.chassis.slug}`);
    expect(status).toBe(200);
    expect(body.machines.some((m: any) => m.slug === withFamily.slug)).toBe(true);
    expect((await api.json('/api/v1/chassis/no-such-family')).status).toBe(404);
  });
});
