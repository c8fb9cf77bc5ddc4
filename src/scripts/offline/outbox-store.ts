// The outbox and the kept list in IndexedDB (through idb-keyval): one queue, in order, and one entry per kept fix.
import { createStore, del, get, update, values } from 'idb-keyval';
import { enqueue, withoutItem, type Waiting } from '@/lib/offline/queue';

const outbox = createStore('benchlore-outbox', 'queue');
const kept = createStore('benchlore-kept', 'fixes');
const key = 'waiting';

export async function readOutbox(): Promise<Waiting[]> {
  return (await get<Waiting[]>(key, outbox)) ?? [];
}

export async function addToOutbox(item: Waiting): Promise<void> {
  await update<Waiting[]>(key, (queue) => enqueue(queue ?? [], item), outbox);
}

export async function removeFromOutbox(id: string): Promise<void> {
  await update<Waiting[]>(key, (queue) => withoutItem(queue ?? [], id), outbox);
}

export async function replaceInOutbox(item: Waiting): Promise<void> {
  await update<Waiting[]>(key, (queue) => (queue ?? []).map((old) => (old.id === item.id ? item : old)), outbox);
}

export async function clearOutbox(): Promise<void> {
  await del(key, outbox);
}

/** A fix kept for the bench: the revision kept and every address stored for it in the kept cache. */
export interface KeptFix {
  slug: string;
  title: string;
  revision: number;
  keptAt: string;
  urls: string[];
}

export async function keptFixes(): Promise<KeptFix[]> {
  return (await values<KeptFix>(kept)).sort((a, b) => a.title.localeCompare(b.title));
}

export async function saveKept(fix: KeptFix): Promise<void> {
  await update<KeptFix>(fix.slug, () => fix, kept);
}

export async function dropKept(slug: string): Promise<void> {
  await del(slug, kept);
}
