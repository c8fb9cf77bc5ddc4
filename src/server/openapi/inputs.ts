// Query and body schemas of /api/v1 endpoints that have no other home (moved here from the endpoint files): the endpoints parse with them and the
// OpenAPI document (src/server/openapi) describes them, so the two never drift apart.
import { z } from 'zod';
import { slugSchema } from '@/lib/schemas/slug';
import { MAX_QUERY_LENGTH } from '@/lib/search/tokens';

/** Page numbers and sizes for list queries (the same bounds as src/server/core/pagination.ts). */
const pageFields = {
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  perPage: z.coerce.number().int().min(1).max(100).default(24),
};

/** GET /api/v1/fixes */
export const fixListQuerySchema = z.object({ ...pageFields, machine: slugSchema.optional(), chassis: slugSchema.optional() });

/** GET /api/v1/fixes/:slug */
export const fixRevisionQuerySchema = z.object({ revision: z.coerce.number().int().min(1).max(100_000).optional() });

/** ?format= on the order-list endpoints. */
export const formatQuerySchema = z.object({
  format: z.enum(['json', 'csv'], { error: 'Give format=json or format=csv.' }).default('json'),
});

const oneTarget = 'Name a machine or a chassis family (one of them).';
/** GET /api/v1/search/similar */
export const similarQuerySchema = z
  .object({
    symptom: z.string({ error: 'Say what the fault looks like.' }).trim().min(1, 'Say what the fault looks like.').max(MAX_QUERY_LENGTH),
    machine: slugSchema.optional(),
    chassis: slugSchema.optional(),
  })
  .refine((q) => (q.machine === undefined) !== (q.chassis === undefined), { message: oneTarget, path: ['machine'] });

/** POST /api/v1/drafts */
export const draftCreateBodySchema = z.object({ fixSlug: slugSchema.nullish(), values: z.unknown() });
/** PUT /api/v1/drafts/:id */
export const draftSaveBodySchema = z.object({ values: z.unknown(), baseRevisionId: z.number().int().positive().nullable().optional() });
/** POST /api/v1/drafts/:id/submit */
export const draftSubmitBodySchema = z.object({ values: z.unknown().optional() });
