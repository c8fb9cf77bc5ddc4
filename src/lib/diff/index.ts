// Public face of the revision diffs.
export { diffWordsOf, diffLinesOf, hasChanges, type DiffSpan, type LineDiff, type SpanKind } from './text';
export { diffList, listChanged, type ListDiff } from './lists';
export { diffRows, matchRows, type RowDiff, type CellDiff, type RowStatus } from './rows';
export { diffRevisions, emptyComparable, partColumns, readingColumns, type ComparableRevision, type RevisionDiff } from './revision';
export { comparableFrom, type LabelledRevision } from './comparable';
