// @vitest-environment happy-dom
// Pasting office-suite HTML into the remedy editor itself (BodyEditor, with its paste hooks) keeps the lists, their
// nesting and their kind, and leaves no typed-out markers in the text.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { act, createElement } from 'react';
import { createRoot, type Root } from 'react-dom/client';
import type { Editor } from '@tiptap/react';
import { BodyEditor } from '@/islands/editor/BodyEditor';
import { bodyPlainText, sanitiseBody, type BodyDoc, type BodyNode } from '@/lib/tiptap/allowlist';

const fixture = readFileSync(join(process.cwd(), 'tests/fixtures/clipboard/office-lists.html'), 'utf8');
// Browsers keep the legacy CSSStyleSheet.rules alias that ProseMirror's paste reads; happy-dom 21 only has cssRules.
if (!('rules' in CSSStyleSheet.prototype)) {
  Object.defineProperty(CSSStyleSheet.prototype, 'rules', {
    get(this: CSSStyleSheet) {
      return this.cssRules;
    },
  });
}
(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

let root: Root | null = null;
afterEach(() => {
  act(() => root?.unmount());
  root = null;
});

function find(node: BodyNode, type: string): BodyNode[] {
  return [...(node.type === type ? [node] : []), ...(node.content ?? []).flatMap((child) => find(child, type))];
}

function mounted(onImageFiles: (files: File[]) => void = () => {}): Editor {
  let editor: Editor | null = null;
  const empty: BodyDoc = { type: 'doc', content: [{ type: 'paragraph' }] };
  const host = document.body.appendChild(document.createElement('div'));
  root = createRoot(host);
  act(() =>
    root!.render(
      createElement(BodyEditor, {
        initial: empty,
        onChange: () => {},
        photos: [],
        onImageFiles,
        onReady: (e: Editor) => (editor = e),
      }),
    ),
  );
  if (!editor) throw new Error('the remedy editor did not start');
  return editor;
}

function pasted(): BodyNode {
  const editor = mounted();
  act(() => expect(editor.view.pasteHTML(fixture)).toBe(true));
  return editor.getJSON() as BodyNode;
}

// A real paste event, as the browser fires it, so the editor's own handlePaste decides between picture and text.
function pasteEvent(editor: Editor, flavours: Record<string, string>, picture?: File): void {
  const data = new DataTransfer();
  for (const [type, value] of Object.entries(flavours)) data.setData(type, value);
  if (picture) data.items.add(picture);
  act(() => {
    editor.view.dom.dispatchEvent(new ClipboardEvent('paste', { clipboardData: data, bubbles: true, cancelable: true }));
  });
}

describe('pasting office-suite HTML into the remedy editor', () => {
  it('gives a numbered list of steps with list items and a bullet list nested in one of them', () => {
    const doc = pasted();
    const [ordered] = find(doc, 'orderedList');
    expect(ordered?.content?.map((n) => n.type)).toEqual(['listItem', 'listItem', 'listItem']);
    const nested = find(ordered!, 'bulletList');
    expect(nested).toHaveLength(1);
    expect(nested[0]?.content).toHaveLength(2);
    expect(JSON.stringify(ordered)).toContain('"bold"');
  });

  it('keeps the interrupting paragraph between the numbered list and a second, bulleted list', () => {
    const doc = pasted();
    const top = (doc.content ?? []).filter((n) => !(n.type === 'paragraph' && !n.content));
    expect(top.map((n) => n.type)).toEqual(['paragraph', 'orderedList', 'paragraph', 'bulletList']);
    expect(find(top[3]!, 'listItem')).toHaveLength(2);
  });

  it('leaves no typed-out markers in the text and passes the body allowlist unchanged', () => {
    const doc = pasted();
    const text = bodyPlainText(doc as BodyDoc);
    for (const marker of ['1.', '2.', '3.', '·', '\u00a0']) expect(text).not.toContain(marker);
    expect(text).not.toMatch(/(^|\s)o\s/);
    expect(text).toContain('Unplug the deck and remove the top cover.');
    const clean = sanitiseBody(doc);
    expect('doc' in clean && clean.dropped).toEqual([]);
  });
});

describe('a paste that carries office-suite text beside a picture of it', () => {
  const picture = () => new File([new Uint8Array([137, 80, 78, 71])], 'image.png', { type: 'image/png' });

  it('is taken as the text with its lists, and the picture is not uploaded', () => {
    const uploads: File[][] = [];
    const editor = mounted((files) => uploads.push(files));
    pasteEvent(editor, { 'text/html': fixture, 'text/plain': 'Unplug the deck and remove the top cover.' }, picture());
    expect(uploads).toEqual([]);
    expect(find(editor.getJSON() as BodyNode, 'orderedList')).toHaveLength(1);
  });

  it('still uploads a picture pasted on its own or beside ordinary HTML', () => {
    const uploads: File[][] = [];
    const editor = mounted((files) => uploads.push(files));
    pasteEvent(editor, {}, picture());
    pasteEvent(editor, { 'text/html': '<img src="https://example.test/a.png">', 'text/plain': 'a picture' }, picture());
    expect(uploads.map((files) => files.map((f) => f.name))).toEqual([['image.png'], ['image.png']]);
  });
});
