// The one extension list for fix bodies: the editor island and the server renderer both build their schema from it.
import type { Extensions } from '@tiptap/core';
import { StarterKit } from '@tiptap/starter-kit';
import { Image } from '@tiptap/extension-image';
import { Table, TableCell, TableHeader, TableRow } from '@tiptap/extension-table';
import { CautionNode } from './nodes/caution';
import { FigureNode } from './nodes/figure';
import { ReadingNode } from './nodes/reading';
import { isSafeImageSrc, isSafeLinkHref } from './urls';

/** Put on every link: bodies are written by members, so search engines should not pass rank through them. */
export const linkRel = 'nofollow ugc noopener';

/** Heading levels a body may use; level 1 belongs to the page title. */
export const bodyHeadingLevels = [2, 3, 4] as const;

// Pasted or dropped pictures with a source we would refuse on save are not taken in at all.
const BodyImage = Image.extend({
  parseHTML() {
    return [
      {
        tag: 'img[src]',
        getAttrs: (element: HTMLElement) => (isSafeImageSrc(element.getAttribute('src')) ? null : false),
      },
    ];
  },
});

export function bodyExtensions(): Extensions {
  return [
    StarterKit.configure({
      heading: { levels: [...bodyHeadingLevels] },
      link: {
        openOnClick: false,
        autolink: true,
        defaultProtocol: 'https',
        protocols: [],
        isAllowedUri: (url: string): boolean => isSafeLinkHref(url),
        HTMLAttributes: { rel: linkRel, target: null, class: null },
      },
    }),
    Table.configure({ resizable: false, renderWrapper: false }),
    TableRow,
    TableHeader,
    TableCell,
    BodyImage.configure({ inline: false, allowBase64: false }),
    CautionNode,
    ReadingNode,
    FigureNode,
  ];
}
