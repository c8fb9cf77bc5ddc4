// What /api/v1 answers, as zod schemas: the OpenAPI document describes each response with these, and the
// integration tests validate real answers against the document. Dates travel as ISO 8601 strings.
import { z } from 'zod';
import { jobPartSchema, jobStatusSchema } from '@/lib/schemas/job-sheet';
import { tokenScopeSchema } from '@/lib/schemas/api-tokens';

const isoDate = z.string().meta({ format: 'date-time', example: '2026-11-03T09:41:00.000Z' });

/** The one error shape of every endpoint; a 409 or 412 carries the current version beside `error`. */
export const errorResponseSchema = z
  .object({
    error: z.object({
      code: z.enum([
        'bad_request',
        'unauthorised',
        'forbidden',
        'not_found',
        'method_not_allowed',
        'conflict',
        'gone',
        'precondition_failed',
        'precondition_required',
        'too_many_requests',
        'payload_too_large',
        'unsupported_media_type',
        'internal',
      ]),
      message: z.string().meta({ example: 'Some fields of the job sheet are not valid.' }),
      fields: z.record(z.string(), z.array(z.string())).optional(),
    }),
  })
  .catchall(z.unknown())
  .meta({ id: 'Error' });

const pageFields = {
  page: z.number().int().min(1),
  perPage: z.number().int().min(1),
  total: z.number().int().min(0),
  pageCount: z.number().int().min(1),
};

export const jobSheetSummarySchema = z
  .object({
    id: z.number().int(),
    customerRef: z.string(),
    machine: z.string().nullable(),
    status: jobStatusSchema,
    bookedInAt: isoDate,
    updatedAt: isoDate,
    fixCount: z.number().int().min(0),
  })
  .meta({ id: 'JobSheetSummary' });

export const jobSheetSchema = z
  .object({
    id: z.number().int(),
    customerRef: z.string(),
    machine: z
      .object({
        id: z.number().int(),
        slug: z.string(),
        label: z.string(),
        makerName: z.string(),
        chassisFamilyId: z.number().int().nullable(),
      })
      .nullable(),
    serialNumber: z.string(),
    reportedSymptom: z.string(),
    findings: z.string(),
    partsUsed: z.array(jobPartSchema),
    labourMinutes: z.number().int().min(0),
    status: jobStatusSchema,
    outcome: z.string(),
    bookedInAt: isoDate,
    createdAt: isoDate,
    updatedAt: isoDate,
    version: z.number().int().min(1).meta({ description: 'Counts every change; sent as the ETag "v<version>".' }),
    fixes: z.array(
      z.object({
        slug: z.string(),
        title: z.string(),
        revisionNumber: z.number().int(),
        permalink: z.string(),
        liveRevisionNumber: z.number().int().nullable(),
      }),
    ),
  })
  .meta({ id: 'JobSheet' });

export const jobSheetAnswerSchema = z.object({ jobSheet: jobSheetSchema });
export const jobSheetPageSchema = z.object({ jobSheets: z.array(jobSheetSummarySchema), ...pageFields });
export const jobSheetStaleSchema = errorResponseSchema.extend({ current: jobSheetSchema });

export const invoiceLinesSchema = z
  .object({
    jobSheetId: z.number().int(),
    customerRef: z.string(),
    lines: z.array(
      z.object({
        kind: z.enum(['labour', 'part', 'repair_notes', 'fix']),
        description: z.string(),
        quantity: z.number(),
        unit: z.string(),
        link: z.string(),
      }),
    ),
  })
  .meta({ id: 'InvoiceLines' });

export const ownNoteSchema = z
  .object({
    code: z.string(),
    url: z.string(),
    invoiceLine: z.string(),
    createdAt: isoDate,
    revokedAt: isoDate.nullable(),
    shopName: z.string(),
    fixSlug: z.string(),
    fixTitle: z.string(),
    revisionNumber: z.number().int(),
    jobSheetId: z.number().int().nullable(),
    includeJobDetails: z.boolean(),
    message: z.string(),
    partsReplaced: z.array(z.string()),
    warranty: z.string(),
    version: z.number().int().min(1),
  })
  .meta({ id: 'HandoverNote' });

export const ownNoteAnswerSchema = z.object({ note: ownNoteSchema });
export const ownNoteListSchema = z.object({ notes: z.array(ownNoteSchema) });
export const noteStaleSchema = errorResponseSchema.extend({ current: ownNoteSchema });
/** What a customer's link shows: the note with the fix it is pinned to (fields beyond these may be added). */
export const publicNoteAnswerSchema = z.object({ note: z.object({ code: z.string() }).catchall(z.unknown()) });
export const noteRevokedSchema = z.object({ revoked: z.literal(true), alreadyRevoked: z.boolean() });

export const orderListAnswerSchema = z.object({
  name: z.string(),
  lines: z.array(z.object({}).catchall(z.unknown())),
  updatedAt: isoDate.nullable(),
});

export const apiTokenSchema = z
  .object({
    id: z.number().int(),
    name: z.string(),
    scopes: z.array(tokenScopeSchema),
    hint: z.string(),
    createdAt: isoDate,
    lastUsedAt: isoDate.nullable(),
    revokedAt: isoDate.nullable(),
  })
  .meta({ id: 'ApiToken' });

/** A slug-named catalogue or fix entry: the fields every list item has (more are sent). */
const named = z.object({ slug: z.string() }).catchall(z.unknown());
export const machinePageSchema = z.object({ items: z.array(named), ...pageFields }).catchall(z.unknown());
export const fixPageSchema = z.object({ items: z.array(named), ...pageFields }).catchall(z.unknown());
/** An answer described by its top-level member only; the reference page lists what it holds. */
export function wrapped(key: string) {
  return z.object({ [key]: z.unknown() }).catchall(z.unknown());
}
