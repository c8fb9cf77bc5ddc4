// Signing out: a POST (Astro's origin check stops other sites doing it for you) that clears the session cookie.
import type { APIRoute } from 'astro';
import { clearSessionCookies } from '@/server/auth/session-cookie';

export const POST: APIRoute = ({ request, cookies, redirect }) => {
  clearSessionCookies(cookies, request.headers.get('cookie'));
  return redirect('/', 303);
};
