// The public pages through the built server: content, no client script, headers, helpful 404s.
import { describe, expect, it } from 'vitest';
import { client } from '../support/http';
import { INTEGRATION_PORT } from '../support/test-env';
import { testDb } from '../support/db';
import { scriptsBesideRegistration } from '../support/scripts';

const site = client(INTEGRATION_PORT);

async function page(path: string): Promise<{ status: number; html: string; headers: Headers }> {
  const res = await site.get(path);
  return { status: res.status, html: await res.text(), headers: res.headers };
}

async function fixWithCautions(): Promise<string> {
  const knex = testDb();
  try {
    const row = await knex('fixes as f')
      .join('revisions as r', 'r.id', 'f.current_revision_id')
      .whereRaw(`jsonb_array_length(r.cautions) > 0`)
      .first('f.slug');
    return row.slug;
  } finally {
    await knex.destroy();
  }
}

describe('fix page', () => {
  it('shows symptoms, cause, cautions before the remedy, parts, and no script at all', async () => {
    const slug = await fixWithCautions();
    const { status, html, headers } = await page(`/fixes/${slug}`);
    expect(status).toBe(200);
    expect(scriptsBesideRegistration(html)).toEqual([]);
    const order = ['id="symptoms"', 'id="cause"', 'id="cautions"', 'id="remedy"'].map((marker) => html.indexOf(marker));
    expect(order.every((i) => i > 0)).toBe(true);
    expect([...order].sort((a, b) => a - b)).toEqual(order);
    expect(html).toContain('Follow your local electrical codes and licensed practice');
    expect(headers.get('cache-control')).toContain('public');
  });

  it('has an immutable permalink for each proofed revision, and 404 for others', async () => {
    const slug = await fixWithCautions();
    const r1 = await page(`/fixes/${slug}/r/1`);
    expect(r1.status).toBe(200);
    expect(r1.headers.get('cache-control')).toContain('immutable');
    expect((await page(`/fixes/${slug}/r/999`)).status).toBe(404);
    expect((await page(`/fixes/${slug}/r/abc`)).status).toBe(404);
  });

  it('answers an unknown fix with the helpful 404 page', async () => {
    const { status, html } = await page('/fixes/no-such-fix');
    expect(status).toBe(404);
    expect(html).toContain('action="/search"');
  });
});

describe('catalogue and machine pages', () => {
  it('filters the catalogue with a plain GET form and ships no script', async () => {
    const { status, html } = await page('/machines?deviceType=cd_player');
    expect(status).toBe(200);
    expect(scriptsBesideRegistration(html)).toEqual([]);
    expect(html).toContain('CD player');
    expect(html).not.toContain('Cassette deck</td>');
  });

  it('shows a machine with its chassis family and fixes, without script', async () => {
    const knex = testDb();
    const machine = await knex('machines as m')
      .whereNotNull('m.chassis_family_id')
      .whereExists(knex('fix_machines').whereRaw('machine_id = m.id'))
      .first('slug');
    await knex.destroy();
    const { status, html } = await page(`/machines/${machine.slug}`);
    expect(status).toBe(200);
    expect(scriptsBesideRegistration(html)).toEqual([]);
    expect(html).toContain('Fixes for its chassis family');
    expect(html).toContain('href="/fixes/');
  });
});

describe('every response', () => {
  it('carries the security headers', async () => {
    const { headers } = await page('/');
    expect(headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
    expect(headers.get('x-content-type-options')).toBe('nosniff');
    expect(headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
  });
});

describe('help pages', () => {
  it.each(['/help', '/help/writing-a-good-fix', '/help/working-safely', '/help/house-rules', '/help/content-licence', '/help/privacy'])(
    '%s renders',
    async (path) => {
      const { status, html } = await page(path);
      expect(status).toBe(200);
      expect(html).toContain('<main');
    },
  );
});

describe('media', () => {
  it('serves renditions with a long cache and refuses path tricks', async () => {
    const knex = testDb();
    const photo = await knex('photos').first('renditions');
    await knex.destroy();
    const key = photo.renditions[0].key;
    const res = await site.get(`/media/${key}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^image\//);
    expect(res.headers.get('cache-control')).toContain('immutable');
    expect((await site.get('/media/..%2F..%2Fpackage.json')).status).toBe(404);
  });
});
