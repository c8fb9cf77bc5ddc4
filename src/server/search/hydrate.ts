// Turns ranked fix ids into search hits: title and snippet highlighted, machines, bench score, thumbnail.
import type { Knex } from 'knex';
import type { CautionKind } from '@/lib/schemas/revision';
import { MARK_END, MARK_START, escapeHtml, markedHtml } from '@/lib/search/highlight';
import { buildSnippet, type ConceptMarks } from '@/lib/search/snippet';
import type { Proximity } from '@/lib/search/ranking';
import type { SearchHit, SearchHitThumbnail } from '@/lib/search/result-types';
import { toPhotoView } from '../photos/photo-views';
import type { Rendition } from '../photos/renditions';

export interface RankedRow {
  fixId: number;
  proximity: Proximity;
  matchedAll: boolean;
}

interface HitRow {
  fix_id: number;
  slug: string;
  title: string;
  symptoms: string;
  revision_id: number;
  caution_kinds: CautionKind[];
  bench_score: number | null;
  report_count: number;
  has_photos: boolean;
  title_marked: string | null;
  snippet_marked: string | null;
  concept_marked: string[] | null;
  machines: string[] | null;
  photo: {
    id: number;
    alt_text: string;
    caption: string;
    width: number;
    height: number;
    is_illustration: boolean;
    renditions: Rendition[];
  } | null;
}

/** What to highlight: every matched term in the title; in the symptoms, the typed terms and each concept apart. */
export interface HighlightQuery {
  /** tsquery text of everything the query matches (typed terms and their families). */
  any: string;
  /** tsquery text of the terms as typed (after any correction). */
  typed: string;
  /** Per clause with a word family or related words: its label, the tsquery of its other terms, their words. */
  concepts: { label: string; query: string; terms: string[][] }[];
}

const HEADLINE_OPTIONS = `StartSel=${MARK_START}, StopSel=${MARK_END}, HighlightAll=true`;
const SYMPTOMS_TEXT = `replace(s.symptoms, ' . ', ' · ')`;

/**
 * ts_headline over the whole title and the whole symptoms (the snippet is cut later, by whole symptoms,
 * in buildSnippet), and the symptoms once more per concept so a family match can say why it matched.
 */
export function headlineColumns(knex: Knex, highlight: HighlightQuery): Knex.Raw[] {
  const headline = (text: string, query: string) =>
    query ? knex.raw(`ts_headline('english', ${text}, ?::tsquery, ?)`, [query, HEADLINE_OPTIONS]) : knex.raw(text);
  const concepts = highlight.concepts.filter((c) => c.query);
  return [
    highlight.any ? knex.raw('? AS title_marked', [headline('s.title', highlight.any)]) : knex.raw('NULL AS title_marked'),
    knex.raw('? AS snippet_marked', [headline(SYMPTOMS_TEXT, highlight.typed)]),
    concepts.length
      ? knex.raw(
          `ARRAY[${concepts.map(() => '?').join(', ')}]::text[] AS concept_marked`,
          concepts.map((c) => headline(SYMPTOMS_TEXT, c.query)),
        )
      : knex.raw('NULL AS concept_marked'),
  ];
}

function thumbnailOf(photo: HitRow['photo']): SearchHitThumbnail | null {
  if (!photo) return null;
  const view = toPhotoView(photo);
  if (!view.src) return null;
  return { src: view.src, srcset: view.srcsetJpeg, alt: view.alt, width: view.width, height: view.height };
}

/** Hits in the order given, highlighted from what the query matched (both providers highlight the same way). */
export async function hydrateHits(knex: Knex, ranked: RankedRow[], highlight: HighlightQuery): Promise<SearchHit[]> {
  if (ranked.length === 0) return [];
  const rows: HitRow[] = await knex('fix_search as s')
    .join('fixes as f', 'f.id', 's.fix_id')
    .whereIn(
      's.fix_id',
      ranked.map((r) => r.fixId),
    )
    .select(
      's.fix_id',
      'f.slug',
      's.title',
      's.symptoms',
      's.revision_id',
      's.caution_kinds',
      's.bench_score',
      's.report_count',
      's.has_photos',
      ...headlineColumns(knex, highlight),
      knex.raw(`ARRAY(SELECT m.slug || '|' || mk.name || ' ' || m.model_number || ' (' || m.region || ')'
        FROM machines m JOIN makers mk ON mk.id = m.maker_id
        WHERE m.id = ANY(s.machine_ids) ORDER BY mk.name, m.model_number, m.region) AS machines`),
      // The first photo of the live revision, in the same query: a thumbnail costs no extra round trip.
      knex.raw(`(SELECT json_build_object('id', p.id, 'alt_text', p.alt_text, 'caption', p.caption, 'width', p.width, 'height', p.height,
                   'is_illustration', p.is_illustration, 'renditions', p.renditions)
                 FROM revision_photos rp JOIN photos p ON p.id = rp.photo_id
                 WHERE s.has_photos AND rp.revision_id = s.revision_id AND p.deleted_at IS NULL AND jsonb_array_length(p.renditions) > 0
                 ORDER BY rp.position LIMIT 1) AS photo`),
    );
  const byId = new Map(rows.map((r) => [r.fix_id, r]));
  return ranked.flatMap((r) => {
    const row = byId.get(r.fixId);
    if (!row) return [];
    const concepts = highlight.concepts.filter((c) => c.query);
    const snippet = buildSnippet(
      row.snippet_marked ?? row.symptoms.replace(/ \. /g, ' · '),
      (row.concept_marked ?? []).map((marked, i): ConceptMarks => ({
        label: concepts[i]?.label ?? '',
        marked,
        terms: concepts[i]?.terms ?? [],
      })),
    );
    return [
      {
        fixId: row.fix_id,
        slug: row.slug,
        title: row.title,
        titleHtml: row.title_marked ? markedHtml(row.title_marked) : escapeHtml(row.title),
        snippetHtml: snippet.html,
        matched: snippet.matched,
        machines: (row.machines ?? []).map((m) => {
          const [slug = '', label = ''] = m.split('|');
          return { slug, label };
        }),
        cautionKinds: row.caution_kinds,
        benchScore: { score: row.bench_score, reports: row.report_count },
        thumbnail: thumbnailOf(row.photo),
        proximity: r.proximity,
        matchedAll: r.matchedAll,
      },
    ];
  });
}
