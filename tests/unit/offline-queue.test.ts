// The outbox's pure logic: order and coalescing of waiting items, the comparable field texts of a job sheet
// form and of the API's sheet, the three-way field merge after a 409, and the If-Match version header.
import { describe, expect, it } from 'vitest';
import {
  enqueue,
  entriesFor,
  formValues,
  mergeSheet,
  sheetValues,
  waitingSummary,
  withoutItem,
  type FormEntries,
  type FormPost,
  type SheetEdit,
} from '@/lib/offline/queue';
import { ifMatchFor, presentFormFields, versionFromIfMatch } from '@/lib/offline/job-sheet-version';
import { savedCopyLine } from '@/lib/offline/saved-copy';

const loaded: FormEntries = [
  ['intent', 'save'],
  ['customerRef', 'Ticket 77'],
  ['machine', 'orvale-tc-40'],
  ['findings', ''],
  ['labourMinutes', '30'],
  ['parts.0.ref', 'C12'],
  ['parts.0.kind', 'capacitor'],
  ['parts.0.value', '470 µF'],
  ['parts.0.quantity', '1'],
  ['parts.1.ref', ''],
  ['parts.1.value', ''],
];

function edit(id: string, sheetId: number, changes: Record<string, string>, baseVersion = 3): SheetEdit {
  return {
    kind: 'job-sheet',
    id,
    sheetId,
    baseVersion,
    base: loaded,
    fields: loaded.map(([name, value]) => [name, changes[name] ?? value]),
    label: `edit ${id}`,
    queuedAt: '2026-12-02T10:00:00Z',
  };
}
const post = (id: string): FormPost => ({
  kind: 'form-post',
  id,
  url: '/jobs/1',
  fields: [['intent', 'to_order_list']],
  label: `post ${id}`,
  queuedAt: '',
});

describe('enqueue', () => {
  it('keeps items in the order they were made', () => {
    const queue = enqueue(enqueue(enqueue([], edit('a', 1, {})), post('b')), edit('c', 1, { findings: 'later' }));
    expect(queue.map((i) => i.id)).toEqual(['a', 'b', 'c']);
  });

  it('folds a second save of the same sheet into the waiting one, keeping its place, base and version', () => {
    const first = edit('a', 1, { findings: 'first' }, 3);
    const second = { ...edit('b', 1, { findings: 'second' }, 4), base: [] };
    const queue = enqueue([first], second);
    expect(queue).toHaveLength(1);
    expect(queue[0]).toMatchObject({ id: 'a', baseVersion: 3, base: loaded });
    expect(formValues(queue[0]!.fields).findings).toBe('second');
  });

  it('does not fold saves of different sheets, or across another waiting item', () => {
    expect(enqueue([edit('a', 1, {})], edit('b', 2, {}))).toHaveLength(2);
    expect(enqueue([edit('a', 1, {}), post('p')], edit('b', 1, {}))).toHaveLength(3);
  });

  it('removes one item by id and says in words what waits', () => {
    const queue = [edit('a', 1, {}), post('b')];
    expect(withoutItem(queue, 'a').map((i) => i.id)).toEqual(['b']);
    expect(waitingSummary([])).toBe('Nothing is waiting to be sent.');
    expect(waitingSummary(queue)).toBe('2 changes are waiting to be sent from this device: edit a; post b.');
    expect(waitingSummary([post('x')])).toBe('One change is waiting to be sent from this device: post x.');
  });
});

describe('comparable field texts', () => {
  it('reads the form: trimmed fields, part rows as lines, blank rows dropped, unknown fields ignored', () => {
    expect(formValues(loaded)).toEqual({
      customerRef: 'Ticket 77',
      machine: 'orvale-tc-40',
      findings: '',
      labourMinutes: '30',
      partsUsed: 'C12 · capacitor · 470 µF · 1',
    });
  });

  it('reads the API sheet into the same texts', () => {
    const sheet = {
      customerRef: 'Ticket 77',
      machine: { slug: 'orvale-tc-40', label: 'Orvale TC-40' },
      findings: '',
      labourMinutes: 30,
      partsUsed: [{ ref: 'C12', kind: 'capacitor', value: '470 µF', rating: '', quantity: 1, notes: '', source: 'Job sheet Ticket 77' }],
      status: 'diagnosing',
      serialNumber: null,
    };
    const values = sheetValues(sheet);
    expect(values).toMatchObject({
      customerRef: 'Ticket 77',
      machine: 'orvale-tc-40',
      labourMinutes: '30',
      serialNumber: '',
      status: 'diagnosing',
    });
    expect(values.partsUsed).toBe(formValues(loaded).partsUsed);
    expect(sheetValues({ machine: null }).machine).toBe('');
  });
});

