// renderFixBody on hostile and broken input: safe HTML or the "could not be shown" block, and never an exception.
import { afterAll, describe, expect, it } from 'vitest';
import { renderFailedHtml, renderFixBody } from '@/server/render/fix-body';
import { closeHtmlParser, parseHtml, unsafeFindings } from './support/html-safety';

afterAll(closeHtmlParser);

const doc = (...content: unknown[]): unknown => ({ type: 'doc', content });
const paragraph = (...content: unknown[]): unknown => ({ type: 'paragraph', content });
const linked = (href: string): unknown => paragraph({ type: 'text', text: 'click', marks: [{ type: 'link', attrs: { href } }] });

function nested(depth: number): unknown {
  let node: unknown = { type: 'text', text: 'deep' };
  for (let level = 0; level < depth; level += 1) node = { type: 'blockquote', content: [node] };
  return doc(node);
}

describe('renderFixBody with hostile input', () => {
  it('drops a script node together with its text', () => {
    const result = renderFixBody(
      doc({ type: 'script', content: [{ type: 'text', text: 'alert(1)' }] }, paragraph({ type: 'text', text: 'ok' })),
    );
    expect(result).toEqual({ ok: true, html: '<p>ok</p>' });
  });

  it('drops onerror, onclick and style attributes from every node', () => {
    const result = renderFixBody(
      doc(
        { type: 'paragraph', attrs: { onclick: 'alert(1)', style: 'color:red' }, content: [{ type: 'text', text: 'x' }] },
        { type: 'image', attrs: { src: '/media/a.jpg', alt: 'a', onerror: 'alert(1)', style: 'x' } },
        { type: 'figure', attrs: { src: '/media/b.jpg', alt: 'b', caption: '', onload: 'alert(1)' } },
      ),
    );
    expect(result.ok).toBe(true);
    expect(result.html).not.toMatch(/onerror|onclick|onload|style=/i);
    expect(unsafeFindings(result.html)).toEqual([]);
  });

  it.each([
    'javascript:alert(1)',
    'JaVaScRiPt:alert(1)',
    ' javascript:alert(1)',
    'java\tscript:alert(1)',
    'data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==',
    'vbscript:msgbox(1)',
    '//example.org/protocol-relative',
    '/relative/path',
    'https://example.org/"><script>alert(1)</script>',
  ])('removes a link to %j but keeps its text', (href) => {
    const result = renderFixBody(doc(linked(href)));
    expect(result).toEqual({ ok: true, html: '<p>click</p>' });
  });

  it.each([
    'data:image/png;base64,iVBORw0KGgo=',
    'javascript:alert(1)',
    'http://example.org/a.jpg',
    'x',
    '/media/../secret',
    '//example.org/a.jpg',
  ])('removes an image whose src is %j', (src) => {
    const result = renderFixBody(
      doc({ type: 'image', attrs: { src, alt: 'a' } }, { type: 'figure', attrs: { src, alt: 'b', caption: 'c' } }),
    );
    expect(result.ok).toBe(true);
    expect(parseHtml(result.html).querySelectorAll('img')).toHaveLength(0);
  });

  it('shows markup typed into text as text, not as an element', () => {
    const result = renderFixBody(doc(paragraph({ type: 'text', text: '<img src=x onerror=alert(1)>' })));
    expect(result.html).toBe('<p>&lt;img src=x onerror=alert(1)&gt;</p>');
    expect(parseHtml(result.html).querySelectorAll('img')).toHaveLength(0);
  });

  it('keeps the text of unknown node types as plain paragraphs', () => {
    const result = renderFixBody(doc({ type: 'mentionBox', attrs: { id: 7 }, content: [{ type: 'text', text: 'kept words' }] }));
    expect(result).toEqual({ ok: true, html: '<p>kept words</p>' });
  });

  it('turns a caution of unknown kind into plain paragraphs, not a caution box', () => {
    const result = renderFixBody(
      doc({ type: 'caution', attrs: { kind: '"><script>' }, content: [paragraph({ type: 'text', text: 'careful' })] }),
    );
    expect(result).toEqual({ ok: true, html: '<p>careful</p>' });
  });

  it('shows the placeholder block for a 10,000-deep nesting, without a stack overflow', () => {
    expect(renderFixBody(nested(10_000))).toEqual({ ok: false, html: renderFailedHtml });
  });

  it('still renders a nesting within the depth limit', () => {
    const result = renderFixBody(nested(30));
    expect(result.ok).toBe(true);
    expect(parseHtml(result.html).querySelectorAll('blockquote')).toHaveLength(30);
  });

  it.each([
    ['null', null],
    ['undefined', undefined],
    ['a string', '<script>alert(1)</script>'],
    ['a number', 42],
    ['a boolean', true],
    ['an array', [{ type: 'doc', content: [] }]],
    ['an object without a type', { content: [] }],
    ['a paragraph at the root', { type: 'paragraph', content: [{ type: 'text', text: 'x' }] }],
    ['a doc whose content is a string', { type: 'doc', content: '<p>x</p>' }],
  ])('shows the placeholder block for %s', (_label, input) => {
    expect(renderFixBody(input)).toEqual({ ok: false, html: renderFailedHtml });
  });

  it('shows the placeholder block for a cyclic object', () => {
    const loop: { type: string; content: unknown[] } = { type: 'blockquote', content: [] };
    loop.content.push(loop);
    expect(renderFixBody(doc(loop))).toEqual({ ok: false, html: renderFailedHtml });
  });

  it('shows the placeholder block when reading the input throws', () => {
    const trap = {};
    Object.defineProperty(trap, 'type', {
      enumerable: true,
      get: () => {
        throw new Error('trap');
      },
    });
    expect(renderFixBody(doc(trap))).toEqual({ ok: false, html: renderFailedHtml });
    const revoked = Proxy.revocable({}, {});
    revoked.revoke();
    expect(renderFixBody(revoked.proxy)).toEqual({ ok: false, html: renderFailedHtml });
  });

  it('tells the caller why it fell back', () => {
    const reasons: string[] = [];
    renderFixBody('not json', { onFailure: (reason) => reasons.push(reason) });
    expect(reasons).toEqual(['The body must be a JSON object of type "doc".']);
  });

  it('still answers with the placeholder when the failure callback itself throws', () => {
    const throwing = (): void => {
      throw new Error('logger down');
    };
    expect(renderFixBody(null, { onFailure: throwing })).toEqual({ ok: false, html: renderFailedHtml });
  });

  it('skips malformed children but renders the rest', () => {
    const result = renderFixBody(doc(null, 'text', 7, [], { type: 42 }, paragraph({ type: 'text', text: 'survivor' }), { type: 'text' }));
    expect(result).toEqual({ ok: true, html: '<p>survivor</p>' });
  });

  it('clamps a huge colspan instead of looping over it', () => {
    const cell = { type: 'tableCell', attrs: { colspan: 1e9, rowspan: -5 }, content: [paragraph({ type: 'text', text: 'x' })] };
    const result = renderFixBody(doc({ type: 'table', content: [{ type: 'tableRow', content: [cell] }] }));
    expect(result.html).toContain('<td colspan="20">');
  });
});
