// The renderer's own mappings stay safe when handed nodes the sanitiser never saw (defence in depth).
import { getSchema } from '@tiptap/core';
import { describe, expect, it } from 'vitest';
import { bodyExtensions } from '@/lib/tiptap/extensions';
import { cautionHtml, figureHtml, imageHtml, type NodeHtmlProps } from '@/server/render/body-node-html';
import { linkHtml } from '@/server/render/inline-html';
import { escapeHtml } from '@/server/render/escape';

const schema = getSchema(bodyExtensions());
const props = (node: NodeHtmlProps['node']): NodeHtmlProps => ({ node, children: [], renderElement: () => '' });

describe('render mappings', () => {
  it('link mapping leaves out the anchor for a javascript: href', () => {
    const mark = schema.marks.link!.create({ href: 'javascript:alert(1)' });
    expect(linkHtml({ mark, children: ['text'], node: schema.text('text') })).toBe('text');
  });

  it('image and figure mappings refuse an unsafe src instead of emitting it', () => {
    expect(() => imageHtml(props(schema.nodes.image!.create({ src: 'javascript:alert(1)', alt: 'x' })))).toThrow('unsafe src');
    expect(() => figureHtml(props(schema.nodes.figure!.create({ src: 'data:image/png,AA', alt: 'x' })))).toThrow('unsafe src');
  });

  it('caution mapping refuses a kind outside the six', () => {
    const caution = schema.nodes.caution!.create({ kind: '"><script>' }, schema.nodes.paragraph!.create());
    expect(() => cautionHtml(props(caution))).toThrow('known kind');
  });

  it('escapeHtml escapes the five characters that matter in text and attributes', () => {
    expect(escapeHtml(`<a href="x" title='y'>&</a>`)).toBe('&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;&lt;/a&gt;');
  });
});
