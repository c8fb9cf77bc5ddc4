// Request pipeline: background work started once, security headers, no 500 page leaking a stack trace, who is asking, the route guard.
import { defineMiddleware, sequence } from 'astro:middleware';
import { applySecurityHeaders } from '@/server/http/security-headers';
import { apiError } from '@/server/http/responses';
import { logger } from '@/server/core/logger';
import { resolveUser, sessionWasCleared } from '@/server/auth/request-user';
import { authenticateBearer, bearerOf } from '@/server/auth/api-tokens';
import { respond } from '@/server/http/result';
import { guardRequest } from '@/server/http/route-guard';
import { routeAccess } from '@/server/auth/route-access';
import { startBackgroundWork } from '@/server/core/background';

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

const securityHeaders = defineMiddleware(async (_context, next) => {
  const response = editable(await next());
  applySecurityHeaders(response.headers);
  return response;
});

const errorBoundary = defineMiddleware(async (context, next) => {
  try {
    return await next();
  } catch (error) {
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

const guard = defineMiddleware((context, next) => guardRequest(context, context.locals.user) ?? next());

/** Photo work and search sync start with the server's first request of any kind, not with the first that needs them. */
const background = defineMiddleware((context, next) => {
  // A page prerendered at build time is no server start.
  if (!context.isPrerendered) startBackgroundWork();
  return next();
});

export const onRequest = sequence(securityHeaders, errorBoundary, background, identify, privateWhenSignedIn, guard);
