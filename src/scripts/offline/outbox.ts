// The outbox on a page: a form posted without a connection waits in the one queue on this device (IndexedDB, see
// outbox-store.ts) and is sent, in order, when the connection returns; the page's [data-outbox] box says what waits.
// The job sheet page adds its own save and conflict chooser (job-sheet.ts); a fix page's bench report uses this alone.
import { waitingSummary, type FormEntries, type FormPost, type SheetEdit, type Waiting } from '@/lib/offline/queue';
import { ifMatchFor } from '@/lib/offline/job-sheet-version';
import { addToOutbox, readOutbox, removeFromOutbox } from './outbox-store';

export type Sent =
  | { result: 'sent' }
  | { result: 'offline' }
  | { result: 'refused'; message: string }
  | { result: 'conflict'; sheet: Record<string, unknown> };

export interface OutboxHooks {
  /** A sheet edit met a newer copy: settle it and answer true to go on sending, or show a chooser and answer false. */
  conflict?: (item: SheetEdit, sheet: Record<string, unknown>) => Promise<boolean>;
  /** Everything waiting went. */
  sent?: (items: Waiting[]) => void;
}

export const box = (): HTMLElement | null => document.querySelector<HTMLElement>('[data-outbox]');
/** The page's line about what waits nearest after a form (a page may have one under each kind of form). */
const boxAfter = (form: HTMLFormElement): HTMLElement | null =>
  [...document.querySelectorAll<HTMLElement>('[data-outbox]')].find(
    (shown) => form.compareDocumentPosition(shown) & Node.DOCUMENT_POSITION_FOLLOWING,
  ) ?? box();
export const entriesOf = (form: HTMLFormElement, submitter?: HTMLElement | null): FormEntries =>
  [...new FormData(form, submitter ?? null)].filter((pair): pair is [string, string] => typeof pair[1] === 'string');
export const newId = (): string => `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 8)}`;
let flushing = false;
/** The page's hooks, kept from start() so a choice made on a refused item can send the rest the same way. */
let pageHooks: OutboxHooks = {};

/** The form on this page that posts where `item` goes, if any: a refused item's fields can go back into it. */
const formFor = (item: FormPost): HTMLFormElement | undefined =>
  [...document.querySelectorAll<HTMLFormElement>('form[data-offline-queue]')].find((form) => form.action === item.url);

/** Puts a refused item's fields back into its form (what was typed is not lost), ready to change and send again. */
function putBack(form: HTMLFormElement, item: FormPost): void {
  for (const [name, value] of item.fields) {
    const field = form.elements.namedItem(name);
    if (field instanceof HTMLInputElement && (field.type === 'hidden' || field.type === 'submit')) continue;
    if (field instanceof RadioNodeList) {
      for (const option of field) if (option instanceof HTMLInputElement) option.checked = option.value === value;
    } else if (field instanceof HTMLInputElement && field.type === 'checkbox') field.checked = true;
    else if (field instanceof HTMLInputElement || field instanceof HTMLTextAreaElement || field instanceof HTMLSelectElement)
      field.value = value;
  }
  form.scrollIntoView({ block: 'nearest' });
  form.querySelector<HTMLElement>('textarea, input:not([type=hidden]), select')?.focus();
}

/** The choices under a refused item: back into its form when the form is on this page, or left out; then the rest go. */
function refusedChoices(item: Waiting): HTMLElement {
  const choices = document.createElement('p');
  choices.className = 'outbox__choices';
  const choice = (words: string, act?: () => void) => {
    const button = document.createElement('button');
    button.type = 'button';
    button.className = 'btn-quiet';
    button.textContent = words;
    button.addEventListener('click', () => {
      act?.();
      void removeFromOutbox(item.id).then(() => flush(pageHooks));
    });
    choices.append(button);
  };
  const form = item.kind === 'form-post' ? formFor(item) : undefined;
  if (form && item.kind === 'form-post') choice('Put it back in the form to change it', () => putBack(form, item));
  choice('Leave it out and send the rest');
  return choices;
}

