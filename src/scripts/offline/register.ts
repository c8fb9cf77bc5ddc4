// On every page: registers the service worker, marks a page served from this device's saved copies (offline or slow), and on
// sign-out empties what holds personal data. Everything else loads only when used (a click, a sign-out).
import { savedCopyLine } from '@/lib/offline/saved-copy';
import { savedCopyMetric } from '@/lib/offline/cache-rules.mjs';

if ('serviceWorker' in navigator) {
  void navigator.serviceWorker.register('/sw.js', { scope: '/' }).catch(() => {
    // No worker (a private window, an old browser): the site works as before, only not offline.
  });
}

/** Whether the service worker answered this page from its saved copy (its answer carries a Server-Timing mark). */
function answeredFromSavedCopy(): boolean {
  const [navigation] = performance.getEntriesByType('navigation') as PerformanceNavigationTiming[];
  return navigation?.serverTiming?.some((metric) => metric.name === savedCopyMetric) ?? false;
}

/**
 * Offline, or online but answered from the saved copy because the network was too slow: say so, with the date the
 * saved copy was made.
 */
async function markSavedCopy(): Promise<void> {
  // The offline page itself says so in its heading.
  if (!('caches' in window) || document.querySelector('[data-offline-page]')) return;
  const reason = !navigator.onLine ? 'offline' : answeredFromSavedCopy() ? 'slow' : null;
  if (reason === null) return;
  const saved = await caches.match(location.href);
  const stamp = saved?.headers.get('date');
  const line = document.createElement('p');
  line.setAttribute('role', 'status');
  line.className = 'saved-copy';
  line.dataset.savedCopy = reason;
  line.textContent = savedCopyLine(stamp ? new Date(stamp) : null, reason);
  document.getElementById('main')?.prepend(line);
}
void markSavedCopy();

// A form that may wait offline (a fix page's bench report): the outbox loads with the page, to send what waits.
if (document.querySelector('form[data-offline-queue]') && !document.querySelector('form[data-offline-sheet]'))
  void import('./outbox').then(({ start }) => start('form[data-offline-queue]'));

// Controls that need this script show once it runs; "Keep for the bench" and "Bench view" load their code on the first click.
for (const hidden of document.querySelectorAll<HTMLElement>('[data-needs-script]')) hidden.hidden = false;
document.addEventListener('click', (event) => {
  const target = event.target as Element | null;
  const keep = target?.closest<HTMLButtonElement>('button[data-keep-fix]');
  if (keep) void import('./keep').then(({ keepFix }) => keepFix(keep));
  else if (target?.closest('button[data-bench-view]')) void import('./bench-view').then(({ openBenchView }) => openBenchView());
});

document.addEventListener('submit', (event) => {
  const form = event.target as HTMLFormElement;
  if (form.dataset.signedOut === 'yes' || new URL(form.action, location.href).pathname !== '/account/sign-out') return;
  event.preventDefault();
  void import('./sign-out').then(({ signOut }) => signOut(form));
});
