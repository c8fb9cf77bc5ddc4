// The origin check (Astro's rule, kept in our guard): which requests count as cross-site form posts.
import { describe, expect, it } from 'vitest';
import { crossSiteFormPost } from '@/server/http/route-guard';

const url = new URL('http://127.0.0.1:4321/sign-up');
const post = (headers: Record<string, string>, method = 'POST') =>
  new Request(url, { method, headers, body: method === 'GET' ? undefined : 'x=1' });

describe('crossSiteFormPost', () => {
  it('lets reads and same-origin posts through', () => {
    expect(crossSiteFormPost(new Request(url), url)).toBe(false);
    expect(crossSiteFormPost(post({ origin: url.origin, 'content-type': 'application/x-www-form-urlencoded' }), url)).toBe(false);
  });
  it('flags form posts from elsewhere or with no origin, and posts with no content type', () => {
    expect(crossSiteFormPost(post({ origin: 'http://elsewhere.example', 'content-type': 'application/x-www-form-urlencoded' }), url)).toBe(
      true,
    );
    expect(crossSiteFormPost(post({ 'content-type': 'multipart/form-data; boundary=x' }), url)).toBe(true);
    expect(crossSiteFormPost(post({ origin: 'http://elsewhere.example', 'content-type': 'text/plain;charset=UTF-8' }), url)).toBe(true);
    expect(crossSiteFormPost(new Request(url, { method: 'POST', headers: { origin: 'http://elsewhere.example' } }), url)).toBe(true);
  });
  it('leaves JSON posts to the endpoints (a browser cannot send them cross-site without CORS)', () => {
    expect(crossSiteFormPost(post({ origin: 'http://elsewhere.example', 'content-type': 'application/json' }), url)).toBe(false);
  });
});
