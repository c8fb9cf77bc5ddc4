// sanitiseBody: what it keeps, removes, reshapes and refuses, and the notes it leaves in `dropped`.
import { describe, expect, it } from 'vitest';
import { bodyLimits, sanitiseBody, type BodyDoc } from '@/lib/tiptap/allowlist';

const doc = (...content: unknown[]): unknown => ({ type: 'doc', content });
const paragraph = (...content: unknown[]): unknown => ({ type: 'paragraph', content });
const text = (value: string, marks?: unknown[]): unknown => (marks ? { type: 'text', text: value, marks } : { type: 'text', text: value });

function clean(input: unknown): { doc: BodyDoc; dropped: string[] } {
  const result = sanitiseBody(input);
  if ('error' in result) throw new Error(`expected a document, got: ${result.error}`);
  return result;
}

describe('sanitiseBody', () => {
  it('keeps a clean body as it is and notes nothing', () => {
    const input = doc(
      { type: 'heading', attrs: { level: 3 }, content: [text('Cause')] },
      paragraph(text('Dry joints', [{ type: 'bold' }])),
    );
    expect(clean(input)).toEqual({ doc: input, dropped: [] });
  });

  it('unwraps unknown nodes, keeping their text, and notes them', () => {
    const result = clean(doc({ type: 'callout', content: [text('keep me')] }));
    expect(result.doc.content).toEqual([paragraph(text('keep me'))]);
    expect(result.dropped).toEqual(['node callout removed, its text kept']);
  });

  it('removes script, style and iframe nodes with their content', () => {
    const result = clean(
      doc(
        { type: 'script', content: [text('alert(1)')] },
        { type: 'STYLE', content: [text('body{}')] },
        { type: 'iframe', attrs: { src: 'https://example.org' } },
      ),
    );
    expect(result.doc.content).toEqual([{ type: 'paragraph' }]);
    expect(result.dropped).toContain('node script removed with its content');
  });

  it('removes unknown marks and attributes but not the quiet defaults the editor writes', () => {
    const result = clean(
      doc(
        {
          type: 'paragraph',
          attrs: { textAlign: 'center', dir: null },
          content: [text('x', [{ type: 'highlight', attrs: { color: 'red' } }, { type: 'italic' }])],
        },
        { type: 'codeBlock', attrs: { language: null }, content: [text('y')] },
      ),
    );
    expect(result.doc.content).toEqual([paragraph(text('x', [{ type: 'italic' }])), { type: 'codeBlock', content: [text('y')] }]);
    expect(result.dropped).toEqual(['attribute paragraph.textAlign removed', 'mark highlight removed']);
  });

  it('keeps http, https and mailto links and keeps only their href', () => {
    const marks = (href: string): unknown[] => [{ type: 'link', attrs: { href, target: '_blank', rel: 'noopener', class: null } }];
    const result = clean(
      doc(
        paragraph(
          text('a', marks('http://example.org/')),
          text('b', marks('https://example.org/x')),
          text('c', marks('mailto:desk@example.org')),
        ),
      ),
    );
    const hrefs = (result.doc.content[0]?.content ?? []).map((node) => node.marks?.[0]?.attrs?.href);
    expect(hrefs).toEqual(['http://example.org/', 'https://example.org/x', 'mailto:desk@example.org']);
    expect(result.dropped).toEqual([]);
  });

  it('removes a link mark with a javascript: or data: href and keeps the text', () => {
    const result = clean(
      doc(
        paragraph(
          text('one', [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }, { type: 'bold' }]),
          text('two', [{ type: 'link', attrs: { href: 'data:text/html,<b>x</b>' } }]),
        ),
      ),
    );
    expect(result.doc.content).toEqual([paragraph(text('one', [{ type: 'bold' }]), text('two'))]);
    expect(result.dropped).toEqual(['link removed: its href is not http, https or mailto']);
  });

  it('allows image and figure sources under /media/ or on https only', () => {
    const picture = (src: string): unknown => ({ type: 'image', attrs: { src, alt: 'a' } });
    const result = clean(
      doc(
        picture('/media/x.jpg'),
        picture('https://img.example.org/x.jpg'),
        picture('http://img.example.org/x.jpg'),
        picture('data:image/png;base64,AA=='),
        picture('/uploads/x.jpg'),
      ),
    );
    expect(result.doc.content.map((node) => node.attrs?.src)).toEqual(['/media/x.jpg', 'https://img.example.org/x.jpg']);
  });

  it.each([
    [1, 2],
    [2, 2],
    [3, 3],
    [4, 4],
    [6, 4],
    ['3', 3],
    [-10, 2],
    ['big', 2],
    [undefined, 2],
  ])('clamps heading level %j to %j', (level, expected) => {
    const result = clean(doc({ type: 'heading', attrs: { level }, content: [text('H')] }));
    expect(result.doc.content[0]?.attrs?.level).toBe(expected);
  });

  it('keeps each of the six caution kinds', () => {
    for (const kind of ['mains', 'stored_charge', 'laser', 'heat', 'sharp_edges', 'spring']) {
      const result = clean(doc({ type: 'caution', attrs: { kind }, content: [paragraph(text('x'))] }));
      expect(result.doc.content[0]).toEqual({ type: 'caution', attrs: { kind }, content: [paragraph(text('x'))] });
    }
  });

  it('turns a caution of unknown kind into plain paragraphs', () => {
    const result = clean(doc({ type: 'caution', attrs: { kind: 'radiation' }, content: [paragraph(text('a')), paragraph(text('b'))] }));
    expect(result.doc.content).toEqual([paragraph(text('a')), paragraph(text('b'))]);
    expect(result.dropped).toEqual(['caution with an unknown kind turned into plain paragraphs']);
  });

  it('keeps only paragraphs inside a caution, opening up lists and headings', () => {
    const result = clean(
      doc({
        type: 'caution',
        attrs: { kind: 'laser' },
        content: [
          { type: 'heading', attrs: { level: 2 }, content: [text('Laser')] },
          { type: 'bulletList', content: [{ type: 'listItem', content: [paragraph(text('Do not look into the lens.'))] }] },
        ],
      }),
    );
    expect(result.doc.content[0]?.content).toEqual([paragraph(text('Laser')), paragraph(text('Do not look into the lens.'))]);
  });

  it('wraps loose text in paragraphs and gives list items a leading paragraph', () => {
    const result = clean(
      doc(text('loose'), { type: 'bulletList', content: [{ type: 'listItem', content: [{ type: 'codeBlock', content: [text('c')] }] }] }),
    );
    expect(result.doc.content).toEqual([
      paragraph(text('loose')),
      {
        type: 'bulletList',
        content: [{ type: 'listItem', content: [{ type: 'paragraph' }, { type: 'codeBlock', content: [text('c')] }] }],
      },
    ]);
  });

  it('keeps only one mark of each type, and only the code mark on inline code', () => {
    const result = clean(
      doc(paragraph(text('x', [{ type: 'bold' }, { type: 'bold' }]), text('y', [{ type: 'code' }, { type: 'italic' }]))),
    );
    expect(result.doc.content).toEqual([paragraph(text('x', [{ type: 'bold' }]), text('y', [{ type: 'code' }]))]);
  });

  it('removes a reading with neither test point nor expected value, and bounds the fields of the others', () => {
    const result = clean(
      doc(
        { type: 'reading', attrs: { testPoint: '', expected: '', measured: '1 V' } },
        { type: 'reading', attrs: { testPoint: 'T'.repeat(500), expected: 5, measured: null } },
      ),
    );
    expect(result.doc.content).toEqual([{ type: 'reading', attrs: { testPoint: 'T'.repeat(120), expected: '5', measured: '', note: '' } }]);
    expect(result.dropped).toContain('reading.testPoint: shortened to 120 characters');
  });

  it('gives an empty document one empty paragraph, which the schema needs', () => {
    expect(clean({ type: 'doc' }).doc).toEqual({ type: 'doc', content: [{ type: 'paragraph' }] });
  });

  it(`refuses a body nested deeper than ${bodyLimits.maxDepth} levels`, () => {
    let node: unknown = paragraph(text('x'));
    for (let level = 0; level < bodyLimits.maxDepth; level += 1) node = { type: 'blockquote', content: [node] };
    expect(sanitiseBody(doc(node))).toEqual({ error: `The body is nested more than ${bodyLimits.maxDepth} levels deep.` });
  });

  it(`refuses a body of more than ${bodyLimits.maxNodes} nodes`, () => {
    const many = Array.from({ length: bodyLimits.maxNodes }, () => ({ type: 'horizontalRule' }));
    expect(sanitiseBody(doc(...many))).toEqual({ error: `The body has more than ${bodyLimits.maxNodes} nodes.` });
    expect('doc' in sanitiseBody(doc(...many.slice(1)))).toBe(true);
  });

  it(`refuses a body with more than ${bodyLimits.maxTextLength} characters of text`, () => {
    const half = 'a'.repeat(bodyLimits.maxTextLength / 2);
    expect('doc' in sanitiseBody(doc(paragraph(text(half)), paragraph(text(half))))).toBe(true);
    expect(sanitiseBody(doc(paragraph(text(half)), paragraph(text(`${half}b`))))).toEqual({
      error: `The body's text is longer than ${bodyLimits.maxTextLength} characters.`,
    });
  });

  it('refuses anything that is not a document object', () => {
    for (const input of [null, undefined, 'doc', 3, [], { type: 'paragraph' }, { type: 'doc', content: {} }]) {
      expect(sanitiseBody(input)).toEqual({ error: 'The body must be a JSON object of type "doc".' });
    }
  });

  it('does not change its input', () => {
    const input = doc({
      type: 'heading',
      attrs: { level: 1, id: 'x' },
      content: [text('H', [{ type: 'link', attrs: { href: 'javascript:x' } }])],
    });
    const copy = structuredClone(input);
    sanitiseBody(input);
    expect(input).toEqual(copy);
  });
});
