// The member's saved order list through the API: the whole list is sent after each change.
import type { StoredLine } from '../../../lib/tools/order-list';

export type SaveState = 'idle' | 'saving' | 'saved' | 'failed';

export async function saveAccountLines(lines: readonly StoredLine[]): Promise<StoredLine[]> {
  const response = await fetch('/api/v1/order-list', {
    method: 'PUT',
    headers: { 'Content-Type': 'application/json', Accept: 'application/json' },
    body: JSON.stringify({ lines }),
    credentials: 'same-origin',
  });
  if (!response.ok) {
    const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
    throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
  }
  const body = (await response.json()) as { lines: StoredLine[] };
  return body.lines;
}
