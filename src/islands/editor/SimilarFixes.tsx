// Beside the symptoms: live fixes for the same machine or family that look like the one being written.
import { useCallback, useEffect, useMemo, useState } from 'react';
import { useQueries, type UseQueryResult } from '@tanstack/react-query';
import { useWatch, type Control } from 'react-hook-form';
import type { FixDraft, FixDraftInput } from '@/lib/schemas/fix-draft';
import { benchScoreText } from '@/lib/search/bench-label';
import type { SimilarFix } from '@/lib/search/result-types';
import { mergeSimilar, similarHeading, similarPath, similarRequests, type SimilarRequest } from '@/lib/search/similar-request';
import { useDebounced } from './use-debounced';
import { callApi } from './api';
import type { LabelledRefData } from '../../lib/writing/editor-data';

/** Longer than the search box's pause: the writer is composing a sentence, not hunting, and a warning should not flicker. */
const WRITING_PAUSE_MS = 500;

type Answer = { state: 'idle' | 'loading' | 'failed' } | { state: 'ready'; fixes: SimilarFix[] };

async function askSimilar(path: string, signal: AbortSignal): Promise<SimilarFix[]> {
  const result = await callApi<{ items: SimilarFix[] }>(path, { method: 'GET', signal });
  if (!result.ok) throw new Error(result.failure.message);
  return result.data.items;
}

interface SimilarFixesProps {
  control: Control<FixDraftInput, unknown, FixDraft>;
  machines: LabelledRefData[];
  chassis: LabelledRefData[];
  /** The live fix being edited, never offered as its own duplicate; null for a new fix. */
  editingSlug: string | null;
}

export function SimilarFixes({ control, machines, chassis, editingSlug }: SimilarFixesProps) {
  // Watched here, not in the form, so a keystroke re-renders this notice and not the whole editor.
  const [title, symptoms] = useWatch({ control, name: ['title', 'symptoms'] });
  // Debounced as text: a fresh array each render would restart the pause for ever.
  const settled = useDebounced(
    JSON.stringify(similarRequests({ title: title ?? '', symptoms: symptoms ?? [], machines, chassis })),
    WRITING_PAUSE_MS,
  );
  const requests = useMemo(() => JSON.parse(settled) as SimilarRequest[], [settled]);
  // Each request is its own cache entry: a late answer to an older subject can only fill its own entry, never this notice.
  const combine = useCallback(
    (results: UseQueryResult<SimilarFix[]>[]): Answer => {
      if (results.length === 0) return { state: 'idle' };
      if (results.some((r) => r.isError)) return { state: 'failed' };
      if (!results.every((r) => r.isSuccess)) return { state: 'loading' };
      return {
        state: 'ready',
        fixes: mergeSimilar(
          results.map((r) => r.data ?? []),
          editingSlug,
        ),
      };
    },
    [editingSlug],
  );
  const answer = useQueries({
    queries: requests.map((request) => {
      const path = similarPath(request);
      return {
        queryKey: ['similar-fixes', path],
        queryFn: ({ signal }: { signal: AbortSignal }) => askSimilar(path, signal),
        staleTime: 60_000,
        retry: false,
      };
    }),
    combine,
  });
  // While the next answer loads the last one stays, so the notice does not blink at every pause in typing;
  // a failure or a draft with nothing to compare clears it (a warning that cannot be checked says nothing).
  const [shown, setShown] = useState<SimilarFix[]>([]);
  useEffect(() => {
    if (answer.state === 'ready') setShown(answer.fixes);
    else if (answer.state !== 'loading') setShown([]);
  }, [answer]);

  const askedAboutMachine = requests.some((r) => r.target.kind === 'machine');
  return (
    // Always in the page, empty when there is nothing to say: a live region added with its text is often not read out.
    <div role="status" aria-live="polite">
      {shown.length > 0 && (
        <div className="mt-3 grid gap-2 rounded border border-rule bg-teal-wash p-3 font-sans text-sm" data-similar-fixes>
          <p className="font-semibold text-teal">{similarHeading(shown, askedAboutMachine)}</p>
          <p className="text-ink-soft">
            If one of them is the fault you are writing up, a bench report or an improvement to it helps readers more than a second fix.
            Your draft is kept either way.
          </p>
          <ul className="grid gap-2" role="list">
            {shown.map((fix) => (
              <li key={fix.slug}>
                <a className="font-serif font-semibold text-teal underline" href={`/fixes/${fix.slug}`} target="_blank" rel="noopener">
                  {fix.title}
                  <span className="sr-only"> (opens in a new tab)</span>
                </a>
                {fix.machines.length > 0 && (
                  <span className="block font-mono text-xs text-ink-soft">
                    {fix.machines.slice(0, 3).join(', ')}
                    {fix.machines.length > 3 ? ' …' : ''}
                  </span>
                )}
                <span className="block text-xs text-ink-soft">{benchScoreText(fix.benchScore.score, fix.benchScore.reports)}</span>
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
