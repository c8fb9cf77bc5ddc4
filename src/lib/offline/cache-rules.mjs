// What the service worker keeps, and where. astro.config.mjs hands these to the service worker build, which copies
// each function's source text into sw.js: so every function here stands alone and uses nothing from outside it.

/** Cache names: pages and photos a reader opened (bounded), the site's own files, and what was kept for the bench. */
export const cacheNames = {
  pages: 'bl-pages',
  photos: 'bl-photos',
  assets: 'bl-assets',
  kept: 'bl-kept',
};

/** The bounds of the caches that fill as a reader browses (oldest entries go first). */
export const cacheBounds = {
  pages: { maxEntries: 80, maxAgeSeconds: 60 * 60 * 24 * 30 },
  photos: { maxEntries: 150, maxAgeSeconds: 60 * 60 * 24 * 60 },
  assets: { maxEntries: 120, maxAgeSeconds: 60 * 60 * 24 * 365 },
};

/**
 * Signed-in and private pages: the job sheets, account, notes, order list, writing, proofing, admin, sign-in and the
 * like. Never stored; offline they answer with the offline page.
 */
export function isPrivateNavigation({ request, url }) {
  return (
    request.mode === 'navigate' &&
    (/^\/(jobs|account|notes|order-list|write|proofing|admin|sign-in|sign-up|reset|verify|api|dev)(\/|$)/.test(url.pathname) ||
      /^\/fixes\/[^/]+\/(edit|compare)(\/|$)/.test(url.pathname))
  );
}

/** Every other page is public: network first, and the saved copy when the network is gone or slow. */
export function isNavigation({ request }) {
  return request.mode === 'navigate';
}

/** Photos: stable, content-addressed addresses under /media/. */
export function isPhoto({ url, sameOrigin }) {
  return sameOrigin && url.pathname.startsWith('/media/');
}

/** The site's own built files (hashed names, never change) and the app icons. */
export function isSiteFile({ url, sameOrigin }) {
  return sameOrigin && (url.pathname.startsWith('/_astro/') || url.pathname.startsWith('/icons/'));
}

export function isSignOut({ url }) {
  return url.pathname === '/account/sign-out';
}

/**
 * Signing out empties the cache of pages read while signed in (their header names the member) before the sign-out
 * goes on to the server; what was kept for the bench was fetched signed out and stays.
 */
export async function signOutHandler({ request }) {
  await caches.delete('bl-pages');
  return fetch(request);
}

/** A page or photo neither the network nor its own cache has: the copy kept for the bench, else the offline page. */
export const keptOrOffline = {
  handlerDidError: async ({ request }) =>
    (await caches.match(request.url, { cacheName: 'bl-kept' })) ??
    (request.mode === 'navigate' ? await caches.match('/offline', { ignoreSearch: true }) : undefined) ??
    Response.error(),
};

/** The Server-Timing metric a page answered from its saved copy carries (register.ts reads it to say so). */
export const savedCopyMetric = 'bl-saved-copy';

/**
 * A page the network did not answer in time (or at all) is answered from the saved copy: the answer says so in a
 * Server-Timing header, which the page reads from its navigation timing. (Its own source is copied into sw.js, so the
 * metric's name is spelled out here again.)
 */
export const markSavedCopy = {
  cachedResponseWillBeUsed: async ({ cachedResponse }) => {
    if (!cachedResponse) return cachedResponse;
    const headers = new Headers(cachedResponse.headers);
    headers.append('Server-Timing', 'bl-saved-copy');
    return new Response(cachedResponse.body, { status: cachedResponse.status, statusText: cachedResponse.statusText, headers });
  },
};

/** Only whole, successful answers are stored (no redirects to sign-in, no error pages). */
export const onlyOk = { statuses: [200] };
