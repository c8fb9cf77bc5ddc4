// The middleware's guard: looks the route up in route-access.ts and answers 401/redirect, 403 or 405 before any page runs.
import { can, type SessionUser } from '@/lib/permissions';
import { apiError, type ErrorCode } from './responses';
import { logger } from '../core/logger';
import { decideRoute, type Access } from '../auth/route-access';
import { forbiddenPage, notServedPage, unlistedPage } from '../auth/guard-pages';

interface GuardContext {
  routePattern: string;
  request: Request;
  url: URL;
}

function isApi(pattern: string): boolean {
  return pattern.startsWith('/api/');
}

function errorJson(code: ErrorCode, message: string, headers: Record<string, string> = {}): Response {
  return apiError(code, message, undefined, { headers });
}

function html(status: number, body: string, headers: Record<string, string> = {}): Response {
  return new Response(body, {
    status,
    headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'private, no-store', ...headers },
  });
}

/** Pages send the reader to sign in and back; a form post comes back to its page, not to a POST. */
function signInRedirect(context: GuardContext): Response {
  const safeMethod = context.request.method === 'GET' || context.request.method === 'HEAD';
  const next = safeMethod ? `${context.url.pathname}${context.url.search}` : context.url.pathname;
  const location = `/sign-in?${new URLSearchParams({ next })}`;
  return new Response(null, { status: safeMethod ? 302 : 303, headers: { Location: location, 'Cache-Control': 'private, no-store' } });
}

function denied(context: GuardContext, user: SessionUser | null): Response {
  const api = isApi(context.routePattern);
  if (!user) return api ? errorJson('unauthorised', 'Sign in to do this.') : signInRedirect(context);
  if (api) {
    const message = user.verified
      ? 'Your account may not do this.'
      : 'Confirm your e-mail address first: your account page can send the mail again.';
    return errorJson('forbidden', message);
  }
  return html(403, forbiddenPage(user));
}

function allowed(access: Access, user: SessionUser | null): boolean {
  if (access === 'public') return true;
  if (access === 'closed') return false;
  return can(user, access);
}

const formTypes = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain'];
const safeMethods = ['GET', 'HEAD', 'OPTIONS'];

/**
 * Cross-site request forgery: a form post (or a post with no content type) must come from our own origin.
 * The same rule as Astro's `security.checkOrigin`, which is off so that this one can let the few routes
 * that carry their own proof (see `crossSitePosts`) take posts from mail programs.
 */
export function crossSiteFormPost(request: Request, url: URL): boolean {
  if (safeMethods.includes(request.method.toUpperCase())) return false;
  if (request.headers.get('origin') === url.origin) return false;
  const type = request.headers.get('content-type');
  if (type === null) return true;
  return formTypes.some((form) => type.toLowerCase().includes(form));
}

/** A response when the request may not go on; null when it may. */
export function guardRequest(context: GuardContext, user: SessionUser | null): Response | null {
  const decision = decideRoute(context.routePattern, context.request.method);
  const api = isApi(context.routePattern);
  if (crossSiteFormPost(context.request, context.url) && !(decision.kind === 'access' && decision.rule.crossSitePosts)) {
    const message = 'Forms are only taken from this site: open the page here and send the form again.';
    return api ? errorJson('forbidden', message) : html(403, `<!doctype html><title>Refused · Benchlore</title><p>${message}</p>`);
  }
  if (decision.kind === 'unlisted') {
    logger().error({ route: context.routePattern }, 'route missing from src/server/auth/route-access.ts: refused');
    const message = `The route ${context.routePattern} has no entry in src/server/auth/route-access.ts.`;
    return api ? errorJson('forbidden', message) : html(403, unlistedPage());
  }
  if (decision.kind === 'method_not_allowed' || decision.access === 'closed') {
    const allow = decision.kind === 'method_not_allowed' ? decision.allow : ['GET', 'HEAD'];
    const headers = { Allow: allow.join(', ') };
    return api ? errorJson('method_not_allowed', 'This address does not take that method.', headers) : html(405, notServedPage(), headers);
  }
  return allowed(decision.access, user) ? null : denied(context, user);
}
