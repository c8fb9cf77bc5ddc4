// GET /export/manifest.json: the counts, licence and SHA-256 of this week's export.
import type { APIRoute } from 'astro';
import { json } from '@/server/http/responses';
import { currentWeeklyExport } from '@/server/export/weekly';

export const GET: APIRoute = async () => {
  const exported = await currentWeeklyExport();
  return json({ week: exported.week, ...exported.manifest }, { cache: 'public' });
};
