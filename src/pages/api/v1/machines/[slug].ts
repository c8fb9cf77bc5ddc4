// GET /api/v1/machines/:slug: one machine with its chassis family and the fixes that apply to it.
import type { APIRoute } from 'astro';
import { getMachine, summariseMachine } from '@/server/catalogue/catalogue';
import { listFixSummaries } from '@/server/fixes/fixes';
import { apiError, json } from '@/server/http/responses';
import { slugSchema } from '@/lib/schemas/slug';

export const GET: APIRoute = async ({ params }) => {
  const slug = slugSchema.safeParse(params.slug);
  if (!slug.success) return apiError('not_found', 'No machine has that address.');
  const machine = await getMachine(slug.data);
  if (!machine) return apiError('not_found', `No machine "${slug.data}" in the catalogue.`);
  const [fixes, familyFixes] = await Promise.all([
    listFixSummaries({ machineId: machine.id }),
    machine.chassisId ? listFixSummaries({ chassisId: machine.chassisId, excludeMachineId: machine.id }) : Promise.resolve([]),
  ]);
  return json({ machine: { ...summariseMachine(machine), about: machine.about }, fixes, familyFixes });
};
