// HTML for tables: plain <table>/<tr>/<th>/<td> with spans only, no inline styles or column widths.
import { serializeChildrenToHTMLString } from '@tiptap/static-renderer/pm/html-string';
import { attributesHtml } from './escape';
import type { NodeHtmlProps } from './body-node-html';

function span(value: unknown): number | undefined {
  return typeof value === 'number' && Number.isInteger(value) && value > 1 && value <= 20 ? value : undefined;
}

export function tableHtml({ children }: NodeHtmlProps): string {
  // The wrapper lets a wide table scroll sideways on a phone instead of widening the page.
  return `<div class="body-table"><table><tbody>${serializeChildrenToHTMLString(children)}</tbody></table></div>`;
}

export function tableRowHtml({ children }: NodeHtmlProps): string {
  return `<tr>${serializeChildrenToHTMLString(children)}</tr>`;
}

function cellHtml(tag: 'td' | 'th', { node, children }: NodeHtmlProps): string {
  const attributes = attributesHtml({ colspan: span(node.attrs.colspan), rowspan: span(node.attrs.rowspan) });
  return `<${tag}${attributes}>${serializeChildrenToHTMLString(children)}</${tag}>`;
}

export const tableCellHtml = (props: NodeHtmlProps): string => cellHtml('td', props);
export const tableHeaderHtml = (props: NodeHtmlProps): string => cellHtml('th', props);
