// GET /api/v1/job-sheets/:id/invoice-lines.json: labour, parts and note links of a job, for invoicing programs.
import type { APIRoute } from 'astro';
import { respond } from '@/server/http/result';
import { json } from '@/server/http/responses';
import { invoiceLinesFor, jobSheetMissing, jobSheetRequest } from '@/server/bench-work/job-sheets';

export const GET: APIRoute = async ({ locals, params }) => {
  const job = jobSheetRequest(locals.user, params.id);
  if (!job.ok) return respond(job);
  const invoice = await invoiceLinesFor(job.value.ownerId, job.value.id);
  return invoice ? json(invoice, { cache: 'private' }) : respond(jobSheetMissing);
};
