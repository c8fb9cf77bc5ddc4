// The `reading` atom: a measurement to take (where, what a good unit shows, what a faulty one typically shows).
import { Node, mergeAttributes } from '@tiptap/core';
import type { DOMOutputSpec } from '@tiptap/pm/model';

export interface ReadingAttrs {
  testPoint: string;
  expected: string;
  measured: string;
  note: string;
}

export const readingFields = ['testPoint', 'expected', 'measured', 'note'] as const;

export const readingLabels: Record<keyof ReadingAttrs, string> = {
  testPoint: 'Test point',
  expected: 'Expected',
  measured: 'Typical faulty reading',
  note: 'Note',
};

const dataAttributeNames: Record<keyof ReadingAttrs, string> = {
  testPoint: 'data-test-point',
  expected: 'data-expected',
  measured: 'data-measured',
  note: 'data-note',
};

/** Reads the four fields off any attrs object, treating anything that is not a string as empty. */
export function readingAttrsOf(attrs: Record<string, unknown> | undefined): ReadingAttrs {
  const text = (value: unknown): string => (typeof value === 'string' ? value : '');
  return {
    testPoint: text(attrs?.testPoint),
    expected: text(attrs?.expected),
    measured: text(attrs?.measured),
    note: text(attrs?.note),
  };
}

/** One line of plain text for search, diffs and the editor's text export. */
export function readingPlainText(reading: ReadingAttrs): string {
  return readingFields
    .filter((field) => reading[field] !== '')
    .map((field) => `${readingLabels[field]}: ${reading[field]}`)
    .join('. ');
}

function stringAttribute(field: keyof ReadingAttrs) {
  const dataName = dataAttributeNames[field];
  return {
    default: '',
    parseHTML: (element: HTMLElement): string => element.getAttribute(dataName) ?? '',
    renderHTML: (attributes: Record<string, unknown>): Record<string, string> => ({
      [dataName]: typeof attributes[field] === 'string' ? attributes[field] : '',
    }),
  };
}

function definitionRows(reading: ReadingAttrs): DOMOutputSpec[] {
  return readingFields
    .filter((field) => field !== 'note' && (field !== 'measured' || reading.measured !== ''))
    .map((field): DOMOutputSpec => ['div', ['dt', readingLabels[field]], ['dd', reading[field]]]);
}

export const ReadingNode = Node.create({
  name: 'reading',
  group: 'block',
  atom: true,
  selectable: true,
  draggable: true,

  addAttributes() {
    return {
      testPoint: stringAttribute('testPoint'),
      expected: stringAttribute('expected'),
      measured: stringAttribute('measured'),
      note: stringAttribute('note'),
    };
  },

  parseHTML() {
    return [{ tag: 'div[data-reading]' }];
  },

  renderHTML({ node, HTMLAttributes }) {
    const reading = readingAttrsOf(node.attrs);
    const noteSpec: DOMOutputSpec[] = reading.note === '' ? [] : [['p', { class: 'reading__note' }, reading.note]];
    return [
      'div',
      mergeAttributes({ class: 'reading', 'data-reading': '' }, HTMLAttributes),
      ['dl', {}, ...definitionRows(reading)],
      ...noteSpec,
    ];
  },

  renderText({ node }) {
    return readingPlainText(readingAttrsOf(node.attrs));
  },
});
