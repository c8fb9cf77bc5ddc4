// One sitemap file: /sitemaps/1.xml holds the first 50,000 addresses, /sitemaps/2.xml the next, and so on.
import type { APIRoute } from 'astro';
import { sitemapXml } from '@/lib/sitemap';
import { config } from '@/server/core/config';
import { fixedPaths, sitemapFile } from '@/server/fixes/site-map';
import { apiError, cachePolicies } from '@/server/http/responses';

export const GET: APIRoute = async ({ params }) => {
  const file = /^[1-9]\d{0,5}$/.test(params.file ?? '') ? Number(params.file) : NaN;
  const entries = Number.isSafeInteger(file) ? await sitemapFile(file, fixedPaths) : null;
  if (!entries) return apiError('not_found', 'There is no such sitemap file; the list of files is at /sitemap.xml, e.g. /sitemaps/1.xml.');
  const xml = sitemapXml(config().PUBLIC_ORIGIN, entries);
  return new Response(xml, { headers: { 'Content-Type': 'application/xml; charset=utf-8', 'Cache-Control': cachePolicies.public } });
};
