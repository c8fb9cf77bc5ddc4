// Reference check with sanitize-html: a strict allowlist removes nothing from what our renderer emits.
import sanitizeHtml from 'sanitize-html';
import { afterAll, describe, expect, it } from 'vitest';
import { renderFixBody } from '@/server/render/fix-body';
import { closeHtmlParser, tagOutline } from './support/html-safety';
import { realisticBody } from './support/realistic-body';

afterAll(closeHtmlParser);

// The tags and attributes a fix body may show; anything our renderer emits beyond this is a renderer bug.
const strictAllowlist: sanitizeHtml.IOptions = {
  allowedTags: [
    'p',
    'br',
    'h2',
    'h3',
    'h4',
    'strong',
    'em',
    's',
    'u',
    'code',
    'pre',
    'a',
    'ul',
    'ol',
    'li',
    'blockquote',
    'hr',
    'div',
    'table',
    'tbody',
    'tr',
    'th',
    'td',
    'aside',
    'dl',
    'dt',
    'dd',
    'figure',
    'figcaption',
    'img',
  ],
  allowedAttributes: {
    a: ['href', 'rel'],
    img: ['src', 'alt', 'title', 'loading', 'decoding'],
    ol: ['start'],
    th: ['colspan', 'rowspan'],
    td: ['colspan', 'rowspan'],
    aside: ['class', 'role'],
    div: ['class', 'role'],
    p: ['class'],
    figure: ['class'],
  },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: { img: ['https'] },
  allowProtocolRelative: false,
  disallowedTagsMode: 'discard',
};

describe('renderFixBody output under a strict sanitize-html allowlist', () => {
  it('keeps every element and attribute of a realistic body', () => {
    const { html, ok } = renderFixBody(realisticBody);
    expect(ok).toBe(true);
    const outline = tagOutline(html);
    expect(outline.length).toBeGreaterThan(60);
    expect(tagOutline(sanitizeHtml(html, strictAllowlist))).toEqual(outline);
  });

  it('keeps the placeholder block as well', () => {
    const { html } = renderFixBody(null);
    expect(sanitizeHtml(html, strictAllowlist)).toBe(html);
  });

  it('would catch an element outside the allowlist (the check can fail)', () => {
    const tampered = `${renderFixBody(realisticBody).html}<span style="x">extra</span>`;
    expect(tagOutline(sanitizeHtml(tampered, strictAllowlist))).not.toEqual(tagOutline(tampered));
  });
});
