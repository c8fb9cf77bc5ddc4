// JSON-LD for fix pages: a schema.org TechArticle that names the fix, and text that cannot break out of its element.
import { describe, expect, it } from 'vitest';
import { fixArticleJsonLd, jsonForScript } from '@/lib/structured-data';

const facts = {
  url: 'https://bench.example/fixes/tray-will-not-close',
  title: 'Tray will not close: worn loading belt',
  description: 'Tray opens and shuts again. The loading belt has stretched.',
  symptoms: ['Tray will not close'],
  errorCodes: ['E-17'],
  machines: [{ maker: 'Corvale', model: 'DX-410' }],
  authorName: 'Ada Brennecke',
  published: new Date('2026-11-02T09:00:00Z'),
  modified: new Date('2026-11-20T09:00:00Z'),
  difficulty: 'careful' as const,
  image: null,
};

describe('fixArticleJsonLd', () => {
  it('describes the fix as a TechArticle about its machines', () => {
    const data = fixArticleJsonLd(facts, 'Benchlore');
    expect(data).toMatchObject({
      '@context': 'https://schema.org',
      '@type': 'TechArticle',
      headline: facts.title,
      url: facts.url,
      keywords: 'Tray will not close, E-17',
      about: [{ '@type': 'Product', name: 'Corvale DX-410', brand: { '@type': 'Brand', name: 'Corvale' } }],
      author: { '@type': 'Person', name: 'Ada Brennecke' },
      datePublished: '2026-11-02T09:00:00.000Z',
      dateModified: '2026-11-20T09:00:00.000Z',
      proficiencyLevel: 'Beginner',
    });
    expect(data).not.toHaveProperty('image');
  });
});

describe('jsonForScript', () => {
  it('parses back to the same value and never contains a closing tag or comment opener', () => {
    const hostile = { name: '</script><script>alert(1)</script> <!-- & \u2028' };
    const text = jsonForScript(hostile);
    expect(text).not.toMatch(/<\/script|<!--|[<>&\u2028]/i);
    expect(JSON.parse(text)).toEqual(hostile);
  });
});
