// renderFixBody on well-formed bodies: every allowed node and mark, the caution label, the reading values, escaping.
import { afterAll, describe, expect, it } from 'vitest';
import type { BodyNode } from '@/lib/tiptap/allowlist';
import { renderFixBody } from '@/server/render/fix-body';
import { closeHtmlParser, parseHtml, unsafeFindings } from './support/html-safety';
import { realisticBody } from './support/realistic-body';

afterAll(closeHtmlParser);

const text = (value: string, marks?: BodyNode['marks']): BodyNode =>
  marks ? { type: 'text', text: value, marks } : { type: 'text', text: value };
const paragraph = (...content: BodyNode[]): BodyNode => ({ type: 'paragraph', content });
const render = (...content: unknown[]): string => {
  const result = renderFixBody({ type: 'doc', content });
  expect(result.ok).toBe(true);
  return result.html;
};

describe('renderFixBody', () => {
  it('renders paragraphs, headings of levels 2 to 4, and hard breaks', () => {
    const html = render(
      { type: 'heading', attrs: { level: 2 }, content: [text('Two')] },
      { type: 'heading', attrs: { level: 3 }, content: [text('Three')] },
      { type: 'heading', attrs: { level: 4 }, content: [text('Four')] },
      paragraph(text('line one'), { type: 'hardBreak' }, text('line two')),
    );
    expect(html).toBe('<h2>Two</h2><h3>Three</h3><h4>Four</h4><p>line one<br/>line two</p>');
  });

  it('renders bullet lists, ordered lists with their start number, and list items', () => {
    const item = (value: string): BodyNode => ({ type: 'listItem', content: [paragraph(text(value))] });
    const html = render(
      { type: 'bulletList', content: [item('belt'), item('tyre')] },
      { type: 'orderedList', attrs: { start: 3 }, content: [item('third')] },
      { type: 'orderedList', attrs: { start: 1 }, content: [item('first')] },
    );
    expect(html).toBe(
      '<ul><li><p>belt</p></li><li><p>tyre</p></li></ul><ol start="3"><li><p>third</p></li></ol><ol><li><p>first</p></li></ol>',
    );
  });

  it('renders blockquotes, code blocks and horizontal rules', () => {
    const html = render(
      { type: 'blockquote', content: [paragraph(text('quoted'))] },
      { type: 'codeBlock', content: [text('ERR 7')] },
      { type: 'horizontalRule' },
    );
    expect(html).toBe('<blockquote><p>quoted</p></blockquote><pre><code>ERR 7</code></pre><hr/>');
  });

  it('renders bold, italic, strike, code and underline marks', () => {
    const html = render(
      paragraph(
        text('b', [{ type: 'bold' }]),
        text('i', [{ type: 'italic' }]),
        text('s', [{ type: 'strike' }]),
        text('c', [{ type: 'code' }]),
        text('u', [{ type: 'underline' }]),
      ),
    );
    expect(html).toBe('<p><strong>b</strong><em>i</em><s>s</s><code>c</code><u>u</u></p>');
  });

  it('renders links with rel="nofollow ugc noopener" and no target', () => {
    const html = render(paragraph(text('chart', [{ type: 'link', attrs: { href: 'https://example.org/belts', target: '_blank' } }])));
    expect(html).toBe('<p><a href="https://example.org/belts" rel="nofollow ugc noopener">chart</a></p>');
  });

  it('renders tables with header cells and spans but no inline styles', () => {
    const cell = (type: string, value: string, attrs?: Record<string, unknown>): unknown => ({
      type,
      attrs,
      content: [paragraph(text(value))],
    });
    const html = render({
      type: 'table',
      content: [
        { type: 'tableRow', content: [cell('tableHeader', 'Part'), cell('tableHeader', 'Qty')] },
        { type: 'tableRow', content: [cell('tableCell', 'Belt', { colspan: 2, colwidth: [120] })] },
      ],
    });
    expect(html).toBe(
      '<div class="body-table"><table><tbody><tr><th><p>Part</p></th><th><p>Qty</p></th></tr>' +
        '<tr><td colspan="2"><p>Belt</p></td></tr></tbody></table></div>',
    );
  });

  it('renders a caution as a note with its label, its paragraphs and the deferral to local codes', () => {
    const html = render({ type: 'caution', attrs: { kind: 'mains' }, content: [paragraph(text('Unplug first.'))] });
    expect(html).toBe(
      '<aside class="caution caution--mains" role="note"><p class="caution__label">Caution: mains voltage</p>' +
        '<p>Unplug first.</p><p class="caution__deferral">Follow your local electrical codes and licensed practice.</p></aside>',
    );
  });

  it('does not repeat the deferral when the caution already defers to local codes', () => {
    const html = render({
      type: 'caution',
      attrs: { kind: 'heat' },
      content: [paragraph(text('Let the regulator cool; follow your local electrical codes and licensed practice.'))],
    });
    expect(html.match(/local electrical codes and licensed practice/g)).toHaveLength(1);
    expect(html).not.toContain('caution__deferral');
  });

  it.each([
    ['stored_charge', 'Caution: stored charge'],
    ['laser', 'Caution: laser radiation'],
    ['heat', 'Caution: hot parts'],
    ['sharp_edges', 'Caution: sharp edges'],
    ['spring', 'Caution: spring under tension'],
  ])('labels a %s caution "%s"', (kind, label) => {
    const html = render({ type: 'caution', attrs: { kind }, content: [paragraph(text('x'))] });
    expect(parseHtml(html).querySelector('.caution__label')?.textContent).toBe(label);
    expect(html).toContain(`class="caution caution--${kind}"`);
  });

  it('renders a reading with its test point, expected value and typical faulty reading', () => {
    const html = render({ type: 'reading', attrs: { testPoint: 'TP12', expected: '5.0 V', measured: '3.1 V', note: 'Deck in stop.' } });
    const pairs = Array.from(parseHtml(html).querySelectorAll('.reading dl > div')).map((row) => [
      row.querySelector('dt')?.textContent,
      row.querySelector('dd')?.textContent,
    ]);
    expect(pairs).toEqual([
      ['Test point', 'TP12'],
      ['Expected', '5.0 V'],
      ['Typical faulty reading', '3.1 V'],
    ]);
    expect(parseHtml(html).querySelector('.reading__note')?.textContent).toBe('Deck in stop.');
  });

  it('leaves out the faulty-reading row and the note when they are empty', () => {
    const html = render({ type: 'reading', attrs: { testPoint: 'TP3', expected: '12 V', measured: '', note: '' } });
    expect(parseHtml(html).querySelectorAll('dt')).toHaveLength(2);
    expect(html).not.toContain('reading__note');
  });

  it('renders a figure with a lazy image, its alt text and its caption', () => {
    const html = render({ type: 'figure', attrs: { src: '/media/a/belt.jpg', alt: 'Belt on pulley', caption: 'Left of the drum.' } });
    expect(html).toBe(
      '<figure class="figure"><img src="/media/a/belt.jpg" alt="Belt on pulley" loading="lazy" decoding="async">' +
        '<figcaption>Left of the drum.</figcaption></figure>',
    );
  });

  it('renders an image with src, alt and title', () => {
    const html = render({ type: 'image', attrs: { src: 'https://img.example.org/x.jpg', alt: 'Underside', title: 'Seen from below' } });
    expect(html).toBe('<img src="https://img.example.org/x.jpg" title="Seen from below" alt="Underside" loading="lazy" decoding="async">');
  });

  it('escapes <, &, and quotes in text, attributes and our own nodes', () => {
    const hostileText = 'R < 10 & "hot" \'x\' <img src=x onerror=alert(1)>';
    const html = render(
      paragraph(text(hostileText)),
      { type: 'reading', attrs: { testPoint: '"><script>alert(1)</script>', expected: '< 5 V & >', measured: '', note: '' } },
      { type: 'figure', attrs: { src: '/media/x.jpg', alt: '" onerror="alert(1)', caption: '<b>&amp;</b>' } },
    );
    expect(html).toContain('<p>R &lt; 10 &amp; &quot;hot&quot; &#39;x&#39; &lt;img src=x onerror=alert(1)&gt;</p>');
    expect(html).toContain('<dd>&quot;&gt;&lt;script&gt;alert(1)&lt;/script&gt;</dd>');
    expect(html).toContain('alt="&quot; onerror=&quot;alert(1)"');
    expect(html).toContain('<figcaption>&lt;b&gt;&amp;amp;&lt;/b&gt;</figcaption>');
    expect(parseHtml(html).querySelector('p')?.textContent).toBe(hostileText);
    expect(unsafeFindings(html)).toEqual([]);
  });

  it('renders a realistic body whole, with nothing unsafe in it', () => {
    const result = renderFixBody(realisticBody);
    expect(result.ok).toBe(true);
    const root = parseHtml(result.html);
    expect(root.querySelectorAll('aside.caution')).toHaveLength(1);
    expect(root.querySelectorAll('a[rel="nofollow ugc noopener"]')).toHaveLength(2);
    expect(root.querySelectorAll('img[loading="lazy"]')).toHaveLength(2);
    expect(unsafeFindings(result.html)).toEqual([]);
  });
});

