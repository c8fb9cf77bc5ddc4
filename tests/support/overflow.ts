// Horizontal overflow of a page: whether the document scrolls sideways, and which element pushes it furthest.
import type { Page } from 'playwright-core';

export interface Overflow {
  scrollWidth: number;
  clientWidth: number;
  /** The element whose right edge sets the page's scroll width, e.g. `td.px-3 < tr < tbody "Add to order list"`. */
  widest: string;
}

/** Null when the page does not scroll sideways (document.documentElement.scrollWidth <= clientWidth). */
export async function horizontalOverflow(page: Page): Promise<Overflow | null> {
  return page.evaluate(() => {
    const root = document.documentElement;
    if (root.scrollWidth <= root.clientWidth) return null;
    const name = (el: Element): string => {
      const classes = typeof el.className === 'string' ? el.className.trim().split(/\s+/).filter(Boolean).slice(0, 3) : [];
      return `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}${classes.map((c) => `.${c}`).join('')}`;
    };
    // Content a scrolling or clipping box holds within its own edge cannot widen the page.
    const clipped = (el: Element, right: number): boolean => {
      for (let up = el.parentElement; up && up !== document.body; up = up.parentElement)
        if (getComputedStyle(up).overflowX !== 'visible' && up.getBoundingClientRect().right < right - 1) return true;
      return false;
    };
    // Of the elements that reach the page's scroll width, the narrowest is the one to blame (a cell, not its table).
    let widest: Element | null = null;
    let widestRight = 0;
    let culprit: Element | null = null;
    for (const el of Array.from(document.body.querySelectorAll('*'))) {
      const box = el.getBoundingClientRect();
      if (box.width === 0 || clipped(el, box.right)) continue;
      if (box.right > widestRight) [widest, widestRight] = [el, box.right];
      if (box.right + window.scrollX >= root.scrollWidth - 1 && (!culprit || box.width < culprit.getBoundingClientRect().width))
        culprit = el;
    }
    const el = culprit ?? widest;
    const path = el
      ? [el, el.parentElement, el.parentElement?.parentElement]
          .filter((e): e is Element => !!e)
          .map(name)
          .join(' < ')
      : 'unknown';
    const text = (el?.textContent ?? '').replace(/\s+/g, ' ').trim().slice(0, 60);
    return { scrollWidth: root.scrollWidth, clientWidth: root.clientWidth, widest: text ? `${path} "${text}"` : path };
  });
}

export function describeOverflow(where: string, overflow: Overflow): string {
  return `${where} scrolls sideways: ${overflow.scrollWidth} px of content in ${overflow.clientWidth} px; widest element ${overflow.widest}`;
}
