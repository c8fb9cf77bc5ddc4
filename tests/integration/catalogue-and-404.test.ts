// Small things a reader meets: the not-found page names the address asked for, and a machine page lists the fixes
// written for sibling machines of its chassis family.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { testDb } from '../support/db';
import { INTEGRATION_PORT } from '../support/test-env';
import { completeValues, publishFix, session, type Session } from '../fixtures/writing';

const base = `http://127.0.0.1:${INTEGRATION_PORT}`;
const knex = testDb();
let writer: Session;
let moderator: Session;

beforeAll(async () => {
  writer = await session(knex, base, 'member', 'family-writer');
  moderator = await session(knex, base, 'moderator', 'family-mod');
});
afterAll(() => knex.destroy());

describe('the not-found page', () => {
  it('names the address that was asked for, whether no route matched or a page found nothing', async () => {
    for (const path of ['/no/such/page', '/machines/no-such-machine-xyz', '/fixes/no-such-fix-xyz']) {
      const response = await fetch(`${base}${path}`);
      expect(response.status, path).toBe(404);
      const html = await response.text();
      expect(html, path).toContain(`There is nothing at <span class="model-number break-all rounded bg-paper-deep px-1">${path}</span>`);
      expect(html, path).not.toMatch(/>\/404</);
    }
  });
});

describe('a machine page', () => {
  it('lists a fix written for a sibling machine of its chassis family, not only fixes that name the family', async () => {
    const [machine, sibling] = await knex('machines as m')
      .whereNull('m.deleted_at')
      .whereIn(
        'm.chassis_family_id',
        knex('machines')
          .whereNull('deleted_at')
          .whereNotNull('chassis_family_id')
          .groupBy('chassis_family_id')
          .havingRaw('count(*) >= 2')
          .select('chassis_family_id'),
      )
      .orderBy(['m.chassis_family_id', 'm.id'])
      .limit(2)
      .select('m.id', 'm.slug', 'm.chassis_family_id');
    expect(machine.chassis_family_id).toBe(sibling.chassis_family_id);
    const values = completeValues(sibling.id, { title: `Sibling-only fix, tray drifts ${Date.now()}`, chassisIds: [] });
    const { slug } = await publishFix(base, writer, moderator, values);

    const html = await (await fetch(`${base}/machines/${machine.slug}`)).text();
    const family = html.match(/<section[^>]*aria-labelledby="family-fixes"[\s\S]*?<\/section>/)?.[0] ?? '';
    expect(family).toContain(`href="/fixes/${slug}"`);
    expect(family).not.toContain('No other fixes for this chassis family yet');
    // The sibling's own page lists it among its own fixes, and not again under the family.
    const siblingHtml = await (await fetch(`${base}/machines/${sibling.slug}`)).text();
    const siblingFamily = siblingHtml.match(/<section[^>]*aria-labelledby="family-fixes"[\s\S]*?<\/section>/)?.[0] ?? '';
    expect(siblingFamily).not.toContain(`href="/fixes/${slug}"`);
  });
});