describe('mergeSheet after a 409', () => {
  const base = { customerRef: 'T', findings: '', labourMinutes: '30', outcome: '' };

  it('sends what only this device changed, leaves what only the other changed, and asks where both differ', () => {
    const mine = { customerRef: 'T', findings: 'C12 dry', labourMinutes: '45', outcome: 'fixed' };
    const theirs = { customerRef: 'T2', findings: '', labourMinutes: '60', outcome: 'fixed' };
    expect(mergeSheet(base, mine, theirs)).toEqual({ mine: ['findings'], ask: ['labourMinutes'] });
  });

  it('needs nothing when the other device wrote the same thing, or this device changed nothing', () => {
    expect(mergeSheet(base, { ...base, findings: 'x' }, { ...base, findings: 'x' })).toEqual({ mine: [], ask: [] });
    expect(mergeSheet(base, base, { ...base, findings: 'theirs' })).toEqual({ mine: [], ask: [] });
  });

  it('only considers fields this device sent', () => {
    expect(mergeSheet(base, { findings: 'x' }, { ...base, labourMinutes: '90', findings: '' })).toEqual({ mine: ['findings'], ask: [] });
  });

  it('picks the form fields of chosen sheet fields, all part rows for the parts', () => {
    expect(entriesFor(loaded, ['findings'])).toEqual([['findings', '']]);
    expect(entriesFor(loaded, ['partsUsed']).map(([n]) => n)).toEqual([
      'parts.0.ref',
      'parts.0.kind',
      'parts.0.value',
      'parts.0.quantity',
      'parts.1.ref',
      'parts.1.value',
    ]);
  });
});

describe('the version on the wire', () => {
  it('reads If-Match "vN", absent as no check, and anything else as unreadable', () => {
    expect(versionFromIfMatch(ifMatchFor(12))).toBe(12);
    expect(versionFromIfMatch('W/"v3"')).toBe(3);
    expect(versionFromIfMatch(null)).toBeUndefined();
    expect(versionFromIfMatch('  ')).toBeUndefined();
    for (const bad of ['3', '"3"', '"v0"', '"v-1"', '*', '"v3", "v4"']) expect(versionFromIfMatch(bad)).toBe('unreadable');
  });

  it('keeps only the fields a form sent, parts by any part row', () => {
    const sheet = { customerRef: 'T', findings: '', partsUsed: [], labourMinutes: 0 };
    expect(presentFormFields(sheet, ['intent', 'findings'])).toEqual({ findings: '' });
    expect(presentFormFields(sheet, ['parts.0.ref', 'customerRef'])).toEqual({ customerRef: 'T', partsUsed: [] });
  });
});

describe('savedCopyLine', () => {
  it('names the date the copy was saved, or says only that it is a saved copy', () => {
    expect(savedCopyLine(new Date(2026, 11, 2, 16, 4))).toBe('Saved copy from 2 December 2026 at 16:04; you are offline.');
    expect(savedCopyLine(null)).toBe('Saved copy; you are offline.');
    expect(savedCopyLine(new Date('not a date'))).toBe('Saved copy; you are offline.');
    expect(savedCopyLine(new Date(2026, 11, 2, 16, 4), 'slow')).toBe(
      'Saved copy from 2 December 2026 at 16:04; the connection is slow, so this may be out of date.',
    );
    expect(savedCopyLine(null, 'slow')).toBe('Saved copy; the connection is slow, so this may be out of date.');
  });
});
