// GET /api/v1/fixes/:slug/bench-reports: the public counts behind a fix's bench score, per revision.
import type { APIRoute } from 'astro';
import { apiError, json } from '@/server/http/responses';
import { liveFixBySlug } from '@/server/bench-work/bench-reports';
import { benchCountsByRevision, benchScoresFor, emptyBenchScore } from '@/server/bench-work/bench-scores';
import { slugSchema } from '@/lib/schemas/slug';

export const GET: APIRoute = async ({ params }) => {
  const slug = slugSchema.safeParse(params.slug);
  if (!slug.success) return apiError('not_found', 'No fix has that address.');
  const fix = await liveFixBySlug(slug.data);
  if (!fix) return apiError('not_found', `No fix "${slug.data}".`);
  const [scores, byRevision] = await Promise.all([benchScoresFor([fix.id]), benchCountsByRevision(fix.id)]);
  return json({
    fix: { slug: fix.slug, liveRevision: fix.currentRevisionNumber },
    benchScore: scores.get(fix.id) ?? emptyBenchScore(),
    byRevision,
    method:
      'Lower bound of the 95 % Wilson score interval; partly counts half, fault came back counts as not fixed, reports on older revisions weigh half, the author’s own reports are shown but not counted.',
  });
};
