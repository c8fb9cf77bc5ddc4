// "Keep for the bench": stores a fix page as a signed-out reader sees it, its photos (every size offered) and the
// bench tools it links, in the kept cache that the service worker answers from when the network is gone.
import { cacheNames } from '@/lib/offline/cache-rules.mjs';
import { dropKept, keptFixes, saveKept, type KeptFix } from './outbox-store';

/** Same-origin addresses a kept fix needs besides itself: its photos and the bench tools it links. */
function neededAddresses(page: Document): string[] {
  const urls = new Set<string>();
  const article = page.querySelector('article.fix') ?? page;
  for (const img of article.querySelectorAll<HTMLImageElement | HTMLSourceElement>('img[src], img[srcset], source[srcset]')) {
    const candidates = [
      img.getAttribute('src') ?? '',
      ...(img.getAttribute('srcset') ?? '').split(',').map((c) => c.trim().split(/\s+/)[0] ?? ''),
    ];
    for (const candidate of candidates) if (candidate.startsWith('/media/')) urls.add(candidate);
  }
  for (const link of article.querySelectorAll<HTMLAnchorElement>('a[href^="/tools/"]')) urls.add(link.getAttribute('href')!.split('#')[0]!);
  return [...urls];
}

async function store(cache: Cache, url: string): Promise<void> {
  const response = await fetch(url, { credentials: 'omit' });
  if (!response.ok) throw new Error(`${url} answered ${response.status}`);
  await cache.put(url, response);
}

export async function keepFix(button: HTMLButtonElement): Promise<void> {
  const { keepFix: slug = '', revision = '0', title = '' } = button.dataset;
  const status = button.parentElement?.querySelector<HTMLElement>('[data-keep-status]');
  const say = (text: string): void => {
    if (status) status.textContent = text;
  };
  button.disabled = true;
  say('Keeping this fix, its photos and bench tools on this device…');
  try {
    const page = `/fixes/${slug}`;
    const response = await fetch(page, { credentials: 'omit' });
    if (!response.ok) throw new Error(`the fix answered ${response.status}`);
    const html = await response.text();
    const cache = await caches.open(cacheNames.kept);
    await cache.put(page, new Response(html, { headers: response.headers }));
    const others = neededAddresses(new DOMParser().parseFromString(html, 'text/html'));
    await Promise.all(others.map((url) => store(cache, url)));
    const kept: KeptFix = { slug, title, revision: Number(revision), keptAt: new Date().toISOString(), urls: [page, ...others] };
    await saveKept(kept);
    say(`Kept on this device: r${revision}, ${others.length} photo and tool files with it. See “Kept for the bench”.`);
    button.textContent = 'Kept for the bench: keep again';
  } catch (error) {
    say(`Not kept: ${error instanceof Error ? error.message : 'the connection failed'}. Try again when the connection is back.`);
  }
  button.disabled = false;
}

/** Drops one kept fix; an address another kept fix also needs (a bench tool) stays. */
export async function dropFix(slug: string): Promise<void> {
  const all = await keptFixes();
  const dropped = all.find((fix) => fix.slug === slug);
  if (!dropped) return;
  const stillNeeded = new Set(all.filter((fix) => fix.slug !== slug).flatMap((fix) => fix.urls));
  const cache = await caches.open(cacheNames.kept);
  await Promise.all(dropped.urls.filter((url) => !stillNeeded.has(url)).map((url) => cache.delete(url)));
  await dropKept(slug);
}
