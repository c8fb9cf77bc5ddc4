// What waits on this device to be sent, and how a job sheet edit that met a newer copy is merged: pure logic,
// no storage and no network (src/scripts/offline/outbox-store.ts keeps the queue in IndexedDB, outbox.ts sends it).

/** A form's fields in order, as [name, value] pairs (what FormData and URLSearchParams give). */
export type FormEntries = [string, string][];

/** A save of the job sheet form, sent to the job sheet API with the version it was made on. */
export interface SheetEdit {
  kind: 'job-sheet';
  id: string;
  sheetId: number;
  /** The sheet's version when the page was loaded: the copy this edit was made on. */
  baseVersion: number;
  /** The form as loaded (that version's values), to tell which side changed a field. */
  base: FormEntries;
  fields: FormEntries;
  label: string;
  queuedAt: string;
}

/** Any other form of the page (a bench report, an order-list change), posted as it would have been. */
export interface FormPost {
  kind: 'form-post';
  id: string;
  url: string;
  fields: FormEntries;
  label: string;
  queuedAt: string;
}

export type Waiting = SheetEdit | FormPost;

/**
 * Adds an item at the end. A sheet edit right after a waiting edit of the same sheet replaces it (the newer form holds
 * every field), keeping the older one's place, base and version; anything else keeps its order.
 */
export function enqueue(queue: readonly Waiting[], item: Waiting): Waiting[] {
  const last = queue.at(-1);
  if (item.kind === 'job-sheet' && last?.kind === 'job-sheet' && last.sheetId === item.sheetId) {
    return [...queue.slice(0, -1), { ...item, id: last.id, base: last.base, baseVersion: last.baseVersion }];
  }
  return [...queue, item];
}

export function withoutItem(queue: readonly Waiting[], id: string): Waiting[] {
  return queue.filter((item) => item.id !== id);
}

/** Plain words for the page: what is waiting, oldest first. */
export function waitingSummary(queue: readonly Waiting[]): string {
  if (queue.length === 0) return 'Nothing is waiting to be sent.';
  const count = queue.length === 1 ? 'One change is' : `${queue.length} changes are`;
  return `${count} waiting to be sent from this device: ${queue.map((item) => item.label).join('; ')}.`;
}

export const sheetFieldLabels: Record<string, string> = {
  customerRef: 'Customer reference',
  machine: 'Machine',
  serialNumber: 'Serial number',
  reportedSymptom: 'Reported symptom',
  status: 'Status',
  findings: 'Findings',
  partsUsed: 'Parts used',
  labourMinutes: 'Labour (minutes)',
  outcome: 'Outcome',
};

const partColumns = ['ref', 'kind', 'value', 'rating', 'quantity', 'notes'] as const;

function partLine(row: Record<string, unknown>): string {
  const cells = partColumns.map((column) => String(row[column] ?? '').trim());
  return cells.some((cell) => cell !== '') ? cells.filter((cell) => cell !== '').join(' · ') : '';
}

/** The form's fields as one comparable text per sheet field; part rows become one line each, blank rows dropped. */
export function formValues(entries: FormEntries): Record<string, string> {
  const values: Record<string, string> = {};
  const rows = new Map<number, Record<string, string>>();
  for (const [name, value] of entries) {
    const part = /^parts\.(\d{1,3})\.(\w+)$/.exec(name);
    if (part) {
      const row = rows.get(Number(part[1])) ?? {};
      row[part[2]!] = value;
      rows.set(Number(part[1]), row);
    } else if (name in sheetFieldLabels) values[name] = value.trim();
  }
  if (rows.size > 0 || entries.some(([name]) => name.startsWith('parts.'))) {
    values.partsUsed = [...rows.entries()]
      .sort(([a], [b]) => a - b)
      .map(([, row]) => partLine(row))
      .filter((line) => line !== '')
      .join('\n');
  }
  return values;
}

/** The sheet as the API answers it, in the same comparable texts as formValues. */
export function sheetValues(sheet: Record<string, unknown>): Record<string, string> {
  const values: Record<string, string> = {};
  for (const field of Object.keys(sheetFieldLabels)) {
    const value = sheet[field];
    if (field === 'machine') values.machine = (value as { slug?: string } | null)?.slug ?? '';
    else if (field === 'partsUsed')
      values.partsUsed = ((value as Record<string, unknown>[] | undefined) ?? [])
        .map(partLine)
        .filter((line) => line !== '')
        .join('\n');
    else values[field] = value === null || value === undefined ? '' : String(value).trim();
  }
  return values;
}

export interface Merge {
  /** Fields only this device changed: sent as typed here. */
  mine: string[];
  /** Fields both changed, differently: the technician chooses. */
  ask: string[];
}

/**
 * Three-way, field by field: a field the other device changed and this one did not stays as the other device wrote
 * it; one only this device changed is sent; one both changed to different values is asked; equal values need nothing.
 */
export function mergeSheet(base: Record<string, string>, mine: Record<string, string>, theirs: Record<string, string>): Merge {
  const merge: Merge = { mine: [], ask: [] };
  for (const field of Object.keys(sheetFieldLabels)) {
    if (!(field in mine)) continue;
    const ours = mine[field]!;
    const other = theirs[field] ?? '';
    if (ours === other) continue;
    const original = base[field] ?? '';
    if (ours === original) continue;
    if (other === original) merge.mine.push(field);
    else merge.ask.push(field);
  }
  return merge;
}

/** The form fields that carry the sheet fields chosen from this device (all part rows for "partsUsed"). */
export function entriesFor(entries: FormEntries, fields: readonly string[]): FormEntries {
  const chosen = new Set(fields);
  return entries.filter(([name]) => (name.startsWith('parts.') ? chosen.has('partsUsed') : chosen.has(name)));
}
