// Security headers on every response, and the one list of Content-Security-Policy directives.
//
// Pages: Astro builds the policy (astro.config.mjs, `experimental.csp`) from `cspDirectives` plus
// `script-src` and `style-src` with the hash of every inline script and style the page carries (the island
// loader, the island style), so no page needs 'unsafe-inline'. Every other answer (endpoints, redirects,
// Astro's own 403s and 404s, files) carries `contentSecurityPolicy`, the same list with no inline code at all.
// Astro's policy is not active in `astro dev`, whose pages need inline scripts: there pages get `devPolicy`.
// Test the policy on a built server.

/** Every directive but script-src and style-src, which Astro writes with each page's hashes. */
export const cspDirectives: string[] = [
  "default-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  // The service worker and the web app manifest come from this site only.
  "worker-src 'self'",
  "manifest-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
];

/** Scripts and styles from this site's files only: hashes are added per page by Astro. */
export const scriptSources: string[] = ["'self'"];
export const styleSources: string[] = ["'self'"];

/** The policy of an answer Astro did not render as a page: no inline script or style at all. */
export const contentSecurityPolicy: string = [
  ...cspDirectives,
  `script-src ${scriptSources.join(' ')}`,
  `style-src ${styleSources.join(' ')}`,
].join('; ');

/** `astro dev` only: its toolbar and island loader are inline scripts without hashes. */
const devPolicy: string = [...cspDirectives, "script-src 'self' 'unsafe-inline'", "style-src 'self' 'unsafe-inline'"].join('; ');
// Read with care: astro.config.mjs imports this file before Vite defines import.meta.env.
const inDev: boolean = import.meta.env?.DEV === true;

/** The `experimental.csp` setting for astro.config.mjs, built from the lists above. */
export const astroCsp = {
  algorithm: 'SHA-256' as const,
  directives: cspDirectives,
  scriptDirective: { resources: scriptSources },
  styleDirective: { resources: styleSources },
};

/**
 * Sets the security headers. A page's own policy (with its hashes, set by Astro) is kept; anything else gets
 * the strict one.
 */
export function applySecurityHeaders(headers: Headers, status = 200): void {
  // A 304 updates the headers the browser stored with the page (RFC 9111 §4.3.4): the page's own policy, with the
  // hashes of its inline styles, must stay, so a 304 carries no policy of its own.
  if (status !== 304 && !headers.has('Content-Security-Policy'))
    headers.set('Content-Security-Policy', inDev ? devPolicy : contentSecurityPolicy);
  headers.set('X-Content-Type-Options', 'nosniff');
  headers.set('Referrer-Policy', 'strict-origin-when-cross-origin');
  headers.set('X-Frame-Options', 'DENY');
  headers.set('Permissions-Policy', 'camera=(), microphone=(), geolocation=()');
  headers.set('Cross-Origin-Opener-Policy', 'same-origin');
}
