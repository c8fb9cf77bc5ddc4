// GET /api/v1/job-sheets/:id/invoice-lines.csv: the same lines as CSV to import or paste into an invoice.
import type { APIRoute } from 'astro';
import { respond } from '@/server/http/result';
import { stringify } from 'csv-stringify/sync';
import { invoiceLinesFor, jobSheetMissing, jobSheetRequest } from '@/server/bench-work/job-sheets';
import { safeCell } from '@/lib/bench/order-list-csv';

const invoiceCsvHeader = ['kind', 'description', 'quantity', 'unit', 'link'];

export const GET: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const invoice = await invoiceLinesFor(job.value.ownerId, job.value.id);
  if (!invoice) return respond(jobSheetMissing);
  // Text typed by a member may start with = + - @: safeCell keeps spreadsheets from running it as a formula.
  const rows = invoice.lines.map((l) => [l.kind, l.description, String(l.quantity), l.unit, l.link].map(safeCell));
  return new Response(stringify([invoiceCsvHeader, ...rows]), {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="job-${invoice.jobSheetId}-invoice-lines.csv"`,
      'Cache-Control': 'private, no-store',
    },
  });
};
