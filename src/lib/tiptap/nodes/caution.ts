// The `caution` block node: one or more paragraphs inside an amber caution box of a given kind.
import { Node, mergeAttributes } from '@tiptap/core';
import { cautionHeading, isCautionKind, type CautionKind } from './caution-kind';

const defaultCautionKind: CautionKind = 'mains';

function kindFromElement(element: HTMLElement): CautionKind {
  const kind = element.getAttribute('data-caution');
  return isCautionKind(kind) ? kind : defaultCautionKind;
}

export const CautionNode = Node.create({
  name: 'caution',
  group: 'block',
  content: 'paragraph+',
  defining: true,

  addAttributes() {
    return {
      kind: {
        default: defaultCautionKind,
        parseHTML: (element: HTMLElement): CautionKind => kindFromElement(element),
        renderHTML: (attributes: Record<string, unknown>): Record<string, string> => ({
          'data-caution': isCautionKind(attributes.kind) ? attributes.kind : defaultCautionKind,
        }),
      },
    };
  },

  parseHTML() {
    return [
      {
        tag: 'aside[data-caution]',
        // The label paragraph is generated, not content: read only the body.
        contentElement: (element: globalThis.Node): HTMLElement => {
          const host = element as HTMLElement;
          return host.querySelector<HTMLElement>(':scope > .caution__body') ?? host;
        },
      },
    ];
  },

  renderHTML({ node, HTMLAttributes }) {
    const kind: CautionKind = isCautionKind(node.attrs.kind) ? node.attrs.kind : defaultCautionKind;
    return [
      'aside',
      mergeAttributes({ class: `caution caution--${kind}`, role: 'note' }, HTMLAttributes),
      ['p', { class: 'caution__label', contenteditable: 'false' }, cautionHeading(kind)],
      ['div', { class: 'caution__body' }, 0],
    ];
  },
});
