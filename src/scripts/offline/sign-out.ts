// Signing out empties this device's personal stores: pages read signed in and the job sheet changes waiting to be
// sent (after asking, when something is still waiting). What was kept for the bench was fetched signed out and stays.
import { cacheNames } from '@/lib/offline/cache-rules.mjs';
import { clearOutbox, readOutbox } from './outbox-store';

export async function signOut(form: HTMLFormElement): Promise<void> {
  const waiting = await readOutbox().catch(() => []);
  if (
    waiting.length > 0 &&
    !window.confirm(
      `${waiting.length === 1 ? 'One change is' : `${waiting.length} changes are`} still waiting to be sent from this device. Signing out drops ${waiting.length === 1 ? 'it' : 'them'}. Sign out anyway?`,
    )
  )
    return;
  await Promise.all([clearOutbox().catch(() => undefined), 'caches' in window ? caches.delete(cacheNames.pages) : undefined]);
  form.dataset.signedOut = 'yes';
  form.requestSubmit();
}
