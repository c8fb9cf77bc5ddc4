// Reshapes cleaned children to what their parent's content expression accepts, so the editor's schema takes the result.
import { blockNodeTypes, inlineNodeTypes } from '../rules';
import type { BodyNode } from '../types';

type Note = (message: string) => void;

const emptyParagraph = (): BodyNode => ({ type: 'paragraph' });
const isInline = (node: BodyNode): boolean => inlineNodeTypes.includes(node.type);
const isBlock = (node: BodyNode): boolean => blockNodeTypes.includes(node.type);
const isCell = (node: BodyNode): boolean => node.type === 'tableCell' || node.type === 'tableHeader';

function paragraphOf(content: BodyNode[]): BodyNode {
  return content.length > 0 ? { type: 'paragraph', content } : emptyParagraph();
}

/** Block content: runs of inline nodes become paragraphs; list items, rows and cells give up their blocks. */
export function toBlocks(nodes: BodyNode[]): BodyNode[] {
  const blocks: BodyNode[] = [];
  let inlineRun: BodyNode[] = [];
  const flush = (): void => {
    if (inlineRun.length > 0) blocks.push(paragraphOf(inlineRun));
    inlineRun = [];
  };
  for (const node of nodes) {
    if (isInline(node)) {
      inlineRun.push(node);
      continue;
    }
    flush();
    if (isBlock(node)) blocks.push(node);
    else blocks.push(...toBlocks(node.content ?? []));
  }
  flush();
  return blocks;
}

/** Inline content: blocks found inside a paragraph or heading give up their text, separated by a space. */
export function toInline(nodes: BodyNode[], note: Note): BodyNode[] {
  const inline: BodyNode[] = [];
  for (const node of nodes) {
    if (isInline(node)) {
      inline.push(node);
      continue;
    }
    const inner = toInline(node.content ?? [], note);
    if (inner.length === 0 && !node.content) note(`${node.type} cannot sit inside a line of text, removed`);
    if (inner.length === 0) continue;
    if (inline.length > 0) inline.push({ type: 'text', text: ' ' });
    inline.push(...inner);
  }
  return inline;
}

function codeTextOf(nodes: BodyNode[]): string {
  let text = '';
  for (const node of nodes) {
    if (node.type === 'text') text += node.text ?? '';
    else if (node.type === 'hardBreak') text += '\n';
    else {
      // Each block found inside code starts on a line of its own.
      if (text !== '' && !text.endsWith('\n')) text += '\n';
      text += codeTextOf(node.content ?? []);
    }
  }
  return text;
}

/** Code block content: plain text only, without marks. */
export function toCodeText(nodes: BodyNode[]): BodyNode[] {
  const text = codeTextOf(nodes);
  return text === '' ? [] : [{ type: 'text', text }];
}

/** Caution content: paragraphs only; headings and code become paragraphs, containers are opened up. */
export function toParagraphs(nodes: BodyNode[], note: Note): BodyNode[] {
  const paragraphs: BodyNode[] = [];
  for (const block of toBlocks(nodes)) {
    if (block.type === 'paragraph') paragraphs.push(block);
    else if (block.type === 'heading') paragraphs.push(paragraphOf(block.content ?? []));
    else if (block.type === 'codeBlock') paragraphs.push(paragraphOf(block.content ?? []));
    else if (block.content) paragraphs.push(...toParagraphs(block.content, note));
    else note(`${block.type} cannot sit inside a caution, removed`);
  }
  return paragraphs;
}

export function nonEmptyBlocks(blocks: BodyNode[]): BodyNode[] {
  return blocks.length > 0 ? blocks : [emptyParagraph()];
}

/** List item content: a paragraph first, then any blocks. */
export function withLeadingParagraph(blocks: BodyNode[]): BodyNode[] {
  return blocks[0]?.type === 'paragraph' ? blocks : [emptyParagraph(), ...blocks];
}

/** List content: anything that is not a list item becomes one list item per block. */
export function toListItems(nodes: BodyNode[]): BodyNode[] {
  const items: BodyNode[] = [];
  for (const node of nodes) {
    if (node.type === 'listItem') items.push(node);
    else items.push(...toBlocks([node]).map((block) => ({ type: 'listItem', content: withLeadingParagraph([block]) })));
  }
  return items;
}

/** Row content: anything that is not a cell becomes one cell per block. */
export function toCells(nodes: BodyNode[]): BodyNode[] {
  const cells: BodyNode[] = [];
  for (const node of nodes) {
    if (isCell(node)) cells.push(node);
    else cells.push(...toBlocks([node]).map((block) => ({ type: 'tableCell', content: [block] })));
  }
  return cells;
}

/** Table content: loose cells are gathered into rows, loose blocks get a row and a cell each. */
export function toRows(nodes: BodyNode[]): BodyNode[] {
  const rows: BodyNode[] = [];
  let cellRun: BodyNode[] = [];
  const flush = (): void => {
    if (cellRun.length > 0) rows.push({ type: 'tableRow', content: cellRun });
    cellRun = [];
  };
  for (const node of nodes) {
    if (isCell(node)) {
      cellRun.push(node);
      continue;
    }
    flush();
    if (node.type === 'tableRow') rows.push(node);
    else rows.push(...toCells([node]).map((cell) => ({ type: 'tableRow', content: [cell] })));
  }
  flush();
  return rows;
}
