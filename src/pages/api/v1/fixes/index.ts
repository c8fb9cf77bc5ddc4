// GET /api/v1/fixes: live fixes, newest proofed first, optionally for one machine or chassis family.
import type { APIRoute } from 'astro';
import { fixListQuerySchema as querySchema } from '@/server/openapi/inputs';
import { parseSearchParams, respond } from '@/server/http/result';
import { z } from 'zod';
import { getChassis, getMachine } from '@/server/catalogue/catalogue';
import { countFixSummaries, listFixSummaries } from '@/server/fixes/fixes';
import { apiError, json } from '@/server/http/responses';
import { toPage } from '@/server/core/pagination';

export const GET: APIRoute = async ({ url }) => {
  const query = parseSearchParams(querySchema, url);
  if (!query.ok) return respond(query);
  const { machine: machineSlug, chassis: chassisSlug, page, perPage } = query.value satisfies z.infer<typeof querySchema>;
  const machine = machineSlug ? await getMachine(machineSlug) : undefined;
  if (machine === null) return apiError('not_found', `No machine "${machineSlug}" in the catalogue.`);
  const chassis = chassisSlug ? await getChassis(chassisSlug) : undefined;
  if (chassis === null) return apiError('not_found', `No chassis family "${chassisSlug}".`);
  const filter = { machineId: machine?.id, chassisId: chassis?.id };
  const [items, total] = await Promise.all([
    listFixSummaries({ ...filter, limit: perPage, offset: (page - 1) * perPage }),
    countFixSummaries(filter),
  ]);
  return json(toPage(items, total, { page, perPage }));
};
