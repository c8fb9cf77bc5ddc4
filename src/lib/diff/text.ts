// Word- and line-level text diffs as plain spans, for the proofing desk and the compare page. Pure.
import { diffLines, diffWordsWithSpace } from 'diff';

export type SpanKind = 'same' | 'added' | 'removed';

export interface DiffSpan {
  kind: SpanKind;
  text: string;
}

export interface LineDiff {
  kind: SpanKind | 'changed';
  /** For a changed line, the words that changed within it; otherwise one span. */
  spans: DiffSpan[];
}

function toSpans(changes: { value: string; added: boolean; removed: boolean }[]): DiffSpan[] {
  return changes.filter((c) => c.value !== '').map((c) => ({ kind: c.added ? 'added' : c.removed ? 'removed' : 'same', text: c.value }));
}

/** Words that differ between two short texts (a title, a cause, a note). */
export function diffWordsOf(before: string, after: string): DiffSpan[] {
  return mergeChangeRuns(toSpans(diffWordsWithSpace(before, after)));
}

/**
 * "idler tyre" → "loading belt" comes back from the word diff as two replacements around a shared space; a reader
 * wants one replacement. Runs of changes joined only by whitespace become one removal followed by one addition.
 */
function mergeChangeRuns(spans: DiffSpan[]): DiffSpan[] {
  const out: DiffSpan[] = [];
  let i = 0;
  while (i < spans.length) {
    if (spans[i]!.kind === 'same') {
      out.push(spans[i]!);
      i++;
      continue;
    }
    let end = i;
    // Extend over whitespace-only shared spans that have another change after them.
    while (
      end + 1 < spans.length &&
      (spans[end + 1]!.kind !== 'same' || (/^\s+$/.test(spans[end + 1]!.text) && spans[end + 2] && spans[end + 2]!.kind !== 'same'))
    )
      end++;
    const run = spans.slice(i, end + 1);
    const removed = run
      .filter((s) => s.kind !== 'added')
      .map((s) => s.text)
      .join('');
    const added = run
      .filter((s) => s.kind !== 'removed')
      .map((s) => s.text)
      .join('');
    if (run.some((s) => s.kind === 'removed')) out.push({ kind: 'removed', text: removed });
    if (run.some((s) => s.kind === 'added')) out.push({ kind: 'added', text: added });
    i = end + 1;
  }
  return out;
}

export function hasChanges(spans: DiffSpan[]): boolean {
  return spans.some((s) => s.kind !== 'same');
}

/**
 * Line by line for long texts (a remedy as plain text, one block per line): a removed line followed by an added
 * one is shown as one changed line with its words marked, which reads better than two whole lines.
 */
export function diffLinesOf(before: string, after: string): LineDiff[] {
  const split = (value: string) => value.replace(/\n$/, '').split('\n');
  const raw = diffLines(
    before.endsWith('\n') || before === '' ? before : `${before}\n`,
    after.endsWith('\n') || after === '' ? after : `${after}\n`,
  );
  const out: LineDiff[] = [];
  for (let i = 0; i < raw.length; i++) {
    const change = raw[i]!;
    const next = raw[i + 1];
    if (change.removed && next?.added) {
      out.push(...pairLines(split(change.value), split(next.value)));
      i++;
      continue;
    }
    const kind: SpanKind = change.added ? 'added' : change.removed ? 'removed' : 'same';
    for (const line of split(change.value)) out.push({ kind, spans: [{ kind, text: line }] });
  }
  return out;
}

/** Pairs removed and added lines in order; lines left over stay whole removals or additions. */
function pairLines(removed: string[], added: string[]): LineDiff[] {
  const out: LineDiff[] = [];
  const pairs = Math.min(removed.length, added.length);
  for (let i = 0; i < pairs; i++) out.push({ kind: 'changed', spans: diffWordsOf(removed[i]!, added[i]!) });
  for (const line of removed.slice(pairs)) out.push({ kind: 'removed', spans: [{ kind: 'removed', text: line }] });
  for (const line of added.slice(pairs)) out.push({ kind: 'added', spans: [{ kind: 'added', text: line }] });
  return out;
}
