// The answer while PostgreSQL cannot be reached: 503 with Retry-After, as the JSON error shape or a short page.
import { apiError } from './responses';

export const RETRY_AFTER_SECONDS = 5;

const message =
  'Benchlore cannot reach its database just now, so this request could not be completed. Please try again in a few seconds: going back keeps what you typed.';

export function unavailableAnswer(pathname: string): Response {
  const headers = { 'Retry-After': String(RETRY_AFTER_SECONDS) };
  if (pathname.startsWith('/api/')) return apiError('unavailable', message, undefined, { headers });
  const body = `<!doctype html><html lang="en"><meta charset="utf-8"><title>Back in a moment · Benchlore</title><h1>Back in a moment</h1><p>${message}</p></html>`;
  return new Response(body, {
    status: 503,
    headers: { 'Content-Type': 'text/html; charset=utf-8', 'Cache-Control': 'no-store', ...headers },
  });
}
