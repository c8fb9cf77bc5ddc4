// Fix reads for the public side: the live (proofed) revision of a fix, permalinks, lists by machine or family.
import type { Knex } from 'knex';
import { db } from '../core/db';
import type { Caution, CautionKind, Difficulty, PartRow, Reading, RevisionState } from '@/lib/schemas/revision';
import { benchScoresFor, emptyBenchScore, type BenchScoreView } from '../bench-work/bench-scores';
import { photosOfRevisions, type PhotoView } from '../photos/photo-views';

export interface RevisionView {
  id: number;
  number: number;
  title: string;
  symptoms: string[];
  errorCodes: string[];
  cause: string;
  body: unknown;
  parts: PartRow[];
  readings: Reading[];
  cautions: Caution[];
  difficulty: Difficulty | null;
  timeMinutes: number | null;
  editSummary: string;
  state: RevisionState;
  authorName: string;
  prooferName: string | null;
  proofedAt: Date | null;
  createdAt: Date;
}

export interface FixView {
  id: number;
  slug: string;
  lockedAt: Date | null;
  /** Always null unless the fix was read with `includeHidden`. */
  hiddenAt: Date | null;
  createdBy: number;
  /** When the fix was first written (its first revision). */
  createdAt: Date;
  revision: RevisionView;
  /** True when `revision` is the fix's current live revision. */
  isLive: boolean;
  liveRevisionNumber: number;
  machines: { slug: string; modelNumber: string; region: string; makerName: string }[];
  chassis: { slug: string; name: string; code: string }[];
  photos: PhotoView[];
  benchScore: BenchScoreView;
}

export interface FixSummary {
  slug: string;
  title: string;
  symptoms: string[];
  cautionKinds: CautionKind[];
  revisionNumber: number;
  proofedAt: Date | null;
  machines: string[];
  benchScore: BenchScoreView;
}

interface RevisionRow {
  id: number;
  fix_id: number;
  number: number;
  title: string;
  symptoms: string[];
  error_codes: string[];
  cause: string;
  body: unknown;
  parts: PartRow[];
  readings: Reading[];
  cautions: Caution[];
  difficulty: Difficulty | null;
  time_minutes: number | null;
  edit_summary: string;
  state: RevisionState;
  author_name: string | null;
  proofer_name: string | null;
  proofed_at: Date | null;
  created_at: Date;
}

function revisionQuery(knex: Knex): Knex.QueryBuilder {
  return knex('revisions as r')
    .join('users as a', 'a.id', 'r.author_id')
    .leftJoin('users as p', 'p.id', 'r.proofer_id')
    .select('r.*', 'a.name as author_name', 'p.name as proofer_name');
}

function toRevision(row: RevisionRow): RevisionView {
  return {
    id: row.id,
    number: row.number,
    title: row.title,
    symptoms: row.symptoms,
    errorCodes: row.error_codes,
    cause: row.cause,
    body: row.body,
    parts: row.parts,
    readings: row.readings,
    cautions: row.cautions,
    difficulty: row.difficulty,
    timeMinutes: row.time_minutes,
    editSummary: row.edit_summary,
    state: row.state,
    authorName: row.author_name ?? 'a former member',
    prooferName: row.proofer_name,
    proofedAt: row.proofed_at,
    createdAt: row.created_at,
  };
}

/**
 * The fix with its live revision, or (with `revisionNumber`) an older proofed revision for a permalink. A hidden
 * fix is "not found" unless `includeHidden` is set (moderators' pages, so they can show it again).
 */
