// robots.txt: crawlers may read the catalogue, fixes and help; accounts, writing, the desk, job records, customers'
// hand-over notes, the API and search result pages are not for indexing. Names the sitemap at this site's origin.
import type { APIRoute } from 'astro';
import { config } from '@/server/core/config';
import { cachePolicies } from '@/server/http/responses';

const closed = [
  '/api/',
  '/search',
  '/account',
  '/admin',
  '/proofing',
  '/write',
  '/jobs',
  '/notes',
  '/n/',
  '/order-list',
  '/sign-in',
  '/sign-up',
  '/reset',
  '/dev/',
];

export const GET: APIRoute = () => {
  const lines = [
    '# Benchlore: the public catalogue, fixes and help are for reading and indexing.',
    'User-agent: *',
    ...closed.map((path) => `Disallow: ${path}`),
    '',
    `Sitemap: ${new URL('/sitemap.xml', config().PUBLIC_ORIGIN).href}`,
    '',
  ];
  return new Response(lines.join('\n'), {
    headers: { 'Content-Type': 'text/plain; charset=utf-8', 'Cache-Control': cachePolicies.public },
  });
};