describe('renderFixBody, built once', () => {
  it('renders exactly what the static renderer renders when it resolves everything afresh', async () => {
    const { renderToHTMLString } = await import('@tiptap/static-renderer/pm/html-string');
    const { getSchema } = await import('@tiptap/core');
    const { bodyExtensions } = await import('@/lib/tiptap/extensions');
    const { sanitiseBody } = await import('@/lib/tiptap/allowlist');
    const { textHtml, linkHtml } = await import('@/server/render/inline-html');
    const nodes = await import('@/server/render/body-node-html');
    const tables = await import('@/server/render/table-html');
    const sanitised = sanitiseBody(realisticBody);
    if ('error' in sanitised) throw new Error(sanitised.error);
    const extensions = bodyExtensions();
    const doc = getSchema(extensions).nodeFromJSON(sanitised.doc);
    const nodeMapping = {
      text: textHtml,
      caution: nodes.cautionHtml,
      reading: nodes.readingHtml,
      figure: nodes.figureHtml,
      image: nodes.imageHtml,
      table: tables.tableHtml,
      tableRow: tables.tableRowHtml,
      tableHeader: tables.tableHeaderHtml,
      tableCell: tables.tableCellHtml,
    };
    const afresh = renderToHTMLString({ content: doc, extensions, options: { nodeMapping, markMapping: { link: linkHtml } } });
    expect(renderFixBody(realisticBody).html).toBe(afresh);
    const pointers = renderToHTMLString({
      content: doc,
      extensions,
      options: { nodeMapping: { ...nodeMapping, caution: nodes.cautionPointerHtml }, markMapping: { link: linkHtml } },
    });
    expect(renderFixBody(realisticBody, { cautionsShownAbove: true }).html).toBe(pointers);
  });
});
