// Turns ranked fix ids into search hits: title and snippet highlighted, machines, bench score, thumbnail.
import type { Knex } from 'knex';
import type { CautionKind } from '@/lib/schemas/revision';
import { MARK_END, MARK_START, escapeHtml, markedHtml } from '@/lib/search/highlight';
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

/** Marked text from the database, or plain text escaped when nothing was marked. */
export type Marker = (column: 'title' | 'symptoms') => string;

const HEADLINE_OPTIONS = `StartSel=${MARK_START}, StopSel=${MARK_END}`;

/** ts_headline for the title (whole) and the symptoms (two short fragments); the caller passes the tsquery text. */
export function headlineColumns(knex: Knex, tsquery: string): Knex.Raw[] {
  if (!tsquery) return [knex.raw('NULL AS title_marked'), knex.raw('NULL AS snippet_marked')];
  return [
    knex.raw(`ts_headline('english', s.title, ?::tsquery, ?) AS title_marked`, [tsquery, `${HEADLINE_OPTIONS}, HighlightAll=true`]),
    knex.raw(`ts_headline('english', replace(s.symptoms, ' . ', ' · '), ?::tsquery, ?) AS snippet_marked`, [
      tsquery,
      `${HEADLINE_OPTIONS}, MaxFragments=2, MaxWords=16, MinWords=5, FragmentDelimiter=" … "`,
    ]),
  ];
}

function thumbnailOf(photo: HitRow['photo']): SearchHitThumbnail | null {
  if (!photo) return null;
  const view = toPhotoView(photo);
  if (!view.src) return null;
  return { src: view.src, srcset: view.srcsetJpeg, alt: view.alt, width: view.width, height: view.height };
}

/** Hits in the order given. `marks` overrides the highlighted title and snippet (the Meilisearch adapter's own). */
export async function hydrateHits(
  knex: Knex,
  ranked: RankedRow[],
  tsquery: string,
  marks?: Map<number, { title: string; snippet: string }>,
): Promise<SearchHit[]> {
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
      ...headlineColumns(knex, tsquery),
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
    const own = marks?.get(r.fixId);
    // Fragments may start or end on a separator between symptoms; it reads better without.
    const trimSeparators = (html: string) => html.replace(/^(\s*·\s*)+/, '').replace(/(\s*·\s*)+$/, '');
    const symptoms = row.symptoms.replace(/ \. /g, ' · ');
    return [
      {
        fixId: row.fix_id,
        slug: row.slug,
        title: row.title,
        titleHtml: own ? markedHtml(own.title) : row.title_marked ? markedHtml(row.title_marked) : escapeHtml(row.title),
        snippetHtml: trimSeparators(
          own ? markedHtml(own.snippet) : row.snippet_marked ? markedHtml(row.snippet_marked) : escapeHtml(symptoms),
        ),
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
