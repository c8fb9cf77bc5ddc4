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
