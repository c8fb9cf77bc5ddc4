// What a fix body may contain: node and mark types, their attributes, and the size limits.

export const allowedNodeTypes = [
  'doc',
  'paragraph',
  'text',
  'heading',
  'bulletList',
  'orderedList',
  'listItem',
  'blockquote',
  'codeBlock',
  'hardBreak',
  'horizontalRule',
  'table',
  'tableRow',
  'tableHeader',
  'tableCell',
  'image',
  'caution',
  'reading',
  'figure',
] as const;
export type BodyNodeType = (typeof allowedNodeTypes)[number];

export const allowedMarkTypes = ['bold', 'italic', 'strike', 'code', 'underline', 'link'] as const;
export type BodyMarkType = (typeof allowedMarkTypes)[number];

export const allowedNodeAttributes: Record<BodyNodeType, readonly string[]> = {
  doc: [],
  paragraph: [],
  text: [],
  heading: ['level'],
  bulletList: [],
  orderedList: ['start'],
  listItem: [],
  blockquote: [],
  codeBlock: [],
  hardBreak: [],
  horizontalRule: [],
  table: [],
  tableRow: [],
  tableHeader: ['colspan', 'rowspan'],
  tableCell: ['colspan', 'rowspan'],
  image: ['src', 'alt', 'title'],
  caution: ['kind'],
  reading: ['testPoint', 'expected', 'measured', 'note'],
  figure: ['src', 'alt', 'caption'],
};

export const allowedMarkAttributes: Record<BodyMarkType, readonly string[]> = {
  bold: [],
  italic: [],
  strike: [],
  code: [],
  underline: [],
  link: ['href'],
};

/** Attributes the editor writes on its own (mostly with default values): removed without a note. */
export const quietlyRemovedAttributes: Readonly<Record<string, readonly string[]>> = {
  link: ['target', 'rel', 'class', 'title'],
  tableCell: ['colwidth', 'align'],
  tableHeader: ['colwidth', 'align'],
  codeBlock: ['language'],
  orderedList: ['type'],
  image: ['width', 'height'],
};

/** Unknown node types removed together with their content: their text is code or markup, never prose. */
export const removedWithContentNodeTypes: readonly string[] = [
  'script',
  'style',
  'iframe',
  'frame',
  'frameset',
  'object',
  'embed',
  'applet',
  'svg',
  'math',
  'template',
  'noscript',
  'link',
  'meta',
  'base',
  'form',
  'input',
  'button',
  'textarea',
  'select',
];

/** Nodes that sit inside a paragraph or heading. */
export const inlineNodeTypes: readonly string[] = ['text', 'hardBreak'];

/** Nodes that sit directly in the document, a blockquote, a list item, a table cell. */
export const blockNodeTypes: readonly string[] = [
  'paragraph',
  'heading',
  'bulletList',
  'orderedList',
  'blockquote',
  'codeBlock',
  'horizontalRule',
  'table',
  'image',
  'caution',
  'reading',
  'figure',
];

/** Nodes without content of their own. */
export const leafNodeTypes: readonly string[] = ['hardBreak', 'horizontalRule', 'image', 'reading', 'figure'];

export const bodyLimits = {
  /** Deeper than any list-in-table-in-caution a writer would make; guards the renderer's recursion. */
  maxDepth: 40,
  maxNodes: 20_000,
  /** Total characters of text across the body. */
  maxTextLength: 200_000,
  maxTypeNameLength: 64,
  maxNotes: 100,
} as const;

export const attributeLengthLimits = {
  alt: 300,
  title: 300,
  caption: 500,
  testPoint: 120,
  expected: 80,
  measured: 80,
  note: 300,
} as const;

export const numberRanges = {
  headingLevel: { min: 2, max: 4, fallback: 2 },
  orderedListStart: { min: 1, max: 9999, fallback: 1 },
  cellSpan: { min: 1, max: 20, fallback: 1 },
} as const;

export function isAllowedNodeType(type: string): type is BodyNodeType {
  return (allowedNodeTypes as readonly string[]).includes(type);
}

export function isAllowedMarkType(type: string): type is BodyMarkType {
  return (allowedMarkTypes as readonly string[]).includes(type);
}
