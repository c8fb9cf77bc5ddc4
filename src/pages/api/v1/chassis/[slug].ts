// GET /api/v1/chassis/:slug: a chassis family, its machines and the fixes written for it.
import type { APIRoute } from 'astro';
import { getChassis, machinesOfChassis } from '@/server/catalogue/catalogue';
import { listFixSummaries } from '@/server/fixes/fixes';
import { apiError, json } from '@/server/http/responses';
import { slugSchema } from '@/lib/schemas/slug';

export const GET: APIRoute = async ({ params }) => {
  const slug = slugSchema.safeParse(params.slug);
  if (!slug.success) return apiError('not_found', 'No chassis family has that address.');
  const chassis = await getChassis(slug.data);
  if (!chassis) return apiError('not_found', `No chassis family "${slug.data}".`);
  const [machines, fixes] = await Promise.all([machinesOfChassis(chassis.id), listFixSummaries({ chassisId: chassis.id })]);
  const { id: _id, makerId: _makerId, ...publicChassis } = chassis;
  return json({ chassis: publicChassis, machines, fixes });
};
