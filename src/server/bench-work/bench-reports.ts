// Bench reports: one per member per fix per machine, on the revision followed; saving refreshes the score.
import type { Knex } from 'knex';
import { recordBenchReportNews } from '../notifications/news';
import { db } from '../core/db';
import type { Failure } from '../http/result';
import { benchScoresFor, emptyBenchScore, type BenchScoreView } from './bench-scores';
import { refreshBenchScoreColumns } from '../search/bench-score-columns';
import type { Reading } from '@/lib/schemas/revision';
import { formNumber, formRows, formText, type FormFields } from '@/lib/form-fields';
import { type BenchOutcome, type BenchReportData } from '@/lib/schemas/bench-report';

export interface LiveFixRef {
  id: number;
  slug: string;
  createdBy: number;
  currentRevisionId: number;
  currentRevisionNumber: number;
  title: string;
}

/** A fix readers can see (not deleted, not hidden, with a live revision), or null. */
export async function liveFixBySlug(slug: string, knex: Knex = db()): Promise<LiveFixRef | null> {
  const row = await knex('fixes as f')
    .join('revisions as r', 'r.id', 'f.current_revision_id')
    .where('f.slug', slug)
    .whereNull('f.deleted_at')
    .whereNull('f.hidden_at')
    .first('f.id', 'f.slug', 'f.created_by', 'f.current_revision_id', 'r.number', 'r.title');
  if (!row) return null;
  return {
    id: row.id,
    slug: row.slug,
    createdBy: row.created_by,
    currentRevisionId: row.current_revision_id,
    currentRevisionNumber: row.number,
    title: row.title,
  };
}

/** The id of a proofed revision of the fix by its number, or null. */
export async function proofedRevisionId(fixId: number, number: number, knex: Knex = db()): Promise<number | null> {
  const row = await knex('revisions').where({ fix_id: fixId, number, state: 'proofed' }).first('id');
  return row ? (row.id as number) : null;
}

export interface MachineOption {
  id: number;
  slug: string;
  label: string;
}

/** Machines a report may name: those the fix applies to, and every machine of the families involved. */
export async function eligibleMachines(fixId: number): Promise<MachineOption[]> {
  const knex = db();
  const rows = await knex('machines as m')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .whereNull('m.deleted_at')
    .where((q) => {
      q.whereIn('m.id', knex('fix_machines').where('fix_id', fixId).select('machine_id'))
        .orWhereIn('m.chassis_family_id', knex('fix_chassis').where('fix_id', fixId).select('chassis_family_id'))
        .orWhereIn(
          'm.chassis_family_id',
          knex('fix_machines as fm')
            .join('machines as fam', 'fam.id', 'fm.machine_id')
            .where('fm.fix_id', fixId)
            .whereNotNull('fam.chassis_family_id')
            .select('fam.chassis_family_id'),
        );
    })
    .orderBy(['mk.name', 'm.model_number', 'm.region'])
    .select('m.id', 'm.slug', 'm.model_number', 'm.region', 'mk.name as maker_name');
  return rows.map((r) => ({ id: r.id, slug: r.slug, label: `${r.maker_name} ${r.model_number} (${r.region})` }));
}

export interface SavedBenchReport {
  id: number;
  created: boolean;
  /** False when the member wrote the fix: their report is shown but not counted. */
  counted: boolean;
  revisionNumber: number;
  benchScore: BenchScoreView;
}

/** Saved (the report under `report`, the name callers and tests read), or the shared refusal. */
export type SaveBenchReportResult = { ok: true; report: SavedBenchReport } | Failure;

export async function saveBenchReport(memberId: number, data: BenchReportData): Promise<SaveBenchReportResult> {
  const knex = db();
  const fix = await liveFixBySlug(data.fix, knex);
  if (!fix) return { ok: false, code: 'not_found', message: `No fix "${data.fix}".` };
  const revisionNumber = data.revision ?? fix.currentRevisionNumber;
  const revisionId = data.revision === undefined ? fix.currentRevisionId : await proofedRevisionId(fix.id, data.revision, knex);
  if (revisionId === null) {
    return {
      ok: false,
      code: 'bad_request',
      message: 'That revision cannot take reports.',
      fields: { revision: [`The fix has no proofed revision r${revisionNumber}.`] },
    };
  }
  const machine = (await eligibleMachines(fix.id)).find((m) => m.slug === data.machine);
  if (!machine) {
    return {
      ok: false,
      code: 'bad_request',
      message: 'That machine is not one this fix applies to.',
      fields: { machine: ['Choose a machine this fix applies to, or one of its chassis family.'] },
    };
  }
  const values = {
    revision_id: revisionId,
    outcome: data.outcome,
    held_days: data.heldDays,
    note: data.note,
    readings: JSON.stringify(data.readings),
    updated_at: knex.fn.now(),
  };
  const [row] = await knex('bench_reports')
    .insert({ fix_id: fix.id, machine_id: machine.id, member_id: memberId, ...values })
    .onConflict(['fix_id', 'member_id', 'machine_id'])
    .merge(values)
    .returning(['id', knex.raw('(xmax = 0) AS inserted')]);
  await refreshBenchScoreColumns(knex, [fix.id]);
  // The fix's authors hear about reports from others (their own are shown, not counted, and not news).
  if (fix.createdBy !== memberId) await recordBenchReportNews(row.id, knex);
  const scores = await benchScoresFor([fix.id]);
  return {
    ok: true,
    report: {
      id: row.id,
      created: row.inserted === true,
      counted: fix.createdBy !== memberId,
      revisionNumber,
      benchScore: scores.get(fix.id) ?? emptyBenchScore(),
    },
  };
}

