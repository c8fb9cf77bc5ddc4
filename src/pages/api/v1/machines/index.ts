// GET /api/v1/machines: the catalogue with filters (maker, deviceType, format, region, chassis) and pages.
import type { APIRoute } from 'astro';
import { parseSearchParams, respond } from '@/server/http/result';
import { listMachines, machineFilterSchema } from '@/server/catalogue/catalogue';
import { json } from '@/server/http/responses';

export const GET: APIRoute = async ({ url }) => {
  const query = parseSearchParams(machineFilterSchema, url);
  if (!query.ok) return respond(query);
  return json(await listMachines(query.value));
};
