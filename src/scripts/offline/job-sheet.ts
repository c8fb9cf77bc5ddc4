// The job sheet page's outbox: a save, bench report or order-list change made without a connection is kept on this
// device (IndexedDB) and sent in order when the connection returns; the sheet's save carries the version it was made
// on, and a sheet changed meanwhile elsewhere is merged field by field, asking only where both sides changed a field.
import { entriesFor, formValues, mergeSheet, sheetFieldLabels, sheetValues, type FormEntries, type SheetEdit } from '@/lib/offline/queue';
import { readOutbox, removeFromOutbox, replaceInOutbox } from './outbox-store';
import { box as outboxBox, entriesOf, flush as flushOutbox, hold, newId, send, start, type OutboxHooks } from './outbox';

const sheetForm = document.querySelector<HTMLFormElement>('form[data-offline-sheet]');
const box = outboxBox();
const base: FormEntries = sheetForm ? entriesOf(sheetForm) : [];

/** A select's shown text for a stored value (the machine's name, the status's words); other fields as they are. */
function shown(field: string, value: string): string {
  if (value === '') return '(empty)';
  const option = sheetForm?.querySelector<HTMLOptionElement>(`select[name="${field}"] option[value="${CSS.escape(value)}"]`);
  return option?.textContent?.trim() || value;
}

function chooser(item: SheetEdit, sheet: Record<string, unknown>, ask: string[], mine: string[]): void {
  if (!box) return;
  const ours = formValues(item.fields);
  const theirs = sheetValues(sheet);
  const section = document.createElement('form');
  section.className = 'conflict';
  section.innerHTML = `<h2 class="font-serif text-xl font-semibold text-teal">This job sheet was changed on another device while your changes waited</h2>
    <p class="mt-1 text-sm">Choose, field by field, which copy to keep.${mine.length > 0 ? ` Fields only you changed are sent as you typed them: ${mine.map((f) => sheetFieldLabels[f]).join(', ')}.` : ''}</p>
    <table class="mt-2 text-sm"><thead><tr><th scope="col">Field</th><th scope="col">Yours, waiting on this device</th><th scope="col">Saved from the other device</th></tr></thead><tbody></tbody></table>
    <button type="submit" class="btn mt-3">Save my choices</button>`;
  const body = section.querySelector('tbody')!;
  for (const field of ask) {
    const row = document.createElement('tr');
    const label = document.createElement('th');
    label.scope = 'row';
    label.textContent = sheetFieldLabels[field] ?? field;
    row.append(label);
    for (const [side, value] of [
      ['mine', ours[field] ?? ''],
      ['theirs', theirs[field] ?? ''],
    ] as const) {
      const cell = document.createElement('td');
      cell.dataset.side = side === 'mine' ? 'Yours, waiting on this device' : 'Saved from the other device';
      const choice = document.createElement('label');
      const radio = document.createElement('input');
      radio.type = 'radio';
      radio.name = `keep-${field}`;
      radio.value = side;
      radio.required = true;
      radio.checked = side === 'mine';
      const text = document.createElement('span');
      text.textContent = shown(field, value);
      choice.append(radio, text);
      cell.append(choice);
      row.append(cell);
    }
    body.append(row);
  }
  section.addEventListener('submit', (event) => {
    event.preventDefault();
    const chosen = ask.filter((field) => new FormData(section).get(`keep-${field}`) === 'mine');
    const fields = entriesFor(item.fields, [...mine, ...chosen]);
    const settled: SheetEdit = { ...item, fields, base: entriesFor(item.base, [...mine, ...chosen]), baseVersion: Number(sheet.version) };
    void (fields.length === 0 ? removeFromOutbox(item.id) : replaceInOutbox(settled)).then(() => flush());
  });
  box.hidden = false;
  box.replaceChildren(section);
  section.querySelector<HTMLInputElement>('input')?.focus();
}

/** A sheet edit that met a newer copy: merged field by field; only fields both sides changed are asked. */
async function conflict(item: SheetEdit, sheet: Record<string, unknown>): Promise<boolean> {
  const merge = mergeSheet(formValues(item.base), formValues(item.fields), sheetValues(sheet));
  if (merge.ask.length > 0) {
    chooser(item, sheet, merge.ask, merge.mine);
    return false;
  }
  const fields = entriesFor(item.fields, merge.mine);
  if (fields.length === 0) await removeFromOutbox(item.id);
  else await replaceInOutbox({ ...item, fields, baseVersion: Number(sheet.version) });
  return true;
}

// Everything went: show the sheet as the server now has it.
const hooks: OutboxHooks = { conflict, sent: () => location.assign(`${location.pathname}?job=saved`) };
const flush = (): Promise<void> => flushOutbox(hooks);

sheetForm?.addEventListener('submit', (event) => {
  event.preventDefault();
  const item: SheetEdit = {
    kind: 'job-sheet',
    id: newId(),
    sheetId: Number(sheetForm.dataset.offlineSheet),
    baseVersion: Number(sheetForm.dataset.version),
    base,
    fields: entriesOf(sheetForm),
    label: `your changes to job sheet ${sheetForm.querySelector<HTMLInputElement>('[name="customerRef"]')?.defaultValue ?? ''}`.trim(),
    queuedAt: new Date().toISOString(),
  };
  void (async () => {
    if ((await readOutbox()).length > 0 || !navigator.onLine) return hold(item);
    const sent = await send(item);
    if (sent.result === 'sent') location.assign(`${location.pathname}?job=saved`);
    else if (sent.result === 'offline') await hold(item);
    else if (sent.result === 'conflict') await hold(item).then(() => flush());
    // Refused: the page's own form post shows the messages beside the fields, with what was typed.
    else sheetForm.submit();
  })();
});

// The page's other forms (a bench report, the order list): offline, they wait in the same queue. Deleting does not.
start('main form[method="post"]:not([data-offline-sheet])', hooks);
