// Astro's own origin check (cross-site form posts answered 403), run inside our middleware.
// With `security.checkOrigin` on, Astro runs it before any middleware of ours, so its 403 went out without the
// security headers. astro.config.mjs turns that switch off and src/middleware.ts runs the very same function right
// after the security headers: one check, Astro's code, and every answer with its headers. Astro does not export the
// function by name; if a new Astro moves it, the build fails here instead of the check silently going away.
import { createOriginCheckMiddleware } from '../../../node_modules/astro/dist/core/app/middlewares.js';
import { defineMiddleware } from 'astro:middleware';
import { routeAccess } from '../auth/route-access';

const astroOriginCheck = createOriginCheckMiddleware();

/**
 * Every route but those whose own signed token is the authority (`crossSitePosts` in the route table: one-click
 * unsubscribe, which mail programs post from their own servers, RFC 8058).
 */
export const originCheck = defineMiddleware((context, next) =>
  routeAccess[context.routePattern]?.crossSitePosts ? next() : astroOriginCheck(context, next),
);
