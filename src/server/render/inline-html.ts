// HTML for text and links: text escaped by us, links limited to safe schemes and marked as member-written.
import type { Mark as PMMark, Node as PMNode } from '@tiptap/pm/model';
import type { MarkProps } from '@tiptap/static-renderer';
import { serializeChildrenToHTMLString } from '@tiptap/static-renderer/pm/html-string';
import { linkRel } from '@/lib/tiptap/extensions';
import { isSafeLinkHref } from '@/lib/tiptap/urls';
import type { NodeHtmlProps } from './body-node-html';
import { escapeHtml } from './escape';

export type MarkHtmlProps = MarkProps<PMMark, string | string[], PMNode>;

export function textHtml({ node }: NodeHtmlProps): string {
  return escapeHtml(node.text ?? '');
}

export function linkHtml({ mark, children }: MarkHtmlProps): string {
  const inner = serializeChildrenToHTMLString(children);
  const href: unknown = mark.attrs.href;
  // Re-checked here so the mapping is safe even if handed an unsanitised node: no safe href, no link.
  if (!isSafeLinkHref(href)) return inner;
  return `<a href="${escapeHtml(href)}" rel="${linkRel}">${inner}</a>`;
}
