// Search quality against the demo world: each query must bring its fix into the top three (PostgreSQL provider).
/*
  The table is written against the demo fixes (src/server/seed/demo/fixes/*.ts). `kinds` says what each
  case exercises: misspelling, paraphrase, slang (trade words and word families), code (error codes, part
  references), model (model numbers typed loosely), machine (the machine named beside the query), unknown
  (a first word no fix uses). The Meilisearch adapter runs the cases marked `meili` against the fake
  server: there the fake does the matching, so those checks are about the adapter's requests and the
  mapping of its answers, never about ranking quality.
*/
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { db } from '@/server/core/db';
import { PostgresSearchProvider } from '@/server/search/pg-provider';
import { MeiliSearchProvider } from '@/server/search/meili/meili-provider';
import { MeiliIndex } from '@/server/search/meili/index-client';
import { reindexMeili } from '@/server/search/reindex';
import type { SearchQuery } from '@/lib/search/query-schema';
import { startFakeMeili, type FakeMeili } from '../support/fake-meili';

export type CaseKind = 'plain' | 'misspelling' | 'paraphrase' | 'slang' | 'code' | 'model' | 'machine' | 'unknown';

export interface QualityCase {
  q: string;
  machine?: string;
  expect: string;
  kinds: CaseKind[];
  meili?: true;
}

export const qualityCases: QualityCase[] = [
  { q: 'tary wont close', expect: 'orx5-tray-will-not-close-ld-err-1', kinds: ['misspelling', 'slang'] },
  { q: 'no rewind', expect: 'qm7-no-rewind-glazed-idler', kinds: ['plain'], meili: true },
  { q: 'rewnd stops after a few seconds', expect: 'qm7-no-rewind-glazed-idler', kinds: ['misspelling'] },
  { q: 'rew and ff very slow but play ok', expect: 'qm7-no-rewind-glazed-idler', kinds: ['slang', 'paraphrase'] },
  { q: 'eats tape on eject', expect: 'tv5-chews-tape-on-eject', kinds: ['plain'], meili: true },
  { q: 'mangles tapes vhs side', expect: 'qc3-vhs-side-eats-tape', kinds: ['slang'] },
  { q: 'spits the tape straight back out', expect: 'qm7-loads-then-ejects-mode-switch', kinds: ['paraphrase'] },
  { q: 'plays a few seconds then switches off', expect: 'tv5-stops-after-seconds-centre-belt', kinds: ['paraphrase'] },
  { q: 'cassette stuck inside', expect: 'qm7-cassette-stuck-in-carriage', kinds: ['plain'], meili: true },
  { q: 'snowy picture on every tape', expect: 'vhs-snowy-playback-clogged-heads', kinds: ['plain'] },
  { q: 'clogged heads', expect: 'vhs-snowy-playback-clogged-heads', kinds: ['slang'] },
  { q: 'noise bars after warm up', expect: 'qm7-noise-bars-after-warm-up', kinds: ['plain'] },
  { q: 'HB-200 wont thread', expect: 'hb200-threading-ring-stalls', kinds: ['model', 'slang'] },
  { q: 'betamax threading ring stalls', expect: 'hb200-threading-ring-stalls', kinds: ['plain'], meili: true },
  { q: 'muffled sound on mono tapes', expect: 'tv5-muffled-linear-audio', kinds: ['plain'] },
  { q: 'completely dead no clock', expect: 'tv5-dead-no-clock-startup-capacitor', kinds: ['plain'] },
  { q: 'flikering display', expect: 'qm7-display-dim-flickering', kinds: ['misspelling'] },
  { q: 'VFD fading when warm', expect: 'qm7-display-dim-flickering', kinds: ['slang'] },
  { q: 'drawer bounces back in', machine: 'tamberlyn-dr4120-pal', expect: 'tl2-tray-opens-then-closes', kinds: ['slang', 'machine'] },
  { q: "tray won't open", machine: 'tamberlyn-dr4120-pal', expect: 'tl2-tray-will-not-open-e21', kinds: ['machine'] },
  { q: 'E-21', expect: 'tl2-tray-will-not-open-e21', kinds: ['code'], meili: true },
  { q: 'e 21 tray', expect: 'tl2-tray-will-not-open-e21', kinds: ['code'] },
  { q: 'F-12 grinding noise', expect: 'kd560-spindle-noisy-f12', kinds: ['code'] },
  { q: 'no disc dr 4120', expect: 'tl2-no-disc-dirty-lens', kinds: ['model'] },
  { q: 'dr4120k wont finalize', expect: 'dr4120k-fails-to-finalise-e47', kinds: ['model', 'slang'] },
  { q: 'stuck on waking', expect: 'tl2-slow-start-stuck-on-waking', kinds: ['plain'], meili: true },
  { q: 'takes ages to turn on', machine: 'quillmere-vdc900-pal', expect: 'qc3-slow-start-shared-supply', kinds: ['paraphrase', 'machine'] },
  { q: 'psu ticking kd560', expect: 'kd560-clicking-supply-no-power', kinds: ['slang', 'model'] },
  { q: 'fan not spinning F31', expect: 'kd560-f31-fan-stalled', kinds: ['code'] },
  { q: 'LD ERR 3', expect: 'orx5-ld-err-3-laser-current', kinds: ['code'], meili: true },
  { q: 'ld-err1 tray will not close', expect: 'orx5-tray-will-not-close-ld-err-1', kinds: ['code'] },
  { q: 'cartridge rejected', expect: 'orx5-cartridge-rejected', kinds: ['plain'], meili: true },
  { q: 'ram discs skip and freeze', expect: 'orx5-ram-playback-skips', kinds: ['paraphrase'] },
  { q: 'standby light off rx 710', expect: 'orx5-no-power-standby-supply', kinds: ['model'] },
  { q: 'switches off when warm', expect: 'orx5-switches-off-when-warm', kinds: ['plain'] },
  { q: 'er 07', expect: 'qc3-er-07-mode-switch', kinds: ['code'] },
  { q: 'slow rewind vdc-900', expect: 'qc3-slow-rewind-reel-belt', kinds: ['model'] },
  { q: 'dvd side no disc', expect: 'qc3-dvd-side-no-disc-oxide-on-lens', kinds: ['plain'], meili: true },
  { q: 'CX 330 tray motor hums', expect: 'cx330-tray-will-not-open', kinds: ['model'] },
  { q: 'cassette lid springs back open', expect: 'hm2-cassette-door-will-not-close', kinds: ['slang'] },
  { q: 'condensaton lockout', expect: 'hm2-dew-lockout-h04', kinds: ['misspelling'] },
  { q: 'H-04', expect: 'hm2-dew-lockout-h04', kinds: ['code'], meili: true },
  { q: 'mosaic on playback', expect: 'kc22d-blocky-playback-f21', kinds: ['plain'], meili: true },
  { q: 'vewfinder blank', expect: 'hc8a-viewfinder-blank', kinds: ['misspelling'] },
  { q: 'fishy smell camcorder', expect: 'hc85h-no-power-leaking-capacitors', kinds: ['plain'] },
  { q: 'warble on sustained notes', expect: 'bt4-wow-and-flutter-capstan-belt', kinds: ['slang'] },
  { q: 'tapes play fast', expect: 'bt4-speed-drift-motor-trimmer', kinds: ['slang'] },
  { q: 'KT 44 take-up not turning', expect: 'kt44-play-stops-idler-tyre', kinds: ['model'] },
  { q: 'crinkled tape edge', expect: 'bt4-creases-tape-pinch-roller', kinds: ['plain'], meili: true },
  { q: 'degauss the heads', expect: 'deck-dull-treble-magnetised-heads', kinds: ['slang'] },
  { q: 'auto reverse flips mid tape', expect: 'td570r-auto-reverse-flips-mid-tape', kinds: ['paraphrase'] },
  { q: 'mains hum td-550', expect: 'td550-hum-reservoir-capacitor', kinds: ['model'] },
  { q: 'stutters cp740', expect: 'kl9-skips-dirty-lens', kinds: ['slang', 'model'] },
  { q: 'F07', expect: 'kl9-no-disc-f07-worn-laser', kinds: ['code'], meili: true },
  { q: 'stops after track 3', expect: 'bcd15-stops-later-tracks-sled', kinds: ['plain'] },
  { q: 'disc wont spin cp-720', expect: 'cp720-spindle-will-not-spin-f12', kinds: ['model'] },
  { q: 'fuse blown after a storm', expect: 'cp760-dead-fuse-blown-bridge', kinds: ['plain'] },
  { q: 'zorbly grinding noise from the disc', expect: 'kd560-spindle-noisy-f12', kinds: ['unknown'] },
  { q: 'C806', expect: 'tv5-dead-no-clock-startup-capacitor', kinds: ['code'], meili: true },
];

