// The list of a member's job sheets: filter by status, search the customer reference, and sort.
import { z } from 'zod';
import { jobStatusSchema } from './job-sheet';

export const jobSheetSorts = ['updated', 'booked', 'customer', 'status'] as const;
export const jobSheetListQuerySchema = z.object({
  status: jobStatusSchema.optional(),
  q: z.string().trim().max(120).optional(),
  sort: z.enum(jobSheetSorts).default('updated'),
});
export type JobSheetListQuery = z.output<typeof jobSheetListQuerySchema>;
export type JobSheetListQueryInput = z.input<typeof jobSheetListQuerySchema>;

/** The API's list: the same filters, a page at a time (page from 1, up to 100 a page). */
export const jobSheetPagedQuerySchema = jobSheetListQuerySchema.extend({
  page: z.coerce
    .number({ error: 'Give the page as a whole number, e.g. 2.' })
    .int('Give the page as a whole number, e.g. 2.')
    .min(1, 'Pages start at 1.')
    .max(10_000, 'Pages stop at 10000.')
    .default(1),
  perPage: z.coerce
    .number({ error: 'Give perPage as a whole number, e.g. 50.' })
    .int('Give perPage as a whole number, e.g. 50.')
    .min(1, 'Ask for at least 1 per page, e.g. 50.')
    .max(100, 'Ask for at most 100 per page, e.g. 50.')
    .default(50),
});
