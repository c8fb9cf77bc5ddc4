// The search page's box: a plain input in a GET form, enhanced into a combobox that shows results as you type.
import { useEffect, useId, useRef, useState, type KeyboardEvent, type ReactElement } from 'react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { SearchHit } from '@/lib/search/result-types';
import { MAX_QUERY_LENGTH } from '@/lib/search/tokens';
import { ResultOption } from './search/ResultOption';
import { useLiveSearch } from './search/use-live-search';
import { nextActive } from './search/active-option';

export interface SearchBoxProps {
  initialText: string;
  /** The rest of the search (machine, scope, filters) as query parameters, kept for the live results. */
  context: Record<string, string>;
}

/** "/" anywhere on the page, except while typing in another field, puts the cursor in the box. */
function useSlashToFocus(input: React.RefObject<HTMLInputElement | null>): void {
  useEffect(() => {
    const onKey = (event: globalThis.KeyboardEvent) => {
      if (event.key !== '/' || event.ctrlKey || event.metaKey || event.altKey) return;
      const target = event.target as HTMLElement | null;
      if (target && (target.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(target.tagName))) return;
      event.preventDefault();
      input.current?.focus();
      input.current?.select();
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [input]);
}

function statusText(open: boolean, loading: boolean, failed: boolean, count: number, total: number): string {
  if (!open) return '';
  if (failed) return 'Live results are not available just now; press Enter to search.';
  if (loading && count === 0) return 'Searching…';
  if (count === 0) return 'No fixes match yet. Press Enter for the full results and suggestions.';
  return `${total} ${total === 1 ? 'fix' : 'fixes'} found; ${count} shown. Use the arrow keys to choose, Enter to open.`;
}

function LiveSearchBox({ initialText, context }: SearchBoxProps): ReactElement {
  const [text, setText] = useState(initialText);
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(-1);
  const input = useRef<HTMLInputElement>(null);
  const listId = useId();
  const live = useLiveSearch(text, context);
  const hits: SearchHit[] = open ? (live.result?.hits ?? []) : [];
  useSlashToFocus(input);
  useEffect(() => setActive(-1), [live.answered]);

  const choose = (hit: SearchHit) => window.location.assign(`/fixes/${hit.slug}`);
  const onKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    if (event.key === 'ArrowDown' || event.key === 'ArrowUp') {
      event.preventDefault();
      setOpen(true);
      const key = event.key;
      setActive((current) => nextActive(current, hits.length, key));
    } else if (event.key === 'Enter' && active >= 0 && hits[active]) {
      event.preventDefault();
      choose(hits[active]);
    } else if (event.key === 'Escape') {
      setOpen(false);
      setActive(-1);
    }
  };

  const expanded = open && text.trim().length >= 2;
  return (
    <div className="relative min-w-0 flex-1">
      <label className="block">
        <span className="sr-only">Search fixes by symptom, machine or error code</span>
        <input
          ref={input}
          className="input text-base"
          type="search"
          name="q"
          value={text}
          maxLength={MAX_QUERY_LENGTH}
          placeholder="Symptom, machine or error code (press / to search)"
          autoComplete="off"
          role="combobox"
          aria-expanded={expanded && hits.length > 0}
          aria-controls={listId}
          aria-autocomplete="list"
          aria-activedescendant={active >= 0 ? `${listId}-${active}` : undefined}
          onChange={(event) => {
            setText(event.target.value);
            setOpen(true);
          }}
          onFocus={() => setOpen(true)}
          onBlur={() => setOpen(false)}
          onKeyDown={onKeyDown}
        />
      </label>
      <ul
        id={listId}
        role="listbox"
        aria-label="Fixes matching what you typed"
        aria-busy={live.loading}
        className={`absolute left-0 right-0 z-20 mt-1 max-h-[28rem] overflow-y-auto rounded border border-rule-strong shadow-lg ${expanded && hits.length > 0 ? '' : 'hidden'}`}
      >
        {hits.map((hit, index) => (
          <ResultOption
            key={hit.fixId}
            hit={hit}
            id={`${listId}-${index}`}
            active={index === active}
            onChoose={choose}
            onHover={() => setActive(index)}
          />
        ))}
      </ul>
      <p className="sr-only" role="status" aria-live="polite">
        {statusText(expanded, live.loading, live.failed, hits.length, live.result?.total ?? 0)}
      </p>
    </div>
  );
}

export default function SearchBox(props: SearchBoxProps): ReactElement {
  const [client] = useState(() => new QueryClient());
  return (
    <QueryClientProvider client={client}>
      <LiveSearchBox {...props} />
    </QueryClientProvider>
  );
}
