// The editor side of our nodes: bodyExtensions builds a schema whose HTML (renderHTML) parses back (parseHTML) unchanged.
import { getSchema } from '@tiptap/core';
import { DOMParser as PMDOMParser, DOMSerializer } from '@tiptap/pm/model';
import { Window } from 'happy-dom';
import { afterAll, describe, expect, it } from 'vitest';
import { allowedMarkTypes, allowedNodeTypes, sanitiseBody, type BodyDoc } from '@/lib/tiptap/allowlist';
import { bodyExtensions } from '@/lib/tiptap/extensions';
import { realisticBody } from './support/realistic-body';

const window = new Window();
afterAll(() => window.happyDOM.close());
const schema = getSchema(bodyExtensions());

/** Serialises a document to DOM the way the editor would, then parses that DOM back. */
function throughEditorHtml(doc: BodyDoc): { json: unknown; html: string } {
  const container = window.document.createElement('div');
  const fragment = DOMSerializer.fromSchema(schema).serializeFragment(schema.nodeFromJSON(doc).content, {
    document: window.document as unknown as Document,
  });
  container.appendChild(fragment as never);
  const parsed = PMDOMParser.fromSchema(schema).parse(container as unknown as HTMLElement);
  return { json: parsed.toJSON(), html: container.innerHTML };
}

function sanitised(input: unknown): BodyDoc {
  const result = sanitiseBody(input);
  if ('error' in result) throw new Error(result.error);
  return result.doc;
}

describe('bodyExtensions', () => {
  it('gives a schema with exactly the allowed nodes and marks', () => {
    expect(Object.keys(schema.nodes).sort()).toEqual([...allowedNodeTypes].sort());
    expect(Object.keys(schema.marks).sort()).toEqual([...allowedMarkTypes].sort());
  });

  it('declares caution as a block of paragraphs, and reading and figure as block atoms', () => {
    expect(schema.nodes.caution?.spec.content).toBe('paragraph+');
    expect(schema.nodes.caution?.spec.group).toBe('block');
    expect(schema.nodes.reading?.spec.atom).toBe(true);
    expect(schema.nodes.figure?.spec.atom).toBe(true);
    expect(schema.nodes.reading?.isBlock).toBe(true);
  });

  it('fills attribute defaults for our nodes', () => {
    expect(schema.nodes.caution?.create(null, schema.nodes.paragraph?.create()).attrs).toEqual({ kind: 'mains' });
    expect(schema.nodes.reading?.create().attrs).toEqual({ testPoint: '', expected: '', measured: '', note: '' });
    expect(schema.nodes.figure?.create().attrs).toEqual({ src: '', alt: '', caption: '' });
  });

  it('parses a caution, a reading and a figure back from the HTML it renders', () => {
    const doc = sanitised({
      type: 'doc',
      content: [
        {
          type: 'caution',
          attrs: { kind: 'laser' },
          content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Do not look into the lens.' }] }],
        },
        { type: 'reading', attrs: { testPoint: 'TP4', expected: '1.6 V', measured: '0.2 V', note: 'Tray closed.' } },
        { type: 'figure', attrs: { src: '/media/pickup.jpg', alt: 'Pickup sled', caption: 'Sled at the inner stop.' } },
      ],
    });
    const { json, html } = throughEditorHtml(doc);
    expect(json).toEqual(doc);
    expect(html).toContain('Caution: laser radiation');
  });

  it('parses a whole realistic body back unchanged', () => {
    const doc = sanitised(realisticBody);
    expect(throughEditorHtml(doc).json).toEqual(schema.nodeFromJSON(doc).toJSON());
  });

  it('renders no href for a javascript: link even in the editor', () => {
    const mark = schema.marks.link?.create({ href: 'javascript:alert(1)' });
    const paragraph = schema.nodes.paragraph?.create(null, schema.text('x', mark ? [mark] : []));
    const container = window.document.createElement('div');
    const fragment = DOMSerializer.fromSchema(schema).serializeFragment(schema.nodes.doc!.create(null, paragraph).content, {
      document: window.document as unknown as Document,
    });
    container.appendChild(fragment as never);
    expect(container.querySelector('a')?.getAttribute('href')).toBe('');
    expect(container.querySelector('a')?.getAttribute('rel')).toBe('nofollow ugc noopener');
  });
});