export async function send(item: Waiting): Promise<Sent> {
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
        : await fetch(item.url, { method: 'POST', body: new URLSearchParams(item.fields) });
    // A page form answers a refusal either with an error status or, for the order list's add, with a redirect to
    // the list naming the problem (?problem=…): the redirect is followed to tell the two apart.
    if (item.kind === 'form-post' && response.ok && new URL(response.url).searchParams.has('problem'))
      return { result: 'refused', message: 'Nothing was added; open your order list to see why.' };
    if (response.ok) return { result: 'sent' };
    // 412 Precondition Failed: the If-Match version is stale; the answer carries the sheet as it is now.
    if (response.status === 412 && item.kind === 'job-sheet') {
      const answer = (await response.json()) as { current: Record<string, unknown> };
      return { result: 'conflict', sheet: answer.current };
    }
    const answer =
      item.kind === 'job-sheet' ? ((await response.json().catch(() => null)) as { error?: { message?: string } } | null) : null;
    return {
      result: 'refused',
      message: answer?.error?.message ?? `The server answered ${response.status}; send it again from its form to see why.`,
    };
  } catch {
    return { result: 'offline' };
  }
}

/**
 * Says what waits (and `note`) in every such line of the page: the whole queue, as it is sent in one order. A refused
 * item at the head of the queue gets its choices under the line.
 */
export function render(queue: Waiting[], note = '', refused?: Waiting): void {
  const offline = navigator.onLine ? '' : ' You are offline: they are sent, in order, when the connection comes back.';
  for (const shown of document.querySelectorAll<HTMLElement>('[data-outbox]')) {
    shown.hidden = queue.length === 0 && note === '';
    const line = document.createElement('p');
    line.textContent = [queue.length > 0 ? waitingSummary(queue) + offline : '', note.trim()].filter((part) => part !== '').join(' ');
    shown.replaceChildren(line, ...(refused ? [refusedChoices(refused)] : []));
  }
}

export async function hold(item: Waiting): Promise<void> {
  await addToOutbox(item);
  render(await readOutbox());
}

/** Sends what waits, oldest first, and stops at the first item that cannot go yet. */
export async function flush(hooks: OutboxHooks = {}): Promise<void> {
  if (flushing || !navigator.onLine) return render(await readOutbox());
  flushing = true;
  const sent: Waiting[] = [];
  try {
    for (;;) {
      const [item] = await readOutbox();
      if (!item) break;
      const answer = await send(item);
      if (answer.result === 'sent') {
        await removeFromOutbox(item.id);
        sent.push(item);
      } else if (answer.result === 'conflict' && item.kind === 'job-sheet') {
        if (hooks.conflict) {
          if (await hooks.conflict(item, answer.sheet)) continue;
          return;
        }
        return render(
          await readOutbox(),
          `Job sheet changes met a newer copy: open ${item.label.replace(/^your changes to /, '')} to choose.`,
        );
      } else {
        if (answer.result !== 'refused') return render(await readOutbox());
        // The label already reads as a phrase (“your bench report on …”, “adding … to your order list”).
        const why = ` ${item.label.charAt(0).toUpperCase()}${item.label.slice(1)} was refused: ${answer.message} It stays waiting and holds up what follows it: choose below.`;
        return render(await readOutbox(), why, item);
      }
    }
  } finally {
    flushing = false;
  }
  if (sent.length > 0 && hooks.sent) hooks.sent(sent);
  else render([], sent.length > 0 ? `Sent from this device: ${sent.map((item) => item.label).join('; ')}.` : '');
}

/**
 * Offline, the forms matched by `selector` wait in the queue instead of posting; deleting never waits. A form may name
 * what it sends in data-offline-label ("your bench report on …"); otherwise its button's words are used.
 */
export function start(selector: string, hooks: OutboxHooks = {}): void {
  pageHooks = hooks;
  for (const form of document.querySelectorAll<HTMLFormElement>(selector)) {
    form.addEventListener('submit', (event) => {
      if (navigator.onLine) return;
      event.preventDefault();
      const fields = entriesOf(form, event.submitter);
      if (fields.some(([name, value]) => name === 'intent' && value === 'delete')) {
        render([], 'Deleting a job sheet needs a connection: nothing was deleted.');
        return;
      }
      const button = (event.submitter?.textContent ?? form.querySelector('button')?.textContent ?? 'a form').trim();
      const item: FormPost = {
        kind: 'form-post',
        id: newId(),
        url: form.action,
        fields,
        label: form.dataset.offlineLabel ?? `“${button}”`,
        queuedAt: new Date().toISOString(),
      };
      // The line saying it waits shows where the reader is looking: by the button just pressed.
      void hold(item).then(() => boxAfter(form)?.scrollIntoView({ block: 'nearest' }));
    });
    // The form now waits offline instead of failing (a test waits for this before cutting the connection).
    form.dataset.outboxReady = 'yes';
  }
  window.addEventListener('online', () => void flush(hooks));
  window.addEventListener('offline', () => void readOutbox().then((queue) => render(queue)));
  void flush(hooks);
}
