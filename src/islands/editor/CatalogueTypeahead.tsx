// A combobox over the catalogue (ARIA 1.2 pattern): type part of a model number, maker or chassis, pick with the keys.
import { useEffect, useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { callApi } from './api';

export interface LookupHit {
  kind: 'machine' | 'chassis';
  id: number;
  slug: string;
  label: string;
}

interface TypeaheadProps {
  label: string;
  onPick: (hit: LookupHit) => void;
  /** Hits already chosen are not offered again. */
  exclude: (hit: LookupHit) => boolean;
}

function useDebounced(value: string, ms: number): string {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

export function CatalogueTypeahead({ label, onPick, exclude }: TypeaheadProps) {
  const id = useId();
  const [text, setText] = useState('');
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const q = useDebounced(text.trim(), 250);
  const lookup = useQuery({
    queryKey: ['catalogue-lookup', q],
    enabled: q.length >= 2,
    staleTime: 60_000,
    queryFn: async () => {
      const result = await callApi<{ hits: LookupHit[] }>(`/api/v1/catalogue-lookup?${new URLSearchParams({ q })}`, { method: 'GET' });
      if (!result.ok) throw new Error(result.failure.message);
      return result.data.hits;
    },
  });
  const hits = (lookup.data ?? []).filter((h) => !exclude(h));
  const expanded = open && q.length >= 2 && text.trim() !== '';
  const pick = (hit: LookupHit | undefined) => {
    if (!hit) return;
    onPick(hit);
    setText('');
    setOpen(false);
    setActive(0);
  };
  const status = lookup.isFetching
    ? 'Looking…'
    : lookup.isError
      ? `The catalogue could not be searched: ${lookup.error.message}`
      : expanded
        ? `${hits.length} match${hits.length === 1 ? '' : 'es'}`
        : '';
  return (
    <div className="relative font-sans">
      <label htmlFor={`${id}-input`} className="block font-semibold">
        {label}
      </label>
      <input
        id={`${id}-input`}
        className="input w-full"
        role="combobox"
        aria-expanded={expanded}
        aria-controls={`${id}-list`}
        aria-autocomplete="list"
        aria-activedescendant={expanded && hits[active] ? `${id}-opt-${active}` : undefined}
        aria-describedby={`${id}-status`}
        value={text}
        placeholder="e.g. DR-410 or the maker's name"
        onChange={(e) => {
          setText(e.target.value);
          setOpen(true);
          setActive(0);
        }}
        onBlur={() => setTimeout(() => setOpen(false), 150)}
        onKeyDown={(e) => {
          if (e.key === 'ArrowDown') {
            e.preventDefault();
            setOpen(true);
            setActive((a) => Math.min(a + 1, Math.max(0, hits.length - 1)));
          } else if (e.key === 'ArrowUp') {
            e.preventDefault();
            setActive((a) => Math.max(0, a - 1));
          } else if (e.key === 'Enter' && expanded) {
            e.preventDefault();
            pick(hits[active]);
          } else if (e.key === 'Escape') {
            setOpen(false);
          }
        }}
      />
      <p id={`${id}-status`} className="sr-only" aria-live="polite">
        {status}
      </p>
      <ul
        id={`${id}-list`}
        role="listbox"
        aria-label={`${label}: matches`}
        hidden={!expanded || hits.length === 0}
        className="absolute z-10 mt-1 max-h-64 w-full overflow-auto rounded border border-rule-strong bg-paper shadow"
      >
        {hits.map((hit, i) => (
          <li
            key={`${hit.kind}-${hit.id}`}
            id={`${id}-opt-${i}`}
            role="option"
            aria-selected={i === active}
            className={`cursor-pointer px-3 py-1 ${i === active ? 'bg-teal-wash' : ''}`}
            onMouseDown={(e) => e.preventDefault()}
            onClick={() => pick(hit)}
          >
            <span className="text-ink-soft">{hit.kind === 'machine' ? 'Machine' : 'Chassis family'}:</span> {hit.label}
          </li>
        ))}
      </ul>
    </div>
  );
}
