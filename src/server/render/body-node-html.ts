// HTML for our own body nodes (caution, reading, figure) and for images; each escapes what it emits.
import type { Node as PMNode } from '@tiptap/pm/model';
import type { NodeProps } from '@tiptap/static-renderer';
import { serializeChildrenToHTMLString } from '@tiptap/static-renderer/pm/html-string';
import { cautionDeferral, cautionHeading, isCautionKind } from '@/lib/tiptap/nodes/caution-kind';
import { figureAttrsOf } from '@/lib/tiptap/nodes/figure';
import { readingAttrsOf, readingLabels, type ReadingAttrs } from '@/lib/tiptap/nodes/reading';
import { isSafeImageSrc } from '@/lib/tiptap/urls';
import { attributesHtml, escapeHtml } from './escape';

export type NodeHtmlProps = NodeProps<PMNode, string | string[]>;

/** Matches a caution whose writer already deferred to local codes, so the standard line is not shown twice. */
const alreadyDefers = /local electrical codes and licensed practice/i;

export function cautionHtml({ node, children }: NodeHtmlProps): string {
  const kind: unknown = node.attrs.kind;
  // The sanitiser guarantees a known kind; a caution without one must not render as an ordinary box.
  if (!isCautionKind(kind)) throw new Error('caution node without a known kind');
  const deferral = alreadyDefers.test(node.textContent) ? '' : `<p class="caution__deferral">${escapeHtml(cautionDeferral)}</p>`;
  return (
    `<aside class="caution caution--${kind}" role="note">` +
    `<p class="caution__label">${escapeHtml(cautionHeading(kind))}</p>` +
    serializeChildrenToHTMLString(children) +
    deferral +
    '</aside>'
  );
}

/** Where the remedy had a caution that the page already shows in full before it: a link back to it. */
export function cautionPointerHtml({ node }: NodeHtmlProps): string {
  const kind: unknown = node.attrs.kind;
  if (!isCautionKind(kind)) throw new Error('caution node without a known kind');
  return (
    `<p class="caution-pointer"><a href="#caution-${kind}">${escapeHtml(cautionHeading(kind))}</a>: ` +
    'read it in Before you start, above, before this step.</p>'
  );
}

function readingRow(reading: ReadingAttrs, field: 'testPoint' | 'expected' | 'measured'): string {
  const modifier = field === 'testPoint' ? 'test-point' : field;
  return (
    `<div class="reading__${modifier}">` + `<dt>${escapeHtml(readingLabels[field])}</dt><dd>${escapeHtml(reading[field])}</dd>` + '</div>'
  );
}

export function readingHtml({ node }: NodeHtmlProps): string {
  const reading = readingAttrsOf(node.attrs);
  const rows = [readingRow(reading, 'testPoint'), readingRow(reading, 'expected')];
  if (reading.measured !== '') rows.push(readingRow(reading, 'measured'));
  const note = reading.note === '' ? '' : `<p class="reading__note">${escapeHtml(reading.note)}</p>`;
  return `<div class="reading"><dl>${rows.join('')}</dl>${note}</div>`;
}

function pictureHtml(src: unknown, alt: string, title?: string): string {
  // A source the sanitiser let through is re-checked here: the mapping must be safe on its own.
  if (!isSafeImageSrc(src)) throw new Error('picture with an unsafe src');
  return `<img${attributesHtml({ src, title })} alt="${escapeHtml(alt)}" loading="lazy" decoding="async">`;
}

export function figureHtml({ node }: NodeHtmlProps): string {
  const figure = figureAttrsOf(node.attrs);
  const caption = figure.caption === '' ? '' : `<figcaption>${escapeHtml(figure.caption)}</figcaption>`;
  return `<figure class="figure">${pictureHtml(figure.src, figure.alt)}${caption}</figure>`;
}

export function imageHtml({ node }: NodeHtmlProps): string {
  const text = (value: unknown): string => (typeof value === 'string' ? value : '');
  return pictureHtml(node.attrs.src, text(node.attrs.alt), text(node.attrs.title) || undefined);
}