export interface OwnBenchReport {
  id: number;
  fix: { slug: string; title: string };
  machine: { slug: string; label: string };
  outcome: BenchOutcome;
  heldDays: number | null;
  note: string;
  readings: Reading[];
  revisionNumber: number;
  onCurrentRevision: boolean;
  counted: boolean;
  updatedAt: Date;
}

/** The member's own reports, newest first; optionally only those on one fix. */
export async function listOwnBenchReports(memberId: number, fixSlug?: string): Promise<OwnBenchReport[]> {
  const q = db()('bench_reports as b')
    .join('fixes as f', 'f.id', 'b.fix_id')
    .join('revisions as cur', 'cur.id', 'f.current_revision_id')
    .join('revisions as r', 'r.id', 'b.revision_id')
    .join('machines as m', 'm.id', 'b.machine_id')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .where('b.member_id', memberId)
    .whereNull('f.deleted_at')
    .orderBy([
      { column: 'b.updated_at', order: 'desc' },
      { column: 'b.id', order: 'desc' },
    ])
    .select(
      'b.*',
      'f.slug as fix_slug',
      'f.created_by',
      'f.current_revision_id',
      'cur.title',
      'r.number as revision_number',
      'm.slug as machine_slug',
      'm.model_number',
      'm.region',
      'mk.name as maker_name',
    );
  if (fixSlug) q.where('f.slug', fixSlug);
  const rows = await q;
  return rows.map((r) => ({
    id: r.id,
    fix: { slug: r.fix_slug, title: r.title },
    machine: { slug: r.machine_slug, label: `${r.maker_name} ${r.model_number} (${r.region})` },
    outcome: r.outcome,
    heldDays: r.held_days,
    note: r.note,
    readings: r.readings,
    revisionNumber: r.revision_number,
    onCurrentRevision: r.revision_id === r.current_revision_id,
    counted: r.created_by !== memberId,
    updatedAt: r.updated_at,
  }));
}

export interface FixBenchReport {
  id: number;
  machineLabel: string;
  outcome: BenchOutcome;
  heldDays: number | null;
  note: string;
  readings: Reading[];
  revisionNumber: number;
  /** By the fix's author: shown, not counted. */
  byAuthor: boolean;
  /** By the member reading the page. */
  own: boolean;
  updatedAt: Date;
}

/** A fix's bench reports for its page, newest first, without who wrote them (the reader's own are marked). */
export async function listFixBenchReports(fixId: number, readerId: number | null, limit = 50): Promise<FixBenchReport[]> {
  const rows = await db()('bench_reports as b')
    .join('fixes as f', 'f.id', 'b.fix_id')
    .join('revisions as r', 'r.id', 'b.revision_id')
    .join('machines as m', 'm.id', 'b.machine_id')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .where('b.fix_id', fixId)
    .orderBy([
      { column: 'b.updated_at', order: 'desc' },
      { column: 'b.id', order: 'desc' },
    ])
    .limit(limit)
    .select(
      'b.id',
      'b.outcome',
      'b.held_days',
      'b.note',
      'b.readings',
      'b.member_id',
      'b.updated_at',
      'f.created_by',
      'r.number as revision_number',
      'm.model_number',
      'm.region',
      'mk.name as maker_name',
    );
  return rows.map((r) => ({
    id: r.id,
    machineLabel: `${r.maker_name} ${r.model_number} (${r.region})`,
    outcome: r.outcome,
    heldDays: r.held_days,
    note: r.note,
    readings: Array.isArray(r.readings) ? r.readings : [],
    revisionNumber: r.revision_number,
    byAuthor: r.member_id === r.created_by,
    own: readerId !== null && r.member_id === readerId,
    updatedAt: r.updated_at,
  }));
}

/** Reads the bench report form of a fix page or job sheet into the shape the schema checks. */
export function benchReportFromForm(form: FormFields): Record<string, unknown> {
  const readings = formRows(form, 'readings', ['testPoint', 'expected', 'measured', 'note']);
  return {
    fix: formText(form, 'fix'),
    machine: formText(form, 'machine'),
    revision: formNumber(form, 'revision'),
    outcome: formText(form, 'outcome'),
    // The days field may stay filled in when the member switches the outcome back: ignore it then.
    heldDays: formText(form, 'outcome') === 'came_back' ? (formNumber(form, 'heldDays') ?? null) : null,
    note: formText(form, 'note') ?? '',
    readings,
  };
}
