// Request pipeline: security headers, the origin check, no 500 page leaking a stack trace (a 503 while the database is
// away), who is asking, the route guard, and public pages answered from their validators or kept renders for anonymous readers.
import { defineMiddleware, sequence } from 'astro:middleware';
import { applySecurityHeaders } from '@/server/http/security-headers';
import { compressOnTheWay } from '@/server/http/compression';
import { originCheck } from '@/server/http/origin-check';
import { apiError } from '@/server/http/responses';
import { unavailableAnswer } from '@/server/http/unavailable';
import { databaseUnavailable } from '@/server/core/db-errors';
import { logger } from '@/server/core/logger';
import { resolveUser, sessionWasCleared } from '@/server/auth/request-user';
import { authenticateBearer, bearerOf } from '@/server/auth/api-tokens';
import { respond } from '@/server/http/result';
import { guardRequest } from '@/server/http/route-guard';
import { routeAccess } from '@/server/auth/route-access';
import { answerPublicPage, publicPageCache, searchPageCache } from '@/server/http/page-cache';
import { pageKeys } from '@/server/render/page-keys';
import { unreadCount } from '@/server/notifications/events';

/** Some responses (Response.redirect) have read-only headers: copy them before changing anything. */
function editable(response: Response): Response {
  try {
    response.headers.set('X-Content-Type-Options', 'nosniff');
    return response;
  } catch {
    return new Response(response.body, {
      status: response.status,
      statusText: response.statusText,
      headers: new Headers(response.headers),
    });
  }
}

/** Security headers on every answer; text bodies compressed for readers who accept it (a kept page is already). */
const securityHeaders = defineMiddleware(async (context, next) => {
  const response = editable(await next());
  applySecurityHeaders(response.headers, response.status);
  return compressOnTheWay(context.request, response);
});

const errorBoundary = defineMiddleware(async (context, next) => {
  try {
    return await next();
  } catch (error) {
    if (databaseUnavailable(error)) {
      logger().warn({ reason: error instanceof Error ? error.message : String(error), path: context.url.pathname }, 'database unavailable');
      return unavailableAnswer(context.url.pathname);
    }
    logger().error({ err: error, path: context.url.pathname }, 'unhandled error');
    if (context.url.pathname.startsWith('/api/'))
      return apiError('internal', 'Something went wrong on our side. Nothing you sent was lost; please try again.');
    const body =
      '<!doctype html><title>Something went wrong · Benchlore</title><p>Something went wrong on our side. Please try again in a moment.</p>';
    return new Response(body, { status: 500, headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store' } });
  }
});

/** Loads the signed-in user on every request (role and suspension are never taken from the token). */
const identify = defineMiddleware(async (context, next) => {
  // A program's personal API token (Authorization: Bearer) stands in for the cookie; it is refused here when not valid.
  const bearer = bearerOf(context.request);
  if (bearer !== null && context.url.pathname.startsWith('/api/v1/')) {
    const outcome = await authenticateBearer(bearer, { pattern: context.routePattern, method: context.request.method });
    if (!outcome.ok) return respond(outcome);
    context.locals.user = outcome.value.user;
    context.locals.apiToken = outcome.value.token;
    return next();
  }
  // Auth.js's own endpoints read the cookie themselves.
  context.locals.user = context.url.pathname.startsWith('/api/auth/') ? null : await resolveUser(context.request, context.cookies);
  return next();
});

/** An answer that depends on who asked (or clears a cookie) is never kept by a shared cache. */
const privateWhenSignedIn = defineMiddleware(async (context, next) => {
  const response = editable(await next());
  const rule = routeAccess[context.routePattern];
  const personal = context.locals.user !== null || sessionWasCleared(context.request);
  if ((personal && !rule?.sharedCache) || rule?.noStore) {
    response.headers.set('Cache-Control', 'private, no-store');
  }
  // Signed-in and signed-out readers see different headers on the same address.
  if (!rule?.sharedCache) response.headers.append('Vary', 'Cookie');
  return response;
});

/** The header's unread count, for signed-in page views only (API calls and posts skip the query). */
const news = defineMiddleware(async (context, next) => {
  const user = context.locals.user;
  if (user && context.request.method === 'GET' && !context.url.pathname.startsWith('/api/'))
    context.locals.unreadNews = await unreadCount(user.id);
  return next();
});

const guard = defineMiddleware((context, next) => guardRequest(context, context.locals.user) ?? next());

/**
 * Anonymous GETs of public pages: If-None-Match answered with 304 before rendering, or the render kept for the page's
 * current key. Anyone signed in (or whose session was just cleared) is rendered for, never served a kept body.
 */
const publicPages = defineMiddleware(async (context, next) => {
  const page = pageKeys[context.routePattern];
  if (!page || context.request.method !== 'GET' || context.locals.user !== null || sessionWasCleared(context.request)) return next();
  // Readers of a page arriving together share its key read (src/server/render/page-keys.ts).
  const key = await page.key(context.params);
  if (key === null) return next();
  return answerPublicPage({
    request: context.request,
    address: context.url.pathname + context.url.search,
    key,
    policy: page.policy,
    cache: page.shelf === 'searches' ? searchPageCache : publicPageCache,
    render: () => next(),
    // A page that set a cookie on the way answered one reader, not everyone.
    mayKeep: () => context.cookies.headers().next().done === true,
  });
});

// Astro's origin check runs inside the security headers, so its 403 carries them (security.checkOrigin is off).
export const onRequest = sequence(securityHeaders, originCheck, errorBoundary, identify, privateWhenSignedIn, guard, news, publicPages);
