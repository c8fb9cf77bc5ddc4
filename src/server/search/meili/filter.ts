// Meilisearch filter expressions built from our query; every value is quoted and escaped here, nowhere else.
import type { SearchQuery } from '@/lib/search/query-schema';
import type { CodeClause } from '@/lib/search/plan';
import type { NamedMachine } from '@/lib/search/result-types';

/** A filter value in double quotes with backslashes and quotes escaped: `say "hi"` → `"say \"hi\""`. */
export function quoteFilterValue(value: string | number | boolean): string {
  if (typeof value !== 'string') return String(value);
  return `"${value.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;
}

export function equals(attribute: string, value: string | number | boolean): string {
  return `${attribute} = ${quoteFilterValue(value)}`;
}

export function inList(attribute: string, values: readonly string[]): string {
  return `${attribute} IN [${values.map(quoteFilterValue).join(', ')}]`;
}

function scopeFilter(query: SearchQuery, machine: NamedMachine | null): string[] {
  if (!query.machine) return [];
  const own = equals('machines', query.machine);
  if (!machine || query.scope === 'all') return [];
  if (query.scope === 'family' && machine.chassis) return [equals('chassis', machine.chassis.slug)];
  return machine.chassis ? [`(${own} OR ${equals('familyChassis', machine.chassis.slug)})`] : [own];
}

/** The whole filter: scope, facet filters and one IN-list per code clause; AND-ed together. */
export function buildFilter(query: SearchQuery, machine: NamedMachine | null, codes: readonly CodeClause[]): string[] {
  const f = query.filters;
  const parts = scopeFilter(query, machine);
  if (f.maker) parts.push(equals('makers', f.maker));
  if (f.chassis) parts.push(equals('chassis', f.chassis));
  if (f.deviceType) parts.push(equals('deviceTypes', f.deviceType));
  if (f.format) parts.push(equals('formats', f.format));
  if (f.hasPhotos) parts.push(equals('hasPhotos', true));
  if (f.caution) parts.push(equals('cautions', f.caution));
  for (const code of codes) parts.push(inList('codes', [...code.exact, ...code.variants]));
  return parts;
}
