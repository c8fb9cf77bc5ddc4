// Import this first in every browser entry that builds zod schemas (islands, bundled page scripts).
// Zod compiles object parsers with `new Function` after probing whether eval is allowed; under the site's
// Content-Security-Policy (no 'unsafe-eval') that probe is reported as a violation on every page load.
// Zod reads its settings from this global when it loads and skips the probe when `jitless` is set, parsing
// the same way without compiled code. The server keeps the compiled parsers.
// Islands are also rendered on the server, which imports this file too: there nothing changes.
if (typeof document !== 'undefined') {
  const holder = globalThis as { __zod_globalConfig?: Record<string, unknown> };
  // The same object zod keeps, whether zod has loaded yet or not.
  (holder.__zod_globalConfig ??= {}).jitless = true;
}

export {};
