// Touch targets of a page: every control a finger must hit, measured as laid out, and those smaller than 44 by 44 px.
import type { Page } from 'playwright-core';

/** 44 CSS px each way: WCAG 2.2 success criterion 2.5.5 (Target Size, Enhanced). */
export const MIN_TARGET = 44;

export interface SmallTarget {
  /** e.g. `a.btn "Keep for the bench"` or `input[type=checkbox] (label) "Delete it and…"`. */
  control: string;
  width: number;
  height: number;
}

/**
 * The page's controls smaller than MIN_TARGET in either direction: links that stand alone (navigation, pagination,
 * links styled as buttons, a link alone in its cell or list item), buttons, select boxes, text inputs and text areas,
 * checkboxes and radio buttons (measured by their label when the label is clickable, as a tap on it checks the box).
 * Exempt, as WCAG 2.5.8 allows: a link inside running text (the "inline" exception: its size is set by the line of
 * text around it), and a small link whose address a link of full size on the same page also opens (the "equivalent"
 * exception: a bar of a chart that links to a fix listed below it). Not counted: anything hidden or laid out off the
 * page (the skip link until it has focus) and controls inside a <dialog> that is not open.
 */
export async function smallTargets(page: Page): Promise<SmallTarget[]> {
  return page.evaluate((min) => {
    const describe = (el: Element, extra = ''): string => {
      const tag = el.tagName.toLowerCase();
      const type = el instanceof HTMLInputElement ? `[type=${el.type}]` : '';
      const classes = typeof el.className === 'string' ? el.className.trim().split(/\s+/).filter(Boolean).slice(0, 2) : [];
      const text = (
        el instanceof HTMLInputElement || el instanceof HTMLSelectElement || el instanceof HTMLTextAreaElement
          ? (el.labels?.[0]?.textContent ?? el.getAttribute('aria-label') ?? el.name)
          : (el.textContent ?? el.getAttribute('aria-label') ?? '')
      )
        .replace(/\s+/g, ' ')
        .trim()
        .slice(0, 50);
      return `${tag}${type}${classes.map((c) => `.${c}`).join('')}${extra} "${text}"`;
    };
    const shown = (el: Element): boolean => {
      const box = el.getBoundingClientRect();
      if (box.width === 0 || box.height === 0 || box.bottom + window.scrollY <= 0 || box.right + window.scrollX <= 0) return false;
      const style = getComputedStyle(el);
      return style.visibility !== 'hidden' && !el.closest('[hidden], dialog:not([open]), .sr-only');
    };
    /** The nearest ancestor that is not laid out inline: the line box the link sits in. */
    const blockOf = (el: Element): Element => {
      let up = el.parentElement ?? el;
      while (up.parentElement && getComputedStyle(up).display.startsWith('inline') && up.parentElement !== document.body)
        up = up.parentElement;
      return up;
    };
    const words = (el: Element): string => (el.textContent ?? '').replace(/\s+/g, ' ').trim();
    /** The text laid out in a block's own lines: its text and inline children, not its block children (a paragraph under a link). */
    const lineWords = (block: Element): string =>
      Array.from(block.childNodes)
        .filter((n) => n.nodeType === Node.TEXT_NODE || (n instanceof Element && getComputedStyle(n).display.startsWith('inline')))
        .map((n) => n.textContent ?? '')
        .join(' ')
        .replace(/\s+/g, ' ')
        .trim();
    const small: { control: string; width: number; height: number; href: string | null }[] = [];
    /** Addresses a link of full size on the page opens. */
    const fullSize = new Set<string>();
    const check = (el: Element, target: Element, extra = ''): void => {
      const box = target.getBoundingClientRect();
      const width = Math.round(box.width * 10) / 10;
      const height = Math.round(box.height * 10) / 10;
      // An SVG link's href is an SVGAnimatedString: read the attribute.
      const href = el.tagName.toLowerCase() === 'a' ? new URL(el.getAttribute('href') ?? '', location.href).href : null;
      if (width < min || height < min) small.push({ control: describe(el, extra), width, height, href });
      else if (href) fullSize.add(href);
    };
    for (const el of Array.from(document.querySelectorAll('a[href], button, select, textarea, input:not([type=hidden]), summary'))) {
      if (!shown(el)) continue;
      // (A link in an SVG chart is never inside running text.)
      if (el instanceof HTMLAnchorElement && !el.classList.contains('btn')) {
        // A link with words of running text beside it in its line box is inline (exempt); alone there, it is a control.
        // A link laid out as a block (or as a flex or grid item) is never inside running text.
        if (getComputedStyle(el).display.startsWith('inline') && lineWords(blockOf(el)) !== words(el)) continue;
      }
      if (el instanceof HTMLInputElement && (el.type === 'checkbox' || el.type === 'radio')) {
        const label = el.labels?.[0];
        if (label && shown(label)) check(el, label, ' (label)');
        else check(el, el);
        continue;
      }
      check(el, el);
    }
    return small.filter((t) => !t.href || !fullSize.has(t.href)).map(({ control, width, height }) => ({ control, width, height }));
  }, MIN_TARGET);
}

export function describeSmall(where: string, targets: SmallTarget[]): string[] {
  return targets.map((t) => `${where}: ${t.control} is ${t.width} × ${t.height} px`);
}
