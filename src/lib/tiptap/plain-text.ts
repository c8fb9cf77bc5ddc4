// bodyPlainText: the words of a body as plain text, one block per line, for search documents and revision diffs.
import { cautionHeading, isCautionKind } from './nodes/caution-kind';
import { figureAttrsOf } from './nodes/figure';
import { readingAttrsOf, readingPlainText } from './nodes/reading';
import type { BodyNode } from './types';

const textblockTypes: readonly string[] = ['paragraph', 'heading', 'codeBlock'];

function inlineText(nodes: readonly BodyNode[]): string {
  return nodes
    .map((node) => {
      if (node.type === 'text') return node.text ?? '';
      if (node.type === 'hardBreak') return '\n';
      return inlineText(node.content ?? []);
    })
    .join('');
}

function blockLines(node: BodyNode): string[] {
  const children = node.content ?? [];
  if (textblockTypes.includes(node.type)) return [inlineText(children)];
  switch (node.type) {
    case 'text':
    case 'hardBreak':
      return [inlineText([node])];
    case 'tableRow':
      // One line per row keeps a table readable in a diff.
      return [children.map((cell) => cell.content?.flatMap(blockLines).join(' ') ?? '').join(' | ')];
    case 'caution':
      return [isCautionKind(node.attrs?.kind) ? cautionHeading(node.attrs.kind) : 'Caution', ...children.flatMap(blockLines)];
    case 'reading':
      return [readingPlainText(readingAttrsOf(node.attrs))];
    case 'figure':
    case 'image': {
      const figure = figureAttrsOf(node.attrs);
      return [[figure.alt, figure.caption].filter((part) => part !== '').join('. ')];
    }
    default:
      return children.flatMap(blockLines);
  }
}

/** Plain text of a (sanitised) body: blocks on their own lines, blank lines dropped. Pure. */
export function bodyPlainText(doc: BodyNode): string {
  return blockLines(doc)
    .map((line) => line.trim())
    .filter((line) => line !== '')
    .join('\n');
}