const query = (c: QualityCase): SearchQuery => ({ text: c.q, machine: c.machine, scope: 'machine', filters: {}, page: 1, perPage: 10 });

describe('search quality with the PostgreSQL provider', () => {
  const provider = new PostgresSearchProvider(db());

  it('has a table of at least forty cases covering every kind', () => {
    expect(qualityCases.length).toBeGreaterThanOrEqual(40);
    const kinds = new Set(qualityCases.flatMap((c) => c.kinds));
    expect([...kinds].sort()).toEqual(['code', 'machine', 'misspelling', 'model', 'paraphrase', 'plain', 'slang', 'unknown']);
  });

  it.each(qualityCases.map((c) => [c.q + (c.machine ? ` [${c.machine}]` : ''), c] as const))(
    'finds the fix in the top three for %s',
    async (_label, c) => {
      const result = await provider.search(query(c));
      expect(result.hits.slice(0, 3).map((h) => h.slug)).toContain(c.expect);
    },
  );
});

describe('the Meilisearch adapter on the quality cases (fake server)', () => {
  let fake: FakeMeili;
  let provider: MeiliSearchProvider;

  beforeAll(async () => {
    fake = await startFakeMeili('quality-key');
    const meili = new MeiliIndex({ url: fake.url, key: 'quality-key', index: 'fixes_quality' });
    await reindexMeili(db(), meili);
    provider = new MeiliSearchProvider(db(), meili);
  });
  afterAll(async () => {
    await fake?.stop();
  });

  it.each(qualityCases.filter((c) => c.meili).map((c) => [c.q, c] as const))(
    'maps the answer for %s into hits with machines and highlights',
    async (_label, c) => {
      const result = await provider.search(query(c));
      expect(result.provider).toBe('meilisearch');
      const hit = result.hits.find((h) => h.slug === c.expect);
      expect(hit, `${c.expect} among ${result.hits.map((h) => h.slug).join(', ')}`).toBeDefined();
      expect(hit!.machines.length).toBeGreaterThan(0);
      expect(hit!.machines[0]!.label).toMatch(/^[A-Z][\w ]+ [A-Z0-9-]+ \((PAL|NTSC|SECAM|multi)\)$/);
      expect(`${hit!.titleHtml}${hit!.snippetHtml}`.replace(/<\/?mark( class="concept" title="[^"<>]*")?>/g, '')).not.toMatch(/[<>]/);
    },
  );
});
