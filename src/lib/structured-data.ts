// Structured data for search engines: schema.org TechArticle in JSON-LD for a fix, and the text that goes inside
// its <script type="application/ld+json"> element. Pure.
import type { Difficulty } from '@/lib/schemas/revision';

export interface FixArticleFacts {
  url: string;
  title: string;
  description: string;
  symptoms: string[];
  errorCodes: string[];
  machines: { maker: string; model: string }[];
  authorName: string;
  published: Date | null;
  modified: Date | null;
  difficulty: Difficulty | null;
  image: string | null;
}

/** schema.org's proficiencyLevel takes "Beginner" or "Expert"; our four levels fold onto them. */
const proficiency: Record<Difficulty, 'Beginner' | 'Expert'> = {
  routine: 'Beginner',
  careful: 'Beginner',
  skilled: 'Expert',
  specialist: 'Expert',
};

/** A fix as a schema.org TechArticle: what it is about (the machines), who wrote it, when it was proofed. */
export function fixArticleJsonLd(fix: FixArticleFacts, siteName: string): Record<string, unknown> {
  return {
    '@context': 'https://schema.org',
    '@type': 'TechArticle',
    headline: fix.title.slice(0, 110),
    name: fix.title,
    description: fix.description,
    url: fix.url,
    mainEntityOfPage: fix.url,
    keywords: [...fix.symptoms, ...fix.errorCodes].join(', '),
    about: fix.machines.map((m) => ({ '@type': 'Product', name: `${m.maker} ${m.model}`, brand: { '@type': 'Brand', name: m.maker } })),
    author: { '@type': 'Person', name: fix.authorName },
    publisher: { '@type': 'Organization', name: siteName },
    ...(fix.published ? { datePublished: fix.published.toISOString() } : {}),
    ...(fix.modified ? { dateModified: fix.modified.toISOString() } : {}),
    ...(fix.difficulty ? { proficiencyLevel: proficiency[fix.difficulty] } : {}),
    ...(fix.image ? { image: fix.image } : {}),
    isAccessibleForFree: true,
  };
}

/**
 * JSON for inside a script element: `<`, `>` and `&` as \u escapes, so no text a writer typed can close the
 * element or open a comment (the JSON still parses to the same value), and U+2028/2029 escaped for old parsers.
 */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/>/g, '\\u003e')
    .replace(/&/g, '\\u0026')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}
