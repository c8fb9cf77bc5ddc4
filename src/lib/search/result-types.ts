// The shape of a search answer, shared by both providers, the search page, the JSON endpoint and the island.
import type { CautionKind } from '@/lib/schemas/revision';
import type { Proximity } from './ranking';

export interface SearchHitMachine {
  slug: string;
  /** "Tamberlyn DR-4120 (PAL)". */
  label: string;
}

export interface SearchHitThumbnail {
  src: string;
  srcset: string;
  alt: string;
  width: number;
  height: number;
}

export interface SearchHit {
  fixId: number;
  slug: string;
  title: string;
  /** Title with matched words in <mark>; everything else escaped. */
  titleHtml: string;
  /** Whole symptoms with matched words in <mark> (a family match carries its reason as a title); "…" marks cuts. */
  snippetHtml: string;
  /** Why a highlighted word matched when it is not what was typed: "drawer ≈ tray". Shown in small text. */
  matched: string[];
  machines: SearchHitMachine[];
  cautionKinds: CautionKind[];
  /** Never shown alone: `reports` is how many bench reports it rests on. */
  benchScore: { score: number | null; reports: number };
  thumbnail: SearchHitThumbnail | null;
  proximity: Proximity;
  /** False when the fix matched only some of the query (shown under "partly matching"). */
  matchedAll: boolean;
}

/** A live fix that looks like a symptom being written up (GET /api/v1/search/similar). */
export interface SimilarFix {
  slug: string;
  title: string;
  symptoms: string[];
  machines: string[];
  /** True when the fix names this very machine; false when it comes from the chassis family. */
  sameMachine: boolean;
  /** 0 to 1: the larger of the share of the symptom's words found and the title's trigram likeness. */
  likeness: number;
  benchScore: { score: number | null; reports: number };
}

export interface FacetValue {
  value: string;
  label: string;
  count: number;
}

export interface SearchFacets {
  maker: FacetValue[];
  deviceType: FacetValue[];
  format: FacetValue[];
  chassis: FacetValue[];
  caution: FacetValue[];
  hasPhotos: number;
}

export interface NamedMachine {
  slug: string;
  label: string;
  chassis: { slug: string; name: string } | null;
}

export interface SearchResult {
  provider: 'postgres' | 'meilisearch';
  hits: SearchHit[];
  /** Fixes found; a lower bound when `totalIsLowerBound` (very broad queries are counted only so far). */
  total: number;
  totalIsLowerBound: boolean;
  /** How many of `total` match the whole query; the rest match part of it and are listed after. */
  totalMatchingAll: number;
  page: number;
  perPage: number;
  pageCount: number;
  facets: SearchFacets;
  /** True when the facet counts were taken over the first matches only (very broad queries). */
  facetsFromSample: boolean;
  /** Words corrected to ones the fixes use ("tary" → "tray"). */
  corrections: { from: string; to: string }[];
  /** Words left out because no fix uses anything like them. */
  ignored: string[];
  machine: NamedMachine | null;
}

export function emptyFacets(): SearchFacets {
  return { maker: [], deviceType: [], format: [], chassis: [], caution: [], hasPhotos: 0 };
}
