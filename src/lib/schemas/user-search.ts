// The admin's search over members: part of a name or address, and the page.
import { z } from 'zod';

export const userSearchSchema = z.object({
  q: z.string().trim().max(200, { error: 'Search with at most 200 characters.' }).optional(),
  page: z.coerce.number().int().min(1, { error: 'Pages start at 1.' }).max(10_000).optional(),
});
export type UserSearchInput = z.input<typeof userSearchSchema>;
export type UserSearch = z.output<typeof userSearchSchema>;
