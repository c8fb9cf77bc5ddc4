// Astro's own origin check (cross-site form posts answered 403), run inside our middleware.
// With `security.checkOrigin` on, Astro runs it before any middleware of ours, so its 403 went out without the
// security headers. astro.config.mjs turns that switch off and src/middleware.ts runs the very same function right
// after the security headers: one check, Astro's code, and every answer with its headers. Astro does not export the
// function by name; if a new Astro moves it, the build fails here instead of the check silently going away.
import { createOriginCheckMiddleware } from '../../../node_modules/astro/dist/core/app/middlewares.js';

export const originCheck = createOriginCheckMiddleware();
