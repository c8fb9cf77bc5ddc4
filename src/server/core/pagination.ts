// Page numbers and sizes for list queries, validated once.
import { z } from 'zod';

export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  perPage: z.coerce.number().int().min(1).max(100).default(24),
});
export type PageQuery = z.infer<typeof pageQuerySchema>;

export interface Page<T> {
  items: T[];
  page: number;
  perPage: number;
  total: number;
  pageCount: number;
}

export function toPage<T>(items: T[], total: number, query: PageQuery): Page<T> {
  return { items, page: query.page, perPage: query.perPage, total, pageCount: Math.max(1, Math.ceil(total / query.perPage)) };
}
