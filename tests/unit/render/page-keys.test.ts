// A fix page's key: what changes it (a new live revision, a lock, any counter it shows) and what does not.
import { describe, expect, it } from 'vitest';
import { fixKeyOf, pageKeys } from '@/server/render/page-keys';

const row = { id: 7, current_revision_id: 21, locked_at: null, versions: 'bench.4,catalogue.2,people.1,photos.9' };

describe('fixKeyOf', () => {
  it('is the same for the same row', () => {
    expect(fixKeyOf(row)).toBe(fixKeyOf({ ...row }));
  });
  it('changes with a proofing (new live revision), a lock, an unlock, a bench report or a catalogue edit', () => {
    const key = fixKeyOf(row);
    const locked = fixKeyOf({ ...row, locked_at: new Date('2026-12-02T10:00:00Z') });
    expect(fixKeyOf({ ...row, current_revision_id: 22 })).not.toBe(key);
    expect(locked).not.toBe(key);
    expect(fixKeyOf({ ...row, locked_at: new Date('2026-12-02T11:00:00Z') })).not.toBe(locked);
    expect(fixKeyOf({ ...row, versions: 'bench.5,catalogue.2,people.1,photos.9' })).not.toBe(key);
    expect(fixKeyOf({ ...row, versions: 'bench.4,catalogue.3,people.1,photos.9' })).not.toBe(key);
  });
});

describe('pageKeys', () => {
  it('covers every public read page the validators are promised on, and no page that depends on who reads', () => {
    for (const route of [
      '/',
      '/machines',
      '/machines/[slug]',
      '/makers',
      '/makers/[slug]',
      '/chassis/[slug]',
      '/fixes/[slug]',
      '/fixes/[slug]/r/[number]',
      '/help',
    ]) {
      expect(pageKeys[route], route).toBeDefined();
    }
    // Searches are kept for anonymous readers on their own shelf, so a run of one-off queries cannot push out fix pages.
    for (const route of ['/search', '/api/v1/search']) {
      expect(pageKeys[route]?.shelf, route).toBe('searches');
    }
    expect(pageKeys['/fixes/[slug]']?.shelf ?? 'pages').toBe('pages');
    for (const route of ['/n/[code]', '/account', '/jobs', '/proofing', '/write', '/fixes/[slug]/edit']) {
      expect(pageKeys[route], route).toBeUndefined();
    }
  });
});
