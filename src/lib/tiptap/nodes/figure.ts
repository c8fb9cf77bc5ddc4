// The `figure` atom: a picture with required alt text and an optional caption (the caption is not the alt text).
import { Node, mergeAttributes } from '@tiptap/core';
import type { DOMOutputSpec } from '@tiptap/pm/model';
import { isSafeImageSrc } from '../urls';

export interface FigureAttrs {
  src: string;
  alt: string;
  caption: string;
}

export function figureAttrsOf(attrs: Record<string, unknown> | undefined): FigureAttrs {
  const text = (value: unknown): string => (typeof value === 'string' ? value : '');
  return { src: text(attrs?.src), alt: text(attrs?.alt), caption: text(attrs?.caption) };
}

function imageOf(element: HTMLElement): HTMLImageElement | null {
  return element.querySelector('img');
}

export const FigureNode = Node.create({
  name: 'figure',
  group: 'block',
  atom: true,
  selectable: true,
  draggable: true,

  addAttributes() {
    return {
      // Kept off the outer element: the renderHTML below places them on <img> and <figcaption>.
      src: {
        default: '',
        parseHTML: (element: HTMLElement): string => imageOf(element)?.getAttribute('src') ?? '',
        renderHTML: (): Record<string, never> => ({}),
      },
      alt: {
        default: '',
        parseHTML: (element: HTMLElement): string => imageOf(element)?.getAttribute('alt') ?? '',
        renderHTML: (): Record<string, never> => ({}),
      },
      caption: {
        default: '',
        parseHTML: (element: HTMLElement): string => element.querySelector('figcaption')?.textContent ?? '',
        renderHTML: (): Record<string, never> => ({}),
      },
    };
  },

  parseHTML() {
    return [{ tag: 'figure[data-figure]' }];
  },

  renderHTML({ node, HTMLAttributes }) {
    const figure = figureAttrsOf(node.attrs);
    // An unsafe source is left out rather than passed to the browser.
    const imageAttrs: Record<string, string> = isSafeImageSrc(figure.src) ? { src: figure.src, alt: figure.alt } : { alt: figure.alt };
    const captionSpec: DOMOutputSpec[] = figure.caption === '' ? [] : [['figcaption', figure.caption]];
    return ['figure', mergeAttributes({ class: 'figure', 'data-figure': '' }, HTMLAttributes), ['img', imageAttrs], ...captionSpec];
  },

  renderText({ node }) {
    const figure = figureAttrsOf(node.attrs);
    return [figure.alt, figure.caption].filter((part) => part !== '').join('. ');
  },
});
