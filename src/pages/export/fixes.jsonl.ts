// GET /export/fixes.jsonl: this week's export of every live fix, one JSON object a line (CC BY-SA 4.0).
import type { APIRoute } from 'astro';
import { currentWeeklyExport, weeklyFile } from '@/server/export/weekly';

export const GET: APIRoute = async ({ request }) => {
  const exported = await currentWeeklyExport();
  const entry = exported.manifest.files.find((f) => f.name === 'fixes.jsonl');
  const etag = `"${entry?.sha256 ?? exported.week}"`;
  const headers = {
    'Cache-Control': 'public, max-age=3600, s-maxage=86400',
    ETag: etag,
    'Content-Type': 'application/x-ndjson; charset=utf-8',
    'Content-Disposition': `attachment; filename="benchlore-fixes-${exported.week}.jsonl"`,
  };
  if (request.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers });
  const file = await weeklyFile(exported, 'fixes.jsonl');
  return new Response(file.body, { headers: { ...headers, 'Content-Length': String(file.bytes) } });
};
