// A CSV download: text/csv with a file name, never cached, with a byte-order mark so spreadsheets read µ and ° right.
import { cachePolicies } from '@/server/http/responses';

export function csvResponse(csv: string, filename: string): Response {
  const safeName = filename.replace(/[^A-Za-z0-9._-]/g, '-');
  return new Response(`\uFEFF${csv}`, {
    status: 200,
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="${safeName}"`,
      'Cache-Control': cachePolicies.private,
    },
  });
}
