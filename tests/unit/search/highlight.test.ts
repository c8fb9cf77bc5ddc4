// Highlighted snippets are safe: hostile text stays text, and the only tag that can appear is <mark>.
import { describe, expect, it } from 'vitest';
import { fc, test } from '@fast-check/vitest';
import { MARK_END, MARK_START, escapeHtml, markedHtml, stripMarks } from '@/lib/search/highlight';

describe('markedHtml', () => {
  it('turns the markers into <mark> and escapes the rest', () => {
    expect(markedHtml(`${MARK_START}Tray${MARK_END} won't <close>`)).toBe('<mark>Tray</mark> won&#39;t &lt;close&gt;');
  });
  it('keeps a script in a fix title as harmless text', () => {
    const html = markedHtml(`<script>alert(1)</script> ${MARK_START}<img src=x onerror=alert(1)>${MARK_END}`);
    expect(html).not.toMatch(/<(?!\/?mark>)/);
    expect(html).toContain('&lt;script&gt;');
  });
  it('drops stray and nested markers, and closes an open mark', () => {
    expect(markedHtml(`${MARK_END}a${MARK_START}${MARK_START}b`)).toBe('a<mark>b</mark>');
  });
  test.prop([fc.string({ maxLength: 200 })])('never lets any tag but <mark> through', (text) => {
    const html = markedHtml(text.replace(/x/g, MARK_START).replace(/y/g, MARK_END));
    expect(html.replace(/<\/?mark>/g, '')).not.toMatch(/[<>]/);
  });
});

describe('escapeHtml and stripMarks', () => {
  it('escape the five HTML specials and remove markers', () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;');
    expect(stripMarks(`${MARK_START}tray${MARK_END}`)).toBe('tray');
  });
});
