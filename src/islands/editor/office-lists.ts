// Word-processor clipboard HTML of the Office kind writes list items as indented paragraphs with an mso-list style
// and a typed-out marker; this turns runs of them into real <ol>/<ul> before ProseMirror parses the paste.

interface ListItemParagraph {
  level: number;
  listId: string;
  ordered: boolean;
  /** The number a decimal marker shows, so a list resumed after an interruption keeps counting. */
  number: number | null;
}

interface OpenList {
  level: number;
  listId: string;
  ordered: boolean;
  list: HTMLElement;
}

const msoListStyle = /mso-list:\s*([^;"']+)/i;
const markerSpanStyle = /mso-list:\s*ignore/i;
// Bullets set in a symbol font are ordinary letters (·, §, Ø) in the HTML; the font is what makes them bullets.
const symbolFont = /font-family:\s*["']?(?:symbol|wingdings|webdings)/i;
// 1. 1) (1) 1.2. a. a) (iv) i. — but not a bare "o", which is the second-level bullet.
const numberMarker = /^\(?(?:\d+(?:\.\d+)*[.)]?|[a-z]{1,6}[.)])$/i;
const conditionalComment = /^\s*\[(?:if !supportLists|endif)\]\s*$/i;

/** Nested <ol>/<ul> markup in place of Office list paragraphs; any other HTML, or any failure, gives the input back. */
export function officeListsToHtmlLists(html: string): string {
  if (typeof html !== 'string' || !/mso-list/i.test(html)) return html;
  try {
    const doc = new DOMParser().parseFromString(html, 'text/html');
    const runs = listRuns(doc);
    if (runs.length === 0) return html;
    for (const run of runs) convertRun(doc, run);
    return /<(?:html|body)[\s>]/i.test(html) ? doc.documentElement.outerHTML : doc.body.innerHTML;
  } catch {
    return html;
  }
}

function listItemOf(p: Element): ListItemParagraph | null {
  const value = msoListStyle.exec(p.getAttribute('style') ?? '')?.[1];
  const level = value ? /level(\d+)/i.exec(value)?.[1] : undefined;
  if (!value || !level) return null;
  const marker = markerSpanOf(p);
  const text = (marker?.textContent ?? '').replace(/[\s\u00a0]+/g, '');
  const ordered = marker !== null && !inSymbolFont(marker, p) && numberMarker.test(text);
  const decimal = ordered ? /^\(?(\d+)/.exec(text)?.[1] : undefined;
  return {
    level: Number(level),
    listId: /\bl(\d+)\b/i.exec(value)?.[0] ?? '',
    ordered,
    number: decimal ? Number(decimal) : null,
  };
}

// A paragraph of the list-paragraph style without a marker is text indented under the item above it.
function isContinuation(p: Element): boolean {
  return /^MsoListParagraph/i.test(p.getAttribute('class') ?? '');
}

function markerSpanOf(p: Element): Element | null {
  return Array.from(p.querySelectorAll('span')).find((s) => markerSpanStyle.test(s.getAttribute('style') ?? '')) ?? null;
}

function inSymbolFont(marker: Element, p: Element): boolean {
  for (let el: Element | null = marker; el && el !== p; el = el.parentElement) {
    if (symbolFont.test(el.getAttribute('style') ?? '')) return true;
  }
  return false;
}

type RunEntry = { p: Element; item: ListItemParagraph | null };

// Consecutive list paragraphs (only blank text or comments between them) make one run; anything else ends it.
function listRuns(doc: Document): RunEntry[][] {
  const runs: RunEntry[][] = [];
  let last: Element | null = null;
  for (const p of Array.from(doc.body.querySelectorAll('p'))) {
    const item = listItemOf(p);
    const follows = last !== null && nextNonBlank(last) === p;
    if (item === null && !(follows && isContinuation(p))) continue;
    if (follows) runs[runs.length - 1]!.push({ p, item });
    else runs.push([{ p, item }]);
    last = p;
  }
  return runs;
}

function nextNonBlank(node: Node): Node | null {
  let next = node.nextSibling;
  while (next && (next.nodeType === 8 || (next.nodeType === 3 && !/\S/.test(next.textContent ?? '')))) {
    next = next.nextSibling;
  }
  return next;
}

function convertRun(doc: Document, run: RunEntry[]): void {
  const open: OpenList[] = [];
  for (const { p, item } of run) {
    const content = paragraphWithoutMarker(doc, p);
    if (item === null) {
      lastItemOf(open)?.appendChild(content);
    } else {
      while (open.length > 0 && open.at(-1)!.level > item.level) open.pop();
      const top = open.at(-1);
      if (top && top.level === item.level && (top.ordered !== item.ordered || top.listId !== item.listId)) open.pop();
      if (!open.at(-1) || open.at(-1)!.level < item.level) {
        const list = doc.createElement(item.ordered ? 'ol' : 'ul');
        if (item.ordered && item.number !== null && item.number > 1) list.setAttribute('start', String(item.number));
        const parentItem = lastItemOf(open);
        if (parentItem) parentItem.appendChild(list);
        else p.before(list);
        open.push({ level: item.level, listId: item.listId, ordered: item.ordered, list });
      }
      const li = doc.createElement('li');
      li.appendChild(content);
      open.at(-1)!.list.appendChild(li);
    }
    p.remove();
  }
}

function lastItemOf(open: OpenList[]): Element | null {
  return open.at(-1)?.list.lastElementChild ?? null;
}

// A plain <p> with the paragraph's content, less the marker span (and wrappers it leaves empty) and the comments around it.
function paragraphWithoutMarker(doc: Document, p: Element): HTMLParagraphElement {
  let marker: Element | null = markerSpanOf(p);
  while (marker && marker !== p) {
    const parent: Element | null = marker.parentElement;
    marker.remove();
    marker = parent && parent !== p && !/\S/.test(parent.textContent ?? '') && !parent.querySelector('img') ? parent : null;
  }
  const out = doc.createElement('p');
  for (const child of Array.from(p.childNodes)) {
    if (child.nodeType === 8 && conditionalComment.test(child.textContent ?? '')) continue;
    out.appendChild(child);
  }
  return out;
}
