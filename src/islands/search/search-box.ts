// The search box's behaviour in the browser: live results under the box, arrow keys to choose, Enter to open,
// Escape to close, "/" anywhere to focus. Works on the markup SearchBox.astro renders; without it the form still
// searches on Enter.
import type { SearchHit } from '@/lib/search/result-types';
import { benchScoreText } from '@/lib/search/bench-label';
import { nextActive } from './active-option';
import { liveQueryText, liveSearch, type Answer, type LiveState } from './live-results';

function statusText(state: LiveState, count: number): string {
  if (state.kind === 'idle') return '';
  if (state.kind === 'failed') return 'Live results are not available just now; press Enter to search.';
  if (state.kind === 'loading' && count === 0) return 'Searching…';
  if (count === 0) return 'No fixes match yet. Press Enter for the full results and suggestions.';
  const total = state.kind === 'answered' ? state.answer.total : (state.previous?.total ?? count);
  return `${total} ${total === 1 ? 'fix' : 'fixes'} found; ${count} shown. Use the arrow keys to choose, Enter to open.`;
}

function element<K extends keyof HTMLElementTagNameMap>(tag: K, className: string, text?: string): HTMLElementTagNameMap[K] {
  const node = document.createElement(tag);
  node.className = className;
  if (text !== undefined) node.textContent = text;
  return node;
}

/** One live result: thumbnail, highlighted title, machines, symptom snippet, bench score. */
function optionFor(hit: SearchHit, id: string): HTMLLIElement {
  const item = element('li', 'flex cursor-pointer gap-3 border-b border-rule bg-paper-light px-3 py-2 last:border-b-0');
  item.id = id;
  item.setAttribute('role', 'option');
  item.setAttribute('aria-selected', 'false');
  if (hit.thumbnail) {
    const img = element('img', 'h-auto w-[4.5rem] flex-none rounded border border-rule object-cover');
    img.src = hit.thumbnail.src;
    if (hit.thumbnail.srcset) img.srcset = hit.thumbnail.srcset;
    img.sizes = '4.5rem';
    img.alt = '';
    img.width = 72;
    img.height = Math.round((72 * hit.thumbnail.height) / Math.max(1, hit.thumbnail.width));
    img.loading = 'lazy';
    item.append(img);
  }
  const body = element(
    'div',
    'min-w-0 flex-1 [&_mark.concept]:underline [&_mark.concept]:decoration-dotted [&_mark]:bg-amber-wash [&_mark]:text-ink',
  );
  // titleHtml and snippetHtml are escaped on the server; the only tag in them is <mark> (a family match's carries a title).
  const title = element('span', 'block font-serif font-semibold text-teal');
  title.innerHTML = hit.titleHtml;
  body.append(title);
  const machines = hit.machines.slice(0, 3).map((m) => m.label);
  if (machines.length > 0)
    body.append(element('span', 'block font-mono text-xs text-ink-soft', machines.join(', ') + (hit.machines.length > 3 ? ' …' : '')));
  const snippet = element('span', 'block text-sm text-ink-soft');
  snippet.innerHTML = hit.snippetHtml;
  body.append(snippet);
  if (hit.matched.length > 0) body.append(element('span', 'block text-xs text-ink-soft', `matched: ${hit.matched.join('; ')}`));
  body.append(element('span', 'block text-xs font-semibold text-teal', benchScoreText(hit.benchScore.score, hit.benchScore.reports)));
  item.append(body);
  return item;
}

function enhance(root: HTMLElement): void {
  const input = root.querySelector<HTMLInputElement>('input[role="combobox"]');
  const list = root.querySelector<HTMLUListElement>('[role="listbox"]');
  const status = root.querySelector<HTMLElement>('[role="status"]');
  if (!input || !list || !status) return;
  const context = JSON.parse(root.dataset.context ?? '{}') as Record<string, string>;

  let open = false;
  let active = -1;
  let hits: SearchHit[] = [];
  let state: LiveState = { kind: 'idle' };

  const shownAnswer = (): Answer | null => (state.kind === 'answered' ? state.answer : state.kind === 'loading' ? state.previous : null);

  function render(): void {
    const expanded = open && liveQueryText(input!.value) !== null;
    const visible = expanded ? hits : [];
    input!.setAttribute('aria-expanded', String(expanded && visible.length > 0));
    list!.classList.toggle('hidden', !(expanded && visible.length > 0));
    list!.setAttribute('aria-busy', String(state.kind === 'loading'));
    const options = [...list!.children] as HTMLElement[];
    options.forEach((option, index) => {
      const selected = index === active;
      option.setAttribute('aria-selected', String(selected));
      option.classList.toggle('bg-teal-wash', selected);
      option.classList.toggle('bg-paper-light', !selected);
    });
    const current = options[active];
    if (current) input!.setAttribute('aria-activedescendant', current.id);
    else input!.removeAttribute('aria-activedescendant');
    const text = expanded ? statusText(state, visible.length) : '';
    if (status!.textContent !== text) status!.textContent = text;
  }

  function showHits(next: SearchHit[]): void {
    if (next === hits) return;
    hits = next;
    active = -1;
    list!.replaceChildren(...hits.map((hit, index) => optionFor(hit, `${list!.id}-${index}`)));
  }

  const choose = (hit: SearchHit) => window.location.assign(`/fixes/${hit.slug}`);
  const live = liveSearch({
    context,
    onChange: (next) => {
      state = next;
      showHits(shownAnswer()?.hits ?? []);
      render();
    },
  });

  input.addEventListener('input', () => {
    open = true;
    live.type(input.value);
    render();
  });
  input.addEventListener('focus', () => {
    open = true;
    render();
  });
  input.addEventListener('blur', () => {
    open = false;
    render();
  });
  input.addEventListener('keydown', (event) => {
    if (event.key === 'ArrowDown' || event.key === 'ArrowUp') {
      event.preventDefault();
      active = nextActive(active, open ? hits.length : 0, event.key);
      open = true;
      render();
    } else if (event.key === 'Enter' && active >= 0) {
      const hit = hits[active];
      if (!hit) return;
      event.preventDefault();
      choose(hit);
    } else if (event.key === 'Escape') {
      // The first Escape only closes the list; Chromium would also empty a search field, losing what was typed.
      if (open && hits.length > 0) event.preventDefault();
      open = false;
      active = -1;
      render();
    }
  });
  // mousedown, not click: the input keeps focus and the list does not close before the choice lands.
  list.addEventListener('mousedown', (event) => {
    const option = (event.target as HTMLElement).closest<HTMLElement>('[role="option"]');
    const index = option ? [...list.children].indexOf(option) : -1;
    if (index < 0 || !hits[index]) return;
    event.preventDefault();
    choose(hits[index]);
  });
  list.addEventListener('mouseover', (event) => {
    const option = (event.target as HTMLElement).closest<HTMLElement>('[role="option"]');
    const index = option ? [...list.children].indexOf(option) : -1;
    if (index >= 0 && index !== active) {
      active = index;
      render();
    }
  });

  // "/" anywhere on the page, except while typing in another field, puts the cursor in the box.
  document.addEventListener('keydown', (event) => {
    if (event.key !== '/' || event.ctrlKey || event.metaKey || event.altKey) return;
    const target = event.target as HTMLElement | null;
    if (target && (target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName))) return;
    event.preventDefault();
    input.focus();
    input.select();
  });
  root.dataset.enhanced = '';
}

export function enhanceSearchBoxes(): void {
  for (const root of document.querySelectorAll<HTMLElement>('[data-live-search]:not([data-enhanced])')) enhance(root);
}
