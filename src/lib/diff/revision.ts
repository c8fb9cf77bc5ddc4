// Compares any two revisions of a fix field by field: what the proofing desk and the compare page show. Pure.
import type { Caution, Difficulty, PartRow, Reading } from '@/lib/schemas/revision';
import { cautionLabels, difficultyLabels } from '@/lib/schemas/revision';
import { diffLinesOf, diffWordsOf, hasChanges, type DiffSpan, type LineDiff } from './text';
import { diffList, listChanged, type ListDiff } from './lists';
import { diffRows, type RowDiff } from './rows';

/** A revision reduced to what a reader can compare; labels are resolved (machine names, not ids). */
export interface ComparableRevision {
  title: string;
  symptoms: string[];
  errorCodes: string[];
  cause: string;
  /** The remedy as plain text, one block per line (bodyPlainText). */
  bodyText: string;
  parts: PartRow[];
  readings: Reading[];
  cautions: Caution[];
  difficulty: Difficulty | null;
  timeMinutes: number | null;
  machines: string[];
  chassis: string[];
  photos: { id: number; alt: string; caption: string }[];
}

export const partColumns = ['ref', 'kind', 'value', 'rating', 'quantity', 'notes'] as const;
export const readingColumns = ['testPoint', 'expected', 'measured', 'note'] as const;

export interface RevisionDiff {
  title: DiffSpan[];
  cause: DiffSpan[];
  difficulty: DiffSpan[];
  timeMinutes: DiffSpan[];
  body: LineDiff[];
  symptoms: ListDiff<string>;
  errorCodes: ListDiff<string>;
  machines: ListDiff<string>;
  chassis: ListDiff<string>;
  cautions: RowDiff[];
  parts: RowDiff[];
  readings: RowDiff[];
  photos: ListDiff<{ id: number; alt: string; caption: string }>;
  /** Names of the sections that differ, in page order; empty when the two revisions read the same. */
  changedSections: string[];
}

const difficultyText = (d: Difficulty | null) => (d ? difficultyLabels[d] : '');
const timeText = (t: number | null) => (t ? `${t} minutes` : '');

export function diffRevisions(before: ComparableRevision, after: ComparableRevision): RevisionDiff {
  const cautionRows = (list: Caution[]) => list.map((c) => ({ kind: cautionLabels[c.kind], detail: c.detail }));
  const diff: Omit<RevisionDiff, 'changedSections'> = {
    title: diffWordsOf(before.title, after.title),
    cause: diffWordsOf(before.cause, after.cause),
    difficulty: diffWordsOf(difficultyText(before.difficulty), difficultyText(after.difficulty)),
    timeMinutes: diffWordsOf(timeText(before.timeMinutes), timeText(after.timeMinutes)),
    body: diffLinesOf(before.bodyText, after.bodyText),
    symptoms: diffList(before.symptoms, after.symptoms),
    errorCodes: diffList(before.errorCodes, after.errorCodes),
    machines: diffList(before.machines, after.machines),
    chassis: diffList(before.chassis, after.chassis),
    cautions: diffRows(cautionRows(before.cautions), cautionRows(after.cautions), ['kind', 'detail'], (c) => c.kind),
    parts: diffRows(before.parts, after.parts, partColumns, (p) => p.ref),
    readings: diffRows(before.readings, after.readings, readingColumns, (r) => r.testPoint),
    photos: diffList(before.photos, after.photos, (p) => String(p.id)),
  };
  const rowsChanged = (rows: RowDiff[]) => rows.some((r) => r.status !== 'same');
  const sections: [string, boolean][] = [
    ['Title', hasChanges(diff.title)],
    ['Machines', listChanged(diff.machines) || listChanged(diff.chassis)],
    ['Symptoms', listChanged(diff.symptoms) || listChanged(diff.errorCodes)],
    ['Cause', hasChanges(diff.cause)],
    ['Difficulty and time', hasChanges(diff.difficulty) || hasChanges(diff.timeMinutes)],
    ['Cautions', rowsChanged(diff.cautions)],
    ['Remedy', diff.body.some((l) => l.kind !== 'same')],
    ['Parts', rowsChanged(diff.parts)],
    ['Readings', rowsChanged(diff.readings)],
    ['Photos', listChanged(diff.photos)],
  ];
  return { ...diff, changedSections: sections.filter(([, changed]) => changed).map(([name]) => name) };
}

/** The empty revision a new fix is compared against, so its first revision shows as all added. */
export const emptyComparable: ComparableRevision = {
  title: '',
  symptoms: [],
  errorCodes: [],
  cause: '',
  bodyText: '',
  parts: [],
  readings: [],
  cautions: [],
  difficulty: null,
  timeMinutes: null,
  machines: [],
  chassis: [],
  photos: [],
};
