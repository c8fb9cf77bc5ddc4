// GET /api/v1/job-sheets/:id/invoice-lines.json: labour, parts and note links of a job, for invoicing programs.
import type { APIRoute } from 'astro';
import { json } from '@/server/http/responses';
import { invoiceLinesFor, jobSheetNotFound, jobSheetRequest } from '@/server/bench-work/job-sheets';

export const GET: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return job.response;
  const invoice = await invoiceLinesFor(job.ownerId, job.id);
  return invoice ? json(invoice, { cache: 'private' }) : jobSheetNotFound();
};
