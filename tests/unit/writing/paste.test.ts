// @vitest-environment happy-dom
// Pasting from a word processor through ProseMirror's own clipboard parser keeps lists, nesting and tables, and
// drops what the body may not hold (embedded data: pictures, javascript: links, scripts).
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { Editor } from '@tiptap/core';
import { bodyExtensions } from '@/lib/tiptap/extensions';
import { sanitiseBody, type BodyNode } from '@/lib/tiptap/allowlist';

const fixture = readFileSync(join(process.cwd(), 'tests/fixtures/clipboard/word-processor.html'), 'utf8');
// Browsers keep the legacy CSSStyleSheet.rules alias that ProseMirror's paste reads; happy-dom 21 only has cssRules.
if (!('rules' in CSSStyleSheet.prototype)) {
  Object.defineProperty(CSSStyleSheet.prototype, 'rules', {
    get(this: CSSStyleSheet) {
      return this.cssRules;
    },
  });
}
let editor: Editor | null = null;
afterEach(() => editor?.destroy());

function find(node: BodyNode, type: string): BodyNode[] {
  return [...(node.type === type ? [node] : []), ...(node.content ?? []).flatMap((child) => find(child, type))];
}

function pasted(): BodyNode {
  editor = new Editor({ element: document.createElement('div'), extensions: bodyExtensions(), content: '<p></p>' });
  expect(editor.view.pasteHTML(fixture)).toBe(true);
  return editor.getJSON() as BodyNode;
}

describe('pasting word-processor HTML into the remedy', () => {
  it('keeps the numbered steps, the nested bullet list and the heading', () => {
    const doc = pasted();
    const [ordered] = find(doc, 'orderedList');
    expect(ordered?.content).toHaveLength(3);
    expect(find(ordered!, 'bulletList')).toHaveLength(1);
    expect(find(doc, 'heading')[0]?.attrs?.level).toBe(2);
    expect(JSON.stringify(doc)).toContain('"bold"');
  });

  it('keeps the table with its rows and cells', () => {
    const doc = pasted();
    const [table] = find(doc, 'table');
    expect(table?.content).toHaveLength(2);
    expect(find(table!, 'tableCell').length + find(table!, 'tableHeader').length).toBe(4);
    expect(JSON.stringify(table)).toContain('92 mm × 4 mm flat');
  });

  it('drops data: pictures, javascript: links and scripts, and the result passes the body allowlist unchanged', () => {
    const doc = pasted();
    const text = JSON.stringify(doc);
    expect(find(doc, 'image')).toHaveLength(0);
    expect(text).not.toContain('javascript:');
    expect(text).not.toContain('pasted script');
    expect(text).toContain('https://example.test/belts');
    const clean = sanitiseBody(doc);
    expect('doc' in clean && clean.dropped).toEqual([]);
  });
});
