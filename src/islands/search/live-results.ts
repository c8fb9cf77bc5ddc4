// Results as the reader types, without a framework: one request per settled query, each answer kept under the
// query it answers (so a late answer to an older query is never shown), the request for a query typed past aborted.
import { MAX_QUERY_LENGTH } from '@/lib/search/tokens';
import type { SearchHit, SearchResult } from '@/lib/search/result-types';

/** Long enough that a word typed at normal speed sends one request, short enough to feel immediate. */
export const TYPING_PAUSE_MS = 200;
export const LIVE_RESULTS = 6;
/** An answer is reused for this long when the reader types the same query again. */
const FRESH_MS = 30_000;

/** The text worth asking about, or null: at least two characters, at most what the server accepts. */
export function liveQueryText(typed: string): string | null {
  const text = typed.trim();
  return text.length >= 2 && text.length <= MAX_QUERY_LENGTH ? text : null;
}

/** A plain check of the answer's shape: live results show only what has the fields they need. */
export function isSearchAnswer(value: unknown): value is Pick<SearchResult, 'hits' | 'total'> {
  if (typeof value !== 'object' || value === null) return false;
  const { hits, total } = value as { hits?: unknown; total?: unknown };
  return Array.isArray(hits) && typeof total === 'number' && hits.every(isHit);
}

function isHit(value: unknown): value is SearchHit {
  if (typeof value !== 'object' || value === null) return false;
  const hit = value as Record<string, unknown>;
  return (
    typeof hit.slug === 'string' &&
    typeof hit.titleHtml === 'string' &&
    typeof hit.snippetHtml === 'string' &&
    Array.isArray(hit.machines) &&
    Array.isArray(hit.matched) &&
    typeof hit.benchScore === 'object' &&
    hit.benchScore !== null
  );
}

export type LiveState =
  | { kind: 'idle' }
  | { kind: 'loading'; query: string; previous: Answer | null }
  | { kind: 'answered'; query: string; answer: Answer }
  | { kind: 'failed'; query: string };

export interface Answer {
  hits: SearchHit[];
  total: number;
}

export interface LiveSearchOptions {
  context: Record<string, string>;
  onChange: (state: LiveState) => void;
  fetchImpl?: typeof fetch;
  pauseMs?: number;
}

/** Feeds typed text in with `type(text)`; reports each change of what to show through `onChange`. */
export function liveSearch({ context, onChange, fetchImpl = fetch, pauseMs = TYPING_PAUSE_MS }: LiveSearchOptions) {
  const answers = new Map<string, { answer: Answer; at: number }>();
  let timer: ReturnType<typeof setTimeout> | undefined;
  let inFlight: AbortController | null = null;
  let wanted: string | null = null;
  let shown: Answer | null = null;

  async function ask(query: string, attempt = 0): Promise<void> {
    const kept = answers.get(query);
    if (kept && Date.now() - kept.at < FRESH_MS) return settle(query, kept.answer);
    inFlight?.abort();
    const controller = new AbortController();
    inFlight = controller;
    onChange({ kind: 'loading', query, previous: shown });
    const params = new URLSearchParams({ ...context, q: query, perPage: String(LIVE_RESULTS) });
    try {
      const response = await fetchImpl(`/api/v1/search?${params}`, { signal: controller.signal, headers: { Accept: 'application/json' } });
      if (!response.ok) throw new Error(`Search answered ${response.status}`);
      const body: unknown = await response.json();
      if (!isSearchAnswer(body)) throw new Error('Search answered in an unexpected shape');
      const answer = { hits: body.hits, total: body.total };
      answers.set(query, { answer, at: Date.now() });
      settle(query, answer);
    } catch (error) {
      if (controller.signal.aborted || wanted !== query) return;
      if (attempt < 1) return ask(query, attempt + 1);
      if (error instanceof Error) onChange({ kind: 'failed', query });
    } finally {
      if (inFlight === controller) inFlight = null;
    }
  }

  function settle(query: string, answer: Answer): void {
    // Only the answer to the query still wanted is shown.
    if (wanted !== query) return;
    shown = answer;
    onChange({ kind: 'answered', query, answer });
  }

  return {
    type(text: string): void {
      clearTimeout(timer);
      const query = liveQueryText(text);
      wanted = query;
      if (query === null) {
        inFlight?.abort();
        shown = null;
        onChange({ kind: 'idle' });
        return;
      }
      timer = setTimeout(() => void ask(query), pauseMs);
    },
  };
}
