// Slow (about half a minute): Lighthouse's accessibility and SEO audits on a fix page, in Debian's Chromium, all pass.
// Only what cannot be noisy is asserted here; the four scores, performance included, are printed by `npm run lighthouse`.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LaunchedChrome } from 'chrome-launcher';
import { launchChrome, runLighthouse } from '../../scripts/lighthouse/run';
import { testDb } from '../support/db';
import { E2E_PORT } from '../support/test-env';

const base = `http://127.0.0.1:${E2E_PORT}`;
const knex = testDb();
let chrome: LaunchedChrome;

beforeAll(async () => {
  chrome = await launchChrome();
});
afterAll(async () => {
  await chrome?.kill();
  await knex.destroy();
});

describe('Lighthouse on a fix page (slow)', () => {
  it('passes every accessibility and SEO audit', { timeout: 120_000 }, async () => {
    // A fix of the demo world (the first ones seeded), not one another test is making or taking down meanwhile.
    const fix = await knex('fixes')
      .whereNotNull('current_revision_id')
      .whereNull('hidden_at')
      .whereNull('deleted_at')
      .orderBy('id')
      .first<{ slug: string }>('slug');
    const result = await runLighthouse(chrome, `${base}/fixes/${fix!.slug}`, { categories: ['accessibility', 'seo'] });
    expect(result.failures.accessibility).toEqual([]);
    expect(result.failures.seo).toEqual([]);
    expect(result.scores).toEqual({ accessibility: 100, seo: 100 });
  });
});
