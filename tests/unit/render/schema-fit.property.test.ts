// Property checks over random trees (fast-check): sanitised bodies always fit the editor's schema, renders are always safe.
import { getSchema } from '@tiptap/core';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { allowedNodeTypes, sanitiseBody } from '@/lib/tiptap/allowlist';
import { bodyExtensions } from '@/lib/tiptap/extensions';
import { renderFixBody } from '@/server/render/fix-body';
import { closeHtmlParser, unsafeFindings } from './support/html-safety';

afterAll(closeHtmlParser);

const schema = getSchema(bodyExtensions());

const hostileString = fc.oneof(
  fc.string({ maxLength: 12 }),
  fc.constantFrom(
    '<script>alert(1)</script>',
    '"><img src=x onerror=alert(1)>',
    'javascript:alert(1)',
    ' JaVaScRiPt:alert(1)',
    'data:text/html,<b>x</b>',
    '/media/x.jpg',
    'https://example.org/a.jpg',
    'mailto:desk@example.org',
    '/media/../x',
    '',
  ),
);
const attrValue = fc.oneof(
  hostileString,
  fc.integer({ min: -5, max: 1e9 }),
  fc.constant(null),
  fc.constantFrom('mains', 'laser', 'spring', 3),
);
const attrs = fc.dictionary(
  fc.constantFrom(
    'level',
    'start',
    'colspan',
    'rowspan',
    'src',
    'alt',
    'caption',
    'kind',
    'testPoint',
    'expected',
    'href',
    'onerror',
    'style',
  ),
  attrValue,
  { maxKeys: 4 },
);
const nodeType = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom(...allowedNodeTypes) },
  { weight: 1, arbitrary: fc.constantFrom('script', 'iframe', 'mention', 'doc', 'TEXT', '') },
);
const mark = fc.record({
  type: fc.constantFrom('bold', 'italic', 'code', 'link', 'link', 'highlight'),
  attrs: fc.option(attrs, { nil: undefined }),
});

const { node } = fc.letrec<{ node: unknown }>((tie) => ({
  node: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    fc.record({ type: fc.constant('text'), text: hostileString, marks: fc.option(fc.array(mark, { maxLength: 3 }), { nil: undefined }) }),
    fc.record({
      type: nodeType,
      attrs: fc.option(attrs, { nil: undefined }),
      content: fc.option(fc.array(tie('node'), { maxLength: 4 }), { nil: undefined }),
    }),
    fc.constantFrom(null, 'loose string', 7),
  ),
}));
const body = fc.record({ type: fc.constant('doc'), content: fc.array(node, { maxLength: 5 }) });

describe('sanitiseBody and renderFixBody on random trees', () => {
  it('always produce a document the editor schema accepts', () => {
    fc.assert(
      fc.property(body, (input) => {
        const result = sanitiseBody(input);
        if ('error' in result) return;
        expect(() => schema.nodeFromJSON(result.doc).check()).not.toThrow();
      }),
      { numRuns: 400 },
    );
  });

  it('always render with ok true and nothing that could run or load code', () => {
    fc.assert(
      fc.property(body, (input) => {
        const result = renderFixBody(input);
        expect(result.ok).toBe(true);
        expect(unsafeFindings(result.html)).toEqual([]);
      }),
      { numRuns: 400 },
    );
  });

  it('leave an already clean body unchanged when sanitised twice', () => {
    fc.assert(
      fc.property(body, (input) => {
        const first = sanitiseBody(input);
        if ('error' in first) return;
        const second = sanitiseBody(first.doc);
        expect(second).toEqual({ doc: first.doc, dropped: expect.any(Array) });
        if ('doc' in second) expect(second.doc).toEqual(first.doc);
      }),
      { numRuns: 300 },
    );
  });
});
