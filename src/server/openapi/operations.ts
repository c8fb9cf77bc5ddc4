// Every operation under /api/v1, described once: the OpenAPI document (document.ts) is built from this list with the
// same zod schemas the endpoints parse with. A route file without its operations here fails tests/unit/openapi.test.ts.
import { z } from 'zod';
import * as out from './responses';
import { applyFixSchema } from '@/lib/schemas/job-fix';
import { benchReportInputSchema } from '@/lib/schemas/bench-report';
import { handoverNoteInputSchema, handoverNotePatchSchema } from '@/lib/schemas/handover-note';
import { jobSheetCreateSchema, jobSheetPatchSchema } from '@/lib/schemas/job-sheet';
import { jobSheetPagedQuerySchema } from '@/lib/schemas/job-sheet-list';
import {
  draftCreateBodySchema,
  draftSaveBodySchema,
  draftSubmitBodySchema,
  fixListQuerySchema,
  fixRevisionQuerySchema,
  formatQuerySchema,
  similarQuerySchema,
} from './inputs';
import { profileSchema } from '@/lib/schemas/profile';
import { slugSchema } from '@/lib/schemas/slug';
import { searchParamsSchema } from '@/lib/search/query-schema';
import { decodeQuerySchema } from '@/lib/tools/value-decoder';
import { storedListSchema } from '@/lib/tools/order-list';
import { orderListInputSchema } from '@/lib/bench/order-list';
import { substituteInputSchema } from '@/lib/bench/substitute-types';
import { machineFilterSchema } from '../catalogue/catalogue';
import { lookupQuerySchema } from '@/lib/schemas/catalogue-lookup';
import { reportInputSchema } from '@/lib/schemas/fix-report-input';
import { resolutionSchema } from '@/lib/schemas/report-resolution';
import { fixFlagSchema } from '@/lib/schemas/fix-flag';
import { photoTextSchema } from '@/lib/schemas/photo-text';
import type { RouteMethod } from '../auth/route-access';

export type Tag =
  | 'Catalogue'
  | 'Fixes'
  | 'Search'
  | 'Bench tools'
  | 'Job sheets'
  | 'Hand-over notes'
  | 'Order list'
  | 'Account'
  | 'Writing'
  | 'Photos'
  | 'Proofing'
  | 'Bench reports'
  | 'About the API';

export interface Operation {
  /** The Astro route pattern, as in route-access.ts: /api/v1/job-sheets/[id]. */
  pattern: string;
  method: RouteMethod;
  tag: Tag;
  summary: string;
  description?: string;
  query?: z.ZodObject | z.ZodType;
  body?: { schema: z.ZodType; type?: 'application/json' | 'multipart/form-data' | 'application/x-www-form-urlencoded' };
  ok: {
    status: number;
    description: string;
    schema?: z.ZodType;
    /** application/json unless told. */
    type?: string;
    /** The answer carries an ETag (the record's version). */
    etag?: true;
  };
  /** Error statuses besides 401/403/429 that every guarded route may answer. */
  errors?: number[];
  /** PATCH with If-Match: 412 carries this current version beside the error. */
  stale?: z.ZodType;
  /** Answers to a plain form post (303) as well as JSON. */
  formToo?: true;
}

const photoUpload = z.object({
  file: z.string().meta({ format: 'binary', description: 'A JPEG, PNG or WebP photo.' }),
  alt: z.string().meta({ description: 'What the photo shows, for readers who cannot see it.' }),
  caption: z.string().optional(),
});
const noteReturn = z.object({ note: z.string().meta({ description: 'Why the revision goes back to its author (required).' }) });
const removeFixQuery = z.object({ fix: slugSchema });
const ownReportsQuery = z.object({ fix: slugSchema.optional() });
const text = (type: string) => ({ type });

