// Facet counts over a set of matching fixes, labelled: makers and chassis by name, device types and cautions by label.
import { deviceTypeLabels, type DeviceType } from '@/lib/schemas/catalogue';
import { cautionLabels, type CautionKind } from '@/lib/schemas/revision';
import type { FacetValue, SearchFacets } from './result-types';

export interface FacetRow {
  makerIds: readonly number[];
  chassisIds: readonly number[];
  deviceTypes: readonly string[];
  formats: readonly string[];
  cautionKinds: readonly string[];
  hasPhotos: boolean;
}

export type Named = ReadonlyMap<number, { slug: string; name: string }>;

const byCount = (a: FacetValue, b: FacetValue) => b.count - a.count || a.label.localeCompare(b.label);

function tally<K>(rows: readonly FacetRow[], valuesOf: (row: FacetRow) => readonly K[]): Map<K, number> {
  const counts = new Map<K, number>();
  // A fix counts once per value, however often the value repeats in it.
  for (const row of rows) for (const value of new Set(valuesOf(row))) counts.set(value, (counts.get(value) ?? 0) + 1);
  return counts;
}

function labelled<K>(counts: Map<K, number>, label: (key: K) => { value: string; label: string } | null): FacetValue[] {
  return [...counts]
    .flatMap(([key, count]) => {
      const named = label(key);
      return named ? [{ ...named, count }] : [];
    })
    .sort(byCount);
}

export function countFacets(rows: readonly FacetRow[], makers: Named, chassis: Named): SearchFacets {
  const byId = (names: Named) => (id: number) => {
    const found = names.get(id);
    return found ? { value: found.slug, label: found.name } : null;
  };
  return {
    maker: labelled(
      tally(rows, (r) => r.makerIds),
      byId(makers),
    ),
    chassis: labelled(
      tally(rows, (r) => r.chassisIds),
      byId(chassis),
    ),
    deviceType: labelled(
      tally(rows, (r) => r.deviceTypes),
      (v) => ({ value: v, label: deviceTypeLabels[v as DeviceType] ?? v }),
    ),
    format: labelled(
      tally(rows, (r) => r.formats),
      (v) => ({ value: v, label: v }),
    ),
    caution: labelled(
      tally(rows, (r) => r.cautionKinds),
      (v) => ({ value: v, label: cautionLabels[v as CautionKind] ?? v }),
    ),
    hasPhotos: rows.filter((r) => r.hasPhotos).length,
  };
}
