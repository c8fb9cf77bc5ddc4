// The sitemap index (sitemaps.org 0.9): one file per 50,000 addresses, from the database. Named in robots.txt.
import type { APIRoute } from 'astro';
import { sitemapIndexXml } from '@/lib/sitemap';
import { config } from '@/server/core/config';
import { fixedPaths, sitemapFiles } from '@/server/fixes/site-map';
import { cachePolicies } from '@/server/http/responses';

export const GET: APIRoute = async () => {
  const xml = sitemapIndexXml(config().PUBLIC_ORIGIN, await sitemapFiles(fixedPaths));
  return new Response(xml, { headers: { 'Content-Type': 'application/xml; charset=utf-8', 'Cache-Control': cachePolicies.public } });
};
