// Results as the reader types: debounced, one request per settled query, and answers to older queries dropped.
import { useEffect, useState } from 'react';
import { keepPreviousData, useQuery } from '@tanstack/react-query';
import type { SearchResult } from '@/lib/search/result-types';

/** Long enough that a word typed at normal speed sends one request, short enough to feel immediate. */
export const TYPING_PAUSE_MS = 200;
const LIVE_RESULTS = 6;

export function useDebounced<T>(value: T, delayMs: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(timer);
  }, [value, delayMs]);
  return settled;
}

async function fetchResults(text: string, context: Record<string, string>, signal: AbortSignal): Promise<SearchResult> {
  const params = new URLSearchParams({ ...context, q: text, perPage: String(LIVE_RESULTS) });
  const response = await fetch(`/api/v1/search?${params}`, { signal, headers: { Accept: 'application/json' } });
  if (!response.ok) throw new Error(`Search answered ${response.status}`);
  return (await response.json()) as SearchResult;
}

export interface LiveSearch {
  /** The query the shown results answer ('' before the first answer). */
  answered: string;
  result: SearchResult | undefined;
  loading: boolean;
  failed: boolean;
}

/**
 * Each settled query is its own cache entry, so an answer can only ever show under the query it
 * answers; TanStack Query aborts the request of a query the reader has typed past.
 */
export function useLiveSearch(text: string, context: Record<string, string>): LiveSearch {
  const settled = useDebounced(text.trim(), TYPING_PAUSE_MS);
  const enabled = settled.length >= 2;
  const query = useQuery({
    queryKey: ['search', settled, context],
    queryFn: ({ signal }) => fetchResults(settled, context, signal),
    enabled,
    placeholderData: keepPreviousData,
    staleTime: 30_000,
    retry: 1,
  });
  const fresh = enabled && !query.isPlaceholderData;
  return {
    answered: fresh && query.data ? settled : '',
    result: enabled ? query.data : undefined,
    loading: enabled && (query.isFetching || query.isPlaceholderData),
    failed: enabled && query.isError,
  };
}
