// The job sheet page's outbox: a save, bench report or order-list change made without a connection is kept on this
// device (IndexedDB) and sent in order when the connection returns; the sheet's save carries the version it was made
// on, and a sheet changed meanwhile elsewhere is merged field by field, asking only where both sides changed a field.
import {
  entriesFor,
  formValues,
  mergeSheet,
  sheetFieldLabels,
  sheetValues,
  waitingSummary,
  type FormEntries,
  type FormPost,
  type SheetEdit,
  type Waiting,
} from '@/lib/offline/queue';
import { ifMatchFor } from '@/lib/offline/job-sheet-version';
import { addToOutbox, readOutbox, removeFromOutbox, replaceInOutbox } from './outbox-store';

type Sent =
  | { result: 'sent' }
  | { result: 'offline' }
  | { result: 'refused'; message: string }
  | { result: 'conflict'; sheet: Record<string, unknown> };

const sheetForm = document.querySelector<HTMLFormElement>('form[data-offline-sheet]');
const box = document.querySelector<HTMLElement>('[data-outbox]');
const entriesOf = (form: HTMLFormElement, submitter?: HTMLElement | null): FormEntries =>
  [...new FormData(form, submitter ?? null)].filter((pair): pair is [string, string] => typeof pair[1] === 'string');
const newId = (): string => `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
const base: FormEntries = sheetForm ? entriesOf(sheetForm) : [];
let flushing = false;

async function send(item: Waiting): Promise<Sent> {
  try {
    const response =
      item.kind === 'job-sheet'
        ? await fetch(`/api/v1/job-sheets/${item.sheetId}`, {
            method: 'PATCH',
            headers: {
              'Content-Type': 'application/x-www-form-urlencoded',
              'If-Match': ifMatchFor(item.baseVersion),
              Accept: 'application/json',
            },
            body: new URLSearchParams(item.fields),
          })
        : await fetch(item.url, { method: 'POST', body: new URLSearchParams(item.fields), redirect: 'manual' });
    if (response.type === 'opaqueredirect' || response.ok) return { result: 'sent' };
    // 412 Precondition Failed: the If-Match version is stale; the answer carries the sheet as it is now.
    if (response.status === 412 && item.kind === 'job-sheet') {
      const answer = (await response.json()) as { current: Record<string, unknown> };
      return { result: 'conflict', sheet: answer.current };
    }
    const answer =
      item.kind === 'job-sheet' ? ((await response.json().catch(() => null)) as { error?: { message?: string } } | null) : null;
    return { result: 'refused', message: answer?.error?.message ?? `The server answered ${response.status}.` };
  } catch {
    return { result: 'offline' };
  }
}

/** A select's shown text for a stored value (the machine's name, the status's words); other fields as they are. */
function shown(field: string, value: string): string {
  if (value === '') return '(empty)';
  const option = sheetForm?.querySelector<HTMLOptionElement>(`select[name="${field}"] option[value="${CSS.escape(value)}"]`);
  return option?.textContent?.trim() || value;
}

function render(queue: Waiting[], note = ''): void {
  if (!box) return;
  box.hidden = queue.length === 0 && note === '';
  const offline = navigator.onLine ? '' : ' You are offline: they are sent, in order, when the connection comes back.';
  const line = document.createElement('p');
  line.textContent = `${queue.length > 0 ? waitingSummary(queue) + offline : ''} ${note}`.trim();
  box.replaceChildren(line);
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

/** Sends what waits, oldest first, and stops at the first item that cannot go yet. */
async function flush(): Promise<void> {
  if (flushing || !navigator.onLine) return render(await readOutbox());
  flushing = true;
  let sentAny = false;
  try {
    for (;;) {
      const [item] = await readOutbox();
      if (!item) break;
      const sent = await send(item);
      if (sent.result === 'sent') {
        await removeFromOutbox(item.id);
        sentAny = true;
      } else if (sent.result === 'conflict' && item.kind === 'job-sheet') {
        const merge = mergeSheet(formValues(item.base), formValues(item.fields), sheetValues(sent.sheet));
        if (merge.ask.length === 0) {
          const fields = entriesFor(item.fields, merge.mine);
          if (fields.length === 0) await removeFromOutbox(item.id);
          else await replaceInOutbox({ ...item, fields, baseVersion: Number(sent.sheet.version) });
          continue;
        }
        return chooser(item, sent.sheet, merge.ask, merge.mine);
      } else {
        const why =
          sent.result === 'refused'
            ? ` “${item.label}” was refused: ${sent.message} It stays waiting; change it on the page and save again, or sign out to drop it.`
            : '';
        return render(await readOutbox(), why);
      }
    }
  } finally {
    flushing = false;
  }
  // Everything went: show the sheet as the server now has it.
  if (sentAny && sheetForm) location.assign(`${location.pathname}?job=saved`);
  else render([]);
}

async function hold(item: Waiting): Promise<void> {
  await addToOutbox(item);
  render(await readOutbox());
}

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
for (const form of document.querySelectorAll<HTMLFormElement>('main form[method="post"]:not([data-offline-sheet])')) {
  form.addEventListener('submit', (event) => {
    if (navigator.onLine) return;
    event.preventDefault();
    const fields = entriesOf(form, event.submitter);
    if (fields.some(([name, value]) => name === 'intent' && value === 'delete')) {
      render([], 'Deleting a job sheet needs a connection: nothing was deleted.');
      return;
    }
    const label = (event.submitter?.textContent ?? form.querySelector('button')?.textContent ?? 'a form').trim();
    const item: FormPost = {
      kind: 'form-post',
      id: newId(),
      url: form.action,
      fields,
      label: `“${label}”`,
      queuedAt: new Date().toISOString(),
    };
    void hold(item);
  });
}

window.addEventListener('online', () => void flush());
window.addEventListener('offline', () => void readOutbox().then((queue) => render(queue)));
void flush();
