// The search query as the page, the JSON endpoint and the search box island all read it: one zod schema.
import { z } from 'zod';
import { deviceTypeSchema, mediaFormatSchema, type DeviceType, type MediaFormat } from '@/lib/schemas/catalogue';
import { cautionKindSchema, type CautionKind } from '@/lib/schemas/revision';
import { slugSchema } from '@/lib/schemas/slug';
import { MAX_QUERY_LENGTH } from './tokens';

/** With a machine named: only its fixes (default), its whole chassis family, or every machine (nearest first). */
export const searchScopes = ['machine', 'family', 'all'] as const;
export type SearchScope = (typeof searchScopes)[number];

/** Results are paged this deep at most; past that, a narrower query serves the reader better. */
export const MAX_PAGE = 50;
export const DEFAULT_PER_PAGE = 10;

const flag = z.enum(['1', 'true', 'yes', 'on'], { error: 'Use photos=1 to keep only fixes with photos.' }).transform(() => true as const);

export const searchParamsSchema = z.object({
  q: z.string().trim().max(MAX_QUERY_LENGTH, `Keep the search under ${MAX_QUERY_LENGTH} characters.`).default(''),
  machine: slugSchema.optional(),
  scope: z.enum(searchScopes).default('machine'),
  maker: slugSchema.optional(),
  chassis: slugSchema.optional(),
  deviceType: deviceTypeSchema.optional(),
  format: mediaFormatSchema.optional(),
  photos: flag.optional(),
  caution: cautionKindSchema.optional(),
  page: z.coerce.number().int().min(1).max(MAX_PAGE, `Results go ${MAX_PAGE} pages deep; narrow the search instead.`).default(1),
  perPage: z.coerce.number().int().min(1).max(50).default(DEFAULT_PER_PAGE),
});
export type SearchParams = z.infer<typeof searchParamsSchema>;

export interface SearchFilters {
  maker?: string;
  chassis?: string;
  deviceType?: DeviceType;
  format?: MediaFormat;
  hasPhotos?: boolean;
  caution?: CautionKind;
}

/** What a search provider is asked. */
export interface SearchQuery {
  text: string;
  /** Slug of the machine the reader named; scopes and orders the results. */
  machine?: string;
  scope: SearchScope;
  filters: SearchFilters;
  page: number;
  perPage: number;
}

export function toSearchQuery(params: SearchParams): SearchQuery {
  const filters: SearchFilters = {};
  if (params.maker) filters.maker = params.maker;
  if (params.chassis) filters.chassis = params.chassis;
  if (params.deviceType) filters.deviceType = params.deviceType;
  if (params.format) filters.format = params.format;
  if (params.photos) filters.hasPhotos = true;
  if (params.caution) filters.caution = params.caution;
  const query: SearchQuery = { text: params.q, scope: params.scope, filters, page: params.page, perPage: params.perPage };
  if (params.machine) query.machine = params.machine;
  return query;
}

/** A search as address parameters (defaults left out), e.g. { q: 'no rewind', machine: '…', maker: '…' }. */
export function searchParamsOf(query: SearchQuery): Record<string, string> {
  const params: Record<string, string> = {};
  if (query.text) params.q = query.text;
  if (query.machine) params.machine = query.machine;
  if (query.machine && query.scope !== 'machine') params.scope = query.scope;
  const f = query.filters;
  if (f.maker) params.maker = f.maker;
  if (f.chassis) params.chassis = f.chassis;
  if (f.deviceType) params.deviceType = f.deviceType;
  if (f.format) params.format = f.format;
  if (f.hasPhotos) params.photos = '1';
  if (f.caution) params.caution = f.caution;
  if (query.page > 1) params.page = String(query.page);
  if (query.perPage !== DEFAULT_PER_PAGE) params.perPage = String(query.perPage);
  return params;
}

/** The address of a search, for links that change one thing (a facet, the scope, the page). */
export function searchHref(query: SearchQuery, change: Partial<SearchQuery> = {}, base = '/search'): string {
  const next: SearchQuery = { ...query, ...change, filters: change.filters ?? query.filters };
  const search = new URLSearchParams(searchParamsOf(next)).toString();
  return search ? `${base}?${search}` : base;
}