export async function getFix(slug: string, revisionNumber?: number, options: { includeHidden?: boolean } = {}): Promise<FixView | null> {
  const knex = db();
  const fixQuery = knex('fixes as f')
    .join('revisions as cur', 'cur.id', 'f.current_revision_id')
    .where('f.slug', slug)
    .whereNull('f.deleted_at');
  if (!options.includeHidden) fixQuery.whereNull('f.hidden_at');
  const fix = await fixQuery.first(
    'f.id',
    'f.slug',
    'f.locked_at',
    'f.hidden_at',
    'f.created_by',
    'f.created_at',
    'f.current_revision_id',
    'cur.number as live_number',
  );
  if (!fix) return null;
  const revQuery = revisionQuery(knex).where('r.fix_id', fix.id).where('r.state', 'proofed');
  if (revisionNumber === undefined) revQuery.where('r.id', fix.current_revision_id);
  else revQuery.where('r.number', revisionNumber);
  const row: RevisionRow | undefined = await revQuery.first();
  if (!row) return null;

  const [machines, chassis, photos, scores] = await Promise.all([
    knex('revision_machines as rm')
      .join('machines as m', 'm.id', 'rm.machine_id')
      .join('makers as mk', 'mk.id', 'm.maker_id')
      .where('rm.revision_id', row.id)
      .select('m.slug', 'm.model_number', 'm.region', 'mk.name as maker_name')
      .orderBy(['mk.name', 'm.model_number', 'm.region']),
    knex('revision_chassis as rc')
      .join('chassis_families as c', 'c.id', 'rc.chassis_family_id')
      .where('rc.revision_id', row.id)
      .select('c.slug', 'c.name', 'c.code')
      .orderBy('c.name'),
    photosOfRevisions([row.id]),
    benchScoresFor([fix.id]),
  ]);

  return {
    id: fix.id,
    slug: fix.slug,
    lockedAt: fix.locked_at,
    hiddenAt: fix.hidden_at,
    createdBy: fix.created_by,
    createdAt: fix.created_at,
    revision: toRevision(row),
    isLive: row.id === fix.current_revision_id,
    liveRevisionNumber: fix.live_number,
    machines: machines.map((m) => ({ slug: m.slug, modelNumber: m.model_number, region: m.region, makerName: m.maker_name })),
    chassis,
    photos: photos.get(row.id) ?? [],
    benchScore: scores.get(fix.id) ?? emptyBenchScore(),
  };
}

interface SummaryFilter {
  machineId?: number;
  chassisId?: number;
  /** Fixes for the machine's family that are not already listed for the machine itself. */
  excludeMachineId?: number;
  limit?: number;
  offset?: number;
}

interface SummaryRow {
  id: number;
  slug: string;
  title: string;
  symptoms: string[];
  cautions: Caution[];
  number: number;
  proofed_at: Date | null;
  machine_labels: string[];
}

function liveFixes(knex: Knex, filter: SummaryFilter): Knex.QueryBuilder {
  const q = knex('fixes as f').join('revisions as r', 'r.id', 'f.current_revision_id').whereNull('f.deleted_at').whereNull('f.hidden_at');
  if (filter.machineId !== undefined) {
    q.whereExists(knex('fix_machines').whereRaw('fix_id = f.id').where('machine_id', filter.machineId));
  }
  if (filter.chassisId !== undefined) {
    // A fix belongs to a family when it names the family, or any machine built on it.
    const chassisId = filter.chassisId;
    q.where((w) =>
      w
        .whereExists(knex('fix_chassis').whereRaw('fix_id = f.id').where('chassis_family_id', chassisId))
        .orWhereExists(
          knex('fix_machines as fm')
            .join('machines as m', 'm.id', 'fm.machine_id')
            .whereRaw('fm.fix_id = f.id')
            .where('m.chassis_family_id', chassisId),
        ),
    );
  }
  if (filter.excludeMachineId !== undefined) {
    q.whereNotExists(knex('fix_machines').whereRaw('fix_id = f.id').where('machine_id', filter.excludeMachineId));
  }
  return q;
}

export async function countFixSummaries(filter: SummaryFilter = {}): Promise<number> {
  const row = await liveFixes(db(), filter).count<{ n: string }[]>('f.id as n').first();
  return Number(row?.n ?? 0);
}

/** Live fixes as list entries, newest proofed first. */
export async function listFixSummaries(filter: SummaryFilter = {}): Promise<FixSummary[]> {
  const knex = db();
  const q = liveFixes(knex, filter)
    .select(
      'f.id',
      'f.slug',
      'r.title',
      'r.symptoms',
      'r.cautions',
      'r.number',
      'r.proofed_at',
      knex.raw(
        `ARRAY(SELECT mk.name || ' ' || m.model_number || ' (' || m.region || ')' FROM fix_machines fm
           JOIN machines m ON m.id = fm.machine_id JOIN makers mk ON mk.id = m.maker_id
           WHERE fm.fix_id = f.id ORDER BY mk.name, m.model_number, m.region) AS machine_labels`,
      ),
    )
    .orderBy([
      { column: 'r.proofed_at', order: 'desc' },
      { column: 'f.id', order: 'desc' },
    ])
    .limit(filter.limit ?? 100)
    .offset(filter.offset ?? 0);
  const rows: SummaryRow[] = await q;
  const scores = await benchScoresFor(rows.map((r) => r.id));
  return rows.map((r) => ({
    slug: r.slug,
    title: r.title,
    symptoms: r.symptoms,
    cautionKinds: [...new Set(r.cautions.map((c) => c.kind))],
    revisionNumber: r.number,
    proofedAt: r.proofed_at,
    machines: r.machine_labels,
    benchScore: scores.get(r.id) ?? emptyBenchScore(),
  }));
}