export const operations: Operation[] = [
  // About the API
  {
    pattern: '/api/v1/openapi.json',
    method: 'GET',
    tag: 'About the API',
    summary: 'This document',
    ok: { status: 200, description: 'The OpenAPI 3.1 document.', schema: z.object({ openapi: z.string() }).catchall(z.unknown()) },
  },

  // Catalogue
  {
    pattern: '/api/v1/machines',
    method: 'GET',
    tag: 'Catalogue',
    summary: 'List machines',
    description: 'The catalogue with filters, a page at a time.',
    query: machineFilterSchema,
    ok: { status: 200, description: 'A page of machines.', schema: out.machinePageSchema },
    errors: [400],
  },
  {
    pattern: '/api/v1/machines/[slug]',
    method: 'GET',
    tag: 'Catalogue',
    summary: 'One machine',
    description: 'The machine with its chassis family and the fixes that apply to it.',
    ok: {
      status: 200,
      description: 'The machine.',
      schema: z.object({
        machine: z.object({ slug: z.string() }).catchall(z.unknown()),
        fixes: z.array(z.unknown()),
        familyFixes: z.array(z.unknown()),
      }),
    },
    errors: [404],
  },
  {
    pattern: '/api/v1/chassis/[slug]',
    method: 'GET',
    tag: 'Catalogue',
    summary: 'One chassis family',
    ok: {
      status: 200,
      description: 'The family, its machines and its fixes.',
      schema: z.object({
        chassis: z.object({ slug: z.string() }).catchall(z.unknown()),
        machines: z.array(z.unknown()),
        fixes: z.array(z.unknown()),
      }),
    },
    errors: [404],
  },
  {
    pattern: '/api/v1/catalogue-lookup',
    method: 'GET',
    tag: 'Catalogue',
    summary: 'Type-ahead over machines and chassis families',
    query: lookupQuerySchema,
    ok: { status: 200, description: 'Matching entries.', schema: z.object({ hits: z.array(z.unknown()) }) },
    errors: [400],
  },

  // Fixes
  {
    pattern: '/api/v1/fixes',
    method: 'GET',
    tag: 'Fixes',
    summary: 'List live fixes',
    description: 'Newest proofed first, optionally for one machine or chassis family.',
    query: fixListQuerySchema,
    ok: { status: 200, description: 'A page of fixes.', schema: out.fixPageSchema },
    errors: [400, 404],
  },
  {
    pattern: '/api/v1/fixes/[slug]',
    method: 'GET',
    tag: 'Fixes',
    summary: 'One fix',
    description: 'The live proofed revision, or an older proofed one with ?revision=n (cached for good).',
    query: fixRevisionQuerySchema,
    ok: { status: 200, description: 'The fix.', schema: z.object({ slug: z.string() }).catchall(z.unknown()) },
    errors: [400, 404],
  },
  {
    pattern: '/api/v1/fixes/[slug]/bench-reports',
    method: 'GET',
    tag: 'Bench reports',
    summary: 'Bench-score counts of a fix',
    ok: { status: 200, description: 'The counts per revision.', schema: z.object({}).catchall(z.unknown()) },
    errors: [404],
  },
  {
    pattern: '/api/v1/fixes/[slug]/reports',
    method: 'POST',
    tag: 'Fixes',
    summary: 'Report a fix',
    description: 'Wrong, dangerous, spam or a duplicate, with a reason.',
    body: { schema: reportInputSchema },
    ok: { status: 201, description: 'The report was filed.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400, 404, 409],
  },

  // Search
  {
    pattern: '/api/v1/search',
    method: 'GET',
    tag: 'Search',
    summary: 'Search fixes',
    query: searchParamsSchema,
    ok: { status: 200, description: 'Hits, facets and paging.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400],
  },
  {
    pattern: '/api/v1/search/similar',
    method: 'GET',
    tag: 'Search',
    summary: 'Fixes like a symptom being written up',
    query: similarQuerySchema,
    ok: {
      status: 200,
      description: 'Similar live fixes.',
      schema: z.object({ machine: z.unknown(), chassis: z.unknown(), items: z.array(z.unknown()) }),
    },
    errors: [400, 404],
  },

  // Bench tools
  {
    pattern: '/api/v1/tools/decode',
    method: 'GET',
    tag: 'Bench tools',
    summary: 'Read a part value into its canonical spec',
    query: decodeQuerySchema,
    ok: {
      status: 200,
      description: 'The decoded value.',
      schema: z.object({ value: z.string(), canonical: z.string(), key: z.string() }).catchall(z.unknown()),
    },
    errors: [400],
  },
  {
    pattern: '/api/v1/tools/decode',
    method: 'POST',
    tag: 'Bench tools',
    summary: 'Read a part value (JSON body)',
    body: { schema: decodeQuerySchema },
    ok: {
      status: 200,
      description: 'The decoded value.',
      schema: z.object({ value: z.string(), canonical: z.string(), key: z.string() }).catchall(z.unknown()),
    },
    errors: [400],
  },
  {
    pattern: '/api/v1/tools/substitute',
    method: 'POST',
    tag: 'Bench tools',
    summary: 'Can a candidate electrolytic replace the original?',
    body: { schema: substituteInputSchema },
    ok: { status: 200, description: 'Each check with its reason.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400],
  },
  {
    pattern: '/api/v1/tools/order-list',
    method: 'POST',
    tag: 'Bench tools',
    summary: 'Group parts rows into an order list',
    query: formatQuerySchema,
    body: { schema: orderListInputSchema },
    ok: {
      status: 200,
      description: 'Lines grouped by canonical spec (CSV with ?format=csv).',
      schema: z.object({ lines: z.array(z.unknown()) }),
    },
    errors: [400],
  },

  // Order list
  {
    pattern: '/api/v1/order-list',
    method: 'GET',
    tag: 'Order list',
    summary: 'Your saved order list',
    query: formatQuerySchema,
    ok: { status: 200, description: 'The list (CSV with ?format=csv).', schema: out.orderListAnswerSchema },
    errors: [400],
  },
  {
    pattern: '/api/v1/order-list',
    method: 'PUT',
    tag: 'Order list',
    summary: 'Replace your saved order list',
    body: { schema: storedListSchema },
    ok: { status: 200, description: 'The saved list.', schema: out.orderListAnswerSchema },
    errors: [400],
  },

  // Job sheets
  {
    pattern: '/api/v1/job-sheets',
    method: 'GET',
    tag: 'Job sheets',
    summary: 'List your job sheets',
    description: 'Filter by status or words; a page at a time (perPage up to 100).',
    query: jobSheetPagedQuerySchema,
    ok: { status: 200, description: 'A page of your job sheets.', schema: out.jobSheetPageSchema },
    errors: [400],
  },
  {
    pattern: '/api/v1/job-sheets',
    method: 'POST',
    tag: 'Job sheets',
    summary: 'Open a job sheet',
    body: { schema: jobSheetCreateSchema },
    ok: { status: 201, description: 'The new sheet; Location names its address.', schema: out.jobSheetAnswerSchema, etag: true },
    errors: [400, 415],
  },
  {
    pattern: '/api/v1/job-sheets/[id]',
    method: 'GET',
    tag: 'Job sheets',
    summary: 'One of your job sheets',
    ok: { status: 200, description: 'The sheet; its ETag is its version.', schema: out.jobSheetAnswerSchema, etag: true },
    errors: [404],
  },
  {
    pattern: '/api/v1/job-sheets/[id]',
    method: 'PATCH',
    tag: 'Job sheets',
    summary: 'Change a job sheet',
    description:
      'Send If-Match with the ETag you read (required with an API token). A sheet changed meanwhile answers 412 with the current sheet.',
    body: { schema: jobSheetPatchSchema },
    ok: { status: 200, description: 'The changed sheet with its new ETag.', schema: out.jobSheetAnswerSchema, etag: true },
    errors: [400, 404, 412, 415, 428],
    stale: out.jobSheetStaleSchema,
  },
  {
    pattern: '/api/v1/job-sheets/[id]',
    method: 'DELETE',
    tag: 'Job sheets',
    summary: 'Delete a job sheet (browser only)',
    ok: { status: 204, description: 'Deleted.' },
    errors: [404],
  },
  {
    pattern: '/api/v1/job-sheets/[id]/fixes',
    method: 'POST',
    tag: 'Job sheets',
    summary: 'Apply a fix to a job',
    body: { schema: applyFixSchema },
    ok: { status: 200, description: 'The sheet with the fix pinned.', schema: out.jobSheetAnswerSchema },
    errors: [400, 404, 415],
  },
  {
    pattern: '/api/v1/job-sheets/[id]/fixes',
    method: 'DELETE',
    tag: 'Job sheets',
    summary: 'Take a fix off a job',
    query: removeFixQuery,
    ok: { status: 200, description: 'The sheet without it.', schema: out.jobSheetAnswerSchema },
    errors: [400, 404],
  },
  {
    pattern: '/api/v1/job-sheets/[id]/invoice-lines.json',
    method: 'GET',
    tag: 'Job sheets',
    summary: 'Invoice lines as JSON',
    description: 'Labour, parts and the customer note links of a job.',
    ok: { status: 200, description: 'The lines.', schema: out.invoiceLinesSchema },
    errors: [404],
  },
  {
    pattern: '/api/v1/job-sheets/[id]/invoice-lines.csv',
    method: 'GET',
    tag: 'Job sheets',
    summary: 'Invoice lines as CSV',
    description: 'Columns kind, description, quantity, unit, link; cells that would start a formula are quoted.',
    ok: { status: 200, description: 'The lines as CSV.', ...text('text/csv') },
    errors: [404],
  },

  // Hand-over notes
  {
    pattern: '/api/v1/handover-notes',
    method: 'GET',
    tag: 'Hand-over notes',
    summary: 'List your hand-over notes',
    ok: { status: 200, description: 'Your notes, newest first.', schema: out.ownNoteListSchema },
  },
  {
    pattern: '/api/v1/handover-notes',
    method: 'POST',
    tag: 'Hand-over notes',
    summary: 'Write a hand-over note',
    description: 'Pinned to a proofed revision of a fix; the code goes on the invoice.',
    body: { schema: handoverNoteInputSchema },
    ok: { status: 201, description: 'The new note.', schema: out.ownNoteAnswerSchema },
    errors: [400, 415],
  },
  {
    pattern: '/api/v1/handover-notes/[code]',
    method: 'GET',
    tag: 'Hand-over notes',
    summary: 'A note by its code',
    description: "Without a token: the customer's view (410 once withdrawn). With a token: your own note with its ETag.",
    ok: { status: 200, description: 'The note.', schema: z.union([out.ownNoteAnswerSchema, out.publicNoteAnswerSchema]), etag: true },
    errors: [404, 410],
  },
  {
    pattern: '/api/v1/handover-notes/[code]',
    method: 'PATCH',
    tag: 'Hand-over notes',
    summary: "Change a note's words",
    description:
      'Message, parts, warranty, shop name and whether job details show; never the fix it is pinned to. If-Match as for job sheets.',
    body: { schema: handoverNotePatchSchema },
    ok: { status: 200, description: 'The changed note with its new ETag.', schema: out.ownNoteAnswerSchema, etag: true },
    errors: [400, 404, 412, 415, 428],
    stale: out.noteStaleSchema,
  },
  {
    pattern: '/api/v1/handover-notes/[code]',
    method: 'DELETE',
    tag: 'Hand-over notes',
    summary: 'Withdraw a note',
    ok: { status: 200, description: 'Withdrawn (or already was).', schema: out.noteRevokedSchema },
    errors: [404],
  },
  {
    pattern: '/api/v1/handover-notes/[code]',
    method: 'POST',
    tag: 'Hand-over notes',
    summary: "Withdraw a note (the page's form)",
    ok: { status: 303, description: "Back to the note's page." },
    errors: [404],
    formToo: true,
  },
  {
    pattern: '/api/v1/handover-notes/[code]/qr.svg',
    method: 'GET',
    tag: 'Hand-over notes',
    summary: "The note's address as a QR code (SVG)",
    ok: { status: 200, description: 'An SVG image.', ...text('image/svg+xml') },
    errors: [404],
  },
  {
    pattern: '/api/v1/handover-notes/[code]/qr.png',
    method: 'GET',
    tag: 'Hand-over notes',
    summary: "The note's address as a QR code (PNG)",
    ok: { status: 200, description: 'A PNG image.', ...text('image/png') },
    errors: [404],
  },

  // Bench reports
  {
    pattern: '/api/v1/bench-reports',
    method: 'GET',
    tag: 'Bench reports',
    summary: 'Your bench reports',
    query: ownReportsQuery,
    ok: { status: 200, description: 'Your reports.', schema: z.object({ reports: z.array(z.unknown()) }) },
    errors: [400],
  },
  {
    pattern: '/api/v1/bench-reports',
    method: 'POST',
    tag: 'Bench reports',
    summary: 'Record or change a bench report',
    body: { schema: benchReportInputSchema },
    ok: { status: 201, description: 'Saved (200 when it replaced your earlier report).', schema: z.object({ report: z.unknown() }) },
    errors: [400, 404, 415],
  },

  // Account (browser session only)
  {
    pattern: '/api/v1/account',
    method: 'GET',
    tag: 'Account',
    summary: 'Who you are and what you may do',
    ok: { status: 200, description: 'The account.', schema: z.object({ user: z.unknown(), can: z.array(z.string()) }) },
  },
  {
    pattern: '/api/v1/account',
    method: 'PATCH',
    tag: 'Account',
    summary: 'Change your name and shop name',
    body: { schema: profileSchema },
    ok: { status: 200, description: 'The account.', schema: z.object({ user: z.unknown(), can: z.array(z.string()) }) },
    errors: [400],
  },

  // Writing
  {
    pattern: '/api/v1/drafts',
    method: 'POST',
    tag: 'Writing',
    summary: 'Start a draft',
    body: { schema: draftCreateBodySchema },
    ok: { status: 201, description: 'The new draft.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400, 404, 409],
  },
  {
    pattern: '/api/v1/drafts/[id]',
    method: 'GET',
    tag: 'Writing',
    summary: 'Read your draft',
    ok: { status: 200, description: 'The draft.', schema: z.object({ revision: z.unknown(), baseIsStale: z.boolean() }) },
    errors: [404],
  },
  {
    pattern: '/api/v1/drafts/[id]',
    method: 'PUT',
    tag: 'Writing',
    summary: 'Save your draft',
    body: { schema: draftSaveBodySchema },
    ok: { status: 200, description: 'Saved.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400, 404, 409],
  },
  {
    pattern: '/api/v1/drafts/[id]',
    method: 'DELETE',
    tag: 'Writing',
    summary: 'Discard your draft',
    ok: { status: 200, description: 'Discarded.', schema: z.object({}).catchall(z.unknown()) },
    errors: [404],
  },
  {
    pattern: '/api/v1/drafts/[id]/submit',
    method: 'POST',
    tag: 'Writing',
    summary: 'Send a draft to the proofing desk',
    description: 'A stale base answers 409 with both versions.',
    body: { schema: draftSubmitBodySchema },
    ok: { status: 200, description: 'Submitted.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400, 404, 409],
    formToo: true,
  },
  {
    pattern: '/api/v1/drafts/[id]/discard',
    method: 'POST',
    tag: 'Writing',
    summary: "Discard a draft (the list's form)",
    ok: { status: 303, description: 'Back to your revisions.' },
    errors: [404],
    formToo: true,
  },
  {
    pattern: '/api/v1/revisions/[id]/amend',
    method: 'POST',
    tag: 'Writing',
    summary: 'Continue a returned or waiting revision as a new draft',
    ok: { status: 201, description: 'The new draft.', schema: z.object({}).catchall(z.unknown()) },
    errors: [404, 409],
    formToo: true,
  },
  {
    pattern: '/api/v1/revisions/[id]/withdraw',
    method: 'POST',
    tag: 'Writing',
    summary: 'Take back a revision waiting for proofing',
    ok: { status: 200, description: 'Withdrawn.', schema: z.object({}).catchall(z.unknown()) },
    errors: [404, 409],
    formToo: true,
  },

  // Photos
  {
    pattern: '/api/v1/photos',
    method: 'POST',
    tag: 'Photos',
    summary: 'Upload a photo',
    body: { schema: photoUpload, type: 'multipart/form-data' },
    ok: { status: 202, description: 'Accepted; pending until its renditions exist.', schema: z.object({ photo: z.unknown() }) },
    errors: [400, 413, 415],
  },
  {
    pattern: '/api/v1/photos/[id]',
    method: 'GET',
    tag: 'Photos',
    summary: "A photo's processing state",
    ok: { status: 200, description: 'The photo.', schema: z.object({ photo: z.unknown() }) },
    errors: [404],
  },
  {
    pattern: '/api/v1/photos/[id]',
    method: 'PATCH',
    tag: 'Photos',
    summary: 'Change alt text or caption while unpublished',
    body: { schema: photoTextSchema },
    ok: { status: 200, description: 'The photo.', schema: z.object({ photo: z.unknown() }) },
    errors: [400, 404, 409],
  },

  // Proofing (moderators, in the browser only)
  {
    pattern: '/api/v1/proofing/[id]/proof',
    method: 'POST',
    tag: 'Proofing',
    summary: 'Proof a waiting revision',
    ok: { status: 200, description: 'Proofed; it is live.', schema: z.object({}).catchall(z.unknown()) },
    errors: [404, 409],
    formToo: true,
  },
  {
    pattern: '/api/v1/proofing/[id]/return',
    method: 'POST',
    tag: 'Proofing',
    summary: 'Return a revision to its author',
    body: { schema: noteReturn },
    ok: { status: 200, description: 'Returned.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400, 404, 409],
    formToo: true,
  },
  {
    pattern: '/api/v1/proofing/reports/[id]',
    method: 'POST',
    tag: 'Proofing',
    summary: 'Resolve or dismiss a report',
    body: { schema: resolutionSchema },
    ok: { status: 200, description: 'Done.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400, 404, 409],
    formToo: true,
  },
  {
    pattern: '/api/v1/proofing/fixes/[slug]',
    method: 'POST',
    tag: 'Proofing',
    summary: 'Lock, unlock, hide or show a fix',
    body: { schema: fixFlagSchema },
    ok: { status: 200, description: 'Done.', schema: z.object({}).catchall(z.unknown()) },
    errors: [400, 404],
    formToo: true,
  },
];
