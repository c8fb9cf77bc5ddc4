// Request pipeline: security headers on every response, and no 500 page leaking a stack trace.
import { defineMiddleware, sequence } from 'astro:middleware';
import { applySecurityHeaders } from '@/server/security-headers';
import { logger } from '@/server/logger';

const securityHeaders = defineMiddleware(async (_context, next) => {
  const response = await next();
  applySecurityHeaders(response.headers);
  return response;
});

const errorBoundary = defineMiddleware(async (context, next) => {
  try {
    return await next();
  } catch (error) {
    logger().error({ err: error, path: context.url.pathname }, 'unhandled error');
    const isApi = context.url.pathname.startsWith('/api/');
    const body = isApi
      ? JSON.stringify({ error: { code: 'internal', message: 'Something went wrong on our side. Nothing you sent was lost; please try again.' } })
      : '<!doctype html><title>Something went wrong · Benchlore</title><p>Something went wrong on our side. Please try again in a moment.</p>';
    return new Response(body, { status: 500, headers: { 'Content-Type': isApi ? 'application/json' : 'text/html; charset=utf-8', 'Cache-Control': 'no-store' } });
  }
});

export const onRequest = sequence(securityHeaders, errorBoundary);
