// Job sheets: a technician's private record of one repair. Every read and write is scoped to its owner.
import type { Knex } from 'knex';
import { z } from 'zod';
import { db } from '../core/db';
import { refuse, type Outcome } from '../http/result';
import { can, type SessionUser } from '@/lib/permissions';
import { liveFixBySlug, proofedRevisionId } from './bench-reports';
import { config } from '../core/config';
import { listOwnNotes } from './handover-notes';
import type { JobPart, JobSheetCreate, JobSheetPatch, JobStatus } from '@/lib/schemas/job-sheet';
import type { JobSheetListQuery } from '@/lib/schemas/job-sheet-list';
import type { PageQuery } from '../core/pagination';

export interface JobMachine {
  id: number;
  slug: string;
  label: string;
  makerName: string;
  chassisFamilyId: number | null;
}

export interface JobSheetSummary {
  id: number;
  customerRef: string;
  machine: string | null;
  status: JobStatus;
  bookedInAt: Date;
  updatedAt: Date;
  fixCount: number;
}

export interface AppliedFix {
  slug: string;
  title: string;
  revisionNumber: number;
  permalink: string;
  /** The fix's live revision number now; higher than revisionNumber when it has changed since. */
  liveRevisionNumber: number | null;
}

export interface JobSheetView extends Omit<JobSheetSummary, 'machine' | 'fixCount'> {
  machine: JobMachine | null;
  serialNumber: string;
  reportedSymptom: string;
  findings: string;
  partsUsed: JobPart[];
  labourMinutes: number;
  outcome: string;
  createdAt: Date;
  fixes: AppliedFix[];
  /** Counts every change, from the browser or a program: the ETag and If-Match of the API. */
  version: number;
}

/** What a job sheet write hands back: the sheet's number (or a count), or why not. */
export type WriteResult<T> = Outcome<T>;

const machineLabel = knexLabel('m', 'mk');
function knexLabel(machine: string, maker: string): string {
  return `${maker}.name || ' ' || ${machine}.model_number || ' (' || ${machine}.region || ')'`;
}

/** Every live machine of the catalogue for the job sheet's machine picker. */
export async function machineOptions(): Promise<JobMachine[]> {
  const rows = await db()('machines as m')
    .join('makers as mk', 'mk.id', 'm.maker_id')
    .whereNull('m.deleted_at')
    .orderBy(['mk.name', 'm.model_number', 'm.region'])
    .select('m.id', 'm.slug', 'm.chassis_family_id', 'mk.name as maker_name', db().raw(`${machineLabel} AS label`));
  return rows.map((r) => ({ id: r.id, slug: r.slug, label: r.label, makerName: r.maker_name, chassisFamilyId: r.chassis_family_id }));
}

const sortColumns: Record<JobSheetListQuery['sort'], { column: string; order: 'asc' | 'desc' }[]> = {
  updated: [{ column: 'j.updated_at', order: 'desc' }],
  booked: [{ column: 'j.booked_in_at', order: 'desc' }],
  customer: [{ column: 'j.customer_ref', order: 'asc' }],
  status: [
    { column: 'j.status', order: 'asc' },
    { column: 'j.updated_at', order: 'desc' },
  ],
};

/** The owner's sheets matching the query's status and words, unsorted and unselected. */
function matchingSheets(knex: Knex, ownerId: number, query: Pick<JobSheetListQuery, 'status' | 'q'>): Knex.QueryBuilder {
  const q = knex('job_sheets as j')
    .leftJoin('machines as m', 'm.id', 'j.machine_id')
    .leftJoin('makers as mk', 'mk.id', 'm.maker_id')
    .where('j.owner_id', ownerId);
  if (query.status) q.where('j.status', query.status);
  if (query.q) {
    const like = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    q.where((w) =>
      w
        .whereILike('j.customer_ref', like)
        .orWhereILike('j.serial_number', like)
        .orWhereILike('m.model_number', like)
        .orWhereILike('j.reported_symptom', like),
    );
  }
  return q;
}

/** The owner's sheets, sorted; at most 500 (the /jobs page), or one page of them (the API). */
export async function listJobSheets(ownerId: number, query: JobSheetListQuery, page?: PageQuery): Promise<JobSheetSummary[]> {
  const knex = db();
  const q = matchingSheets(knex, ownerId, query)
    .select(
      'j.id',
      'j.customer_ref',
      'j.status',
      'j.booked_in_at',
      'j.updated_at',
      knex.raw(`${machineLabel} AS machine_label`),
      knex.raw('(SELECT count(*) FROM job_sheet_fixes jf WHERE jf.job_sheet_id = j.id) AS fix_count'),
    )
    .orderBy([...sortColumns[query.sort], { column: 'j.id', order: 'desc' }])
    .limit(page ? page.perPage : 500)
    .offset(page ? (page.page - 1) * page.perPage : 0);
  const rows: {
    id: number;
    customer_ref: string;
    status: JobStatus;
    booked_in_at: Date;
    updated_at: Date;
    machine_label: string | null;
    fix_count: string;
  }[] = await q;
  return rows.map((r) => ({
    id: r.id,
    customerRef: r.customer_ref,
    machine: r.machine_label,
    status: r.status,
    bookedInAt: r.booked_in_at,
    updatedAt: r.updated_at,
    fixCount: Number(r.fix_count),
  }));
}

/** How many of the owner's sheets match the query: the total beside a page. */
export async function countJobSheets(ownerId: number, query: Pick<JobSheetListQuery, 'status' | 'q'>): Promise<number> {
  const [row] = await matchingSheets(db(), ownerId, query).count<{ count: string }[]>('j.id as count');
  return Number(row?.count ?? 0);
}

/** The owner's job sheet, or null: another member's sheet is indistinguishable from a missing one. */
export async function getJobSheet(ownerId: number, id: number): Promise<JobSheetView | null> {
  const knex = db();
  const row = await knex('job_sheets as j')
    .leftJoin('machines as m', 'm.id', 'j.machine_id')
    .leftJoin('makers as mk', 'mk.id', 'm.maker_id')
    .where({ 'j.id': id, 'j.owner_id': ownerId })
    .first('j.*', 'm.slug as machine_slug', 'm.chassis_family_id', 'mk.name as maker_name', knex.raw(`${machineLabel} AS machine_label`));
  if (!row) return null;
  const fixes = await knex('job_sheet_fixes as jf')
    .join('fixes as f', 'f.id', 'jf.fix_id')
    .join('revisions as r', 'r.id', 'jf.revision_id')
    .leftJoin('revisions as cur', 'cur.id', 'f.current_revision_id')
    .where('jf.job_sheet_id', id)
    .orderBy('r.title')
    .select('f.slug', 'r.title', 'r.number', 'cur.number as live_number');
  return {
    id: row.id,
    customerRef: row.customer_ref,
    machine: row.machine_id
      ? {
          id: row.machine_id,
          slug: row.machine_slug,
          label: row.machine_label,
          makerName: row.maker_name,
          chassisFamilyId: row.chassis_family_id,
        }
      : null,
    serialNumber: row.serial_number,
    reportedSymptom: row.reported_symptom,
    findings: row.findings,
    partsUsed: row.parts_used,
    labourMinutes: row.labour_minutes,
    status: row.status,
    outcome: row.outcome,
    bookedInAt: row.booked_in_at,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    version: row.version,
    fixes: fixes.map((f) => ({
      slug: f.slug,
      title: f.title,
      revisionNumber: f.number,
      permalink: `/fixes/${f.slug}/r/${f.number}`,
      liveRevisionNumber: f.live_number,
    })),
  };
}

async function machineIdOf(knex: Knex, slug: string | null | undefined): Promise<number | null | 'unknown'> {
  if (slug === null || slug === undefined) return null;
  const row = await knex('machines').where({ slug }).whereNull('deleted_at').first('id');
  return row ? (row.id as number) : 'unknown';
}

const unknownMachine = {
  ok: false as const,
  code: 'bad_request' as const,
  message: 'That machine is not in the catalogue.',
  fields: { machine: ['Choose a machine from the catalogue, or leave it empty.'] },
};

/** Parts lines keep the order-list shape; a line without a source is marked as coming from this job. */
function partsJson(parts: JobPart[], customerRef: string): string {
  return JSON.stringify(parts.map((p) => ({ ...p, source: p.source || `Job sheet ${customerRef}` })));
}

export async function createJobSheet(ownerId: number, data: JobSheetCreate): Promise<WriteResult<number>> {
  const knex = db();
  const machineId = await machineIdOf(knex, data.machine);
  if (machineId === 'unknown') return unknownMachine;
  const [row] = await knex('job_sheets')
    .insert({
      owner_id: ownerId,
      customer_ref: data.customerRef,
      machine_id: machineId,
      serial_number: data.serialNumber,
      reported_symptom: data.reportedSymptom,
      findings: data.findings,
      parts_used: partsJson(data.partsUsed, data.customerRef),
      labour_minutes: data.labourMinutes,
      status: data.status,
      outcome: data.outcome,
    })
    .returning('id');
  return { ok: true, value: row.id };
}

/**
 * Writes the fields given. With `expectedVersion` (the If-Match of a program or of an edit made offline), only if
 * nobody changed the sheet since that version: otherwise a refusal carrying the current sheet, so the caller can
 * show both copies (412 Precondition Failed, the standard answer to a failed If-Match).
 */
export async function updateJobSheet(
  ownerId: number,
  id: number,
  patch: JobSheetPatch,
  expectedVersion?: number,
): Promise<WriteResult<number>> {
  const knex = db();
  const current = await knex('job_sheets').where({ id, owner_id: ownerId }).first('id', 'customer_ref', 'version');
  if (!current) return { ok: false, code: 'not_found', message: 'No job sheet with that number.' };
  if (expectedVersion !== undefined && current.version !== expectedVersion) return staleSheet(ownerId, id);
  const changes: Record<string, unknown> = { updated_at: knex.fn.now() };
  if (patch.machine !== undefined) {
    const machineId = await machineIdOf(knex, patch.machine);
    if (machineId === 'unknown') return unknownMachine;
    changes.machine_id = machineId;
  }
  const columns = {
    customerRef: 'customer_ref',
    serialNumber: 'serial_number',
    reportedSymptom: 'reported_symptom',
    findings: 'findings',
    labourMinutes: 'labour_minutes',
    status: 'status',
    outcome: 'outcome',
  } as const;
  for (const [key, column] of Object.entries(columns) as [keyof typeof columns, string][]) {
    if (patch[key] !== undefined) changes[column] = patch[key];
  }
  if (patch.partsUsed !== undefined) changes.parts_used = partsJson(patch.partsUsed, patch.customerRef ?? current.customer_ref);
  const write = knex('job_sheets').where({ id, owner_id: ownerId });
  // The version is checked again in the write itself: an edit landing between the read and here still wins.
  if (expectedVersion !== undefined) write.where({ version: expectedVersion });
  if ((await write.update(changes)) === 0) return staleSheet(ownerId, id);
  return { ok: true, value: id };
}

async function staleSheet(ownerId: number, id: number): Promise<WriteResult<number>> {
  const sheet = await getJobSheet(ownerId, id);
  if (!sheet) return { ok: false, code: 'not_found', message: 'No job sheet with that number.' };
  return refuse(
    'precondition_failed',
    `The job sheet changed since you read it: it is now version ${sheet.version}. Read it again, merge your change and send it with If-Match: "v${sheet.version}".`,
    undefined,
    { current: sheet },
  );
}

/** Hard delete: the customer data goes; notes made from it keep working without it (SET NULL). */
export async function deleteJobSheet(ownerId: number, id: number): Promise<boolean> {
  return (await db()('job_sheets').where({ id, owner_id: ownerId }).delete()) > 0;
}

/** Pins the fix's live revision (or the proofed one named) to the job; applying again re-pins. */
export async function applyFixToJob(ownerId: number, id: number, fixSlug: string, revision?: number): Promise<WriteResult<number>> {
  const knex = db();
  if (!(await knex('job_sheets').where({ id, owner_id: ownerId }).first('id')))
    return { ok: false, code: 'not_found', message: 'No job sheet with that number.' };
  const fix = await liveFixBySlug(fixSlug, knex);
  if (!fix) return { ok: false, code: 'bad_request', message: 'No such fix.', fields: { fix: [`No fix "${fixSlug}".`] } };
  const revisionId = revision === undefined ? fix.currentRevisionId : await proofedRevisionId(fix.id, revision, knex);
  if (revisionId === null)
    return {
      ok: false,
      code: 'bad_request',
      message: 'No such revision.',
      fields: { revision: [`The fix has no proofed revision r${revision}.`] },
    };
  await knex('job_sheet_fixes')
    .insert({ job_sheet_id: id, fix_id: fix.id, revision_id: revisionId })
    .onConflict(['job_sheet_id', 'fix_id'])
    .merge(['revision_id']);
  await knex('job_sheets').where({ id }).update({ updated_at: knex.fn.now() });
  return { ok: true, value: id };
}

export async function removeFixFromJob(ownerId: number, id: number, fixSlug: string): Promise<boolean> {
  const knex = db();
  if (!(await knex('job_sheets').where({ id, owner_id: ownerId }).first('id'))) return false;
  const removed = await knex('job_sheet_fixes')
    .where('job_sheet_id', id)
    .whereIn('fix_id', knex('fixes').where('slug', fixSlug).select('id'))
    .delete();
  return removed > 0;
}

/** Live fixes for the job's machine and its chassis family: the quick picks when applying a fix. */
export async function fixChoicesFor(machine: JobMachine | null): Promise<{ slug: string; title: string; revisionNumber: number }[]> {
  if (!machine) return [];
  const knex = db();
  const rows = await knex('fixes as f')
    .join('revisions as r', 'r.id', 'f.current_revision_id')
    .whereNull('f.deleted_at')
    .whereNull('f.hidden_at')
    .where((q) => {
      q.whereIn('f.id', knex('fix_machines').where('machine_id', machine.id).select('fix_id'));
      if (machine.chassisFamilyId !== null)
        q.orWhereIn('f.id', knex('fix_chassis').where('chassis_family_id', machine.chassisFamilyId).select('fix_id'));
    })
    .orderBy('r.title')
    .select('f.slug', 'r.title', 'r.number');
  return rows.map((r) => ({ slug: r.slug, title: r.title, revisionNumber: r.number }));
}

export interface InvoiceLine {
  kind: 'labour' | 'part' | 'repair_notes' | 'fix';
  description: string;
  quantity: number;
  unit: string;
  link: string;
}

/** Lines to paste or import into an invoicing program: labour, parts, and the customer's note links. */
export async function invoiceLinesFor(
  ownerId: number,
  id: number,
): Promise<{ jobSheetId: number; customerRef: string; lines: InvoiceLine[] } | null> {
  const job = await getJobSheet(ownerId, id);
  if (!job) return null;
  const lines: InvoiceLine[] = [];
  if (job.labourMinutes > 0)
    lines.push({ kind: 'labour', description: 'Labour', quantity: Math.round((job.labourMinutes / 60) * 100) / 100, unit: 'h', link: '' });
  for (const part of job.partsUsed) {
    const what = [part.kind.replace(/_/g, ' '), part.value, part.rating].filter((t) => t !== '').join(' ');
    lines.push({ kind: 'part', description: part.ref ? `${what} (${part.ref})` : what, quantity: part.quantity, unit: 'pcs', link: '' });
  }
  const notes = (await listOwnNotes(ownerId, id)).filter((n) => n.revokedAt === null);
  for (const note of notes)
    lines.push({
      kind: 'repair_notes',
      description: `Repair notes: ${note.fixTitle} (r${note.revisionNumber})`,
      quantity: 1,
      unit: '',
      link: note.url,
    });
  for (const fix of job.fixes.filter((f) => !notes.some((n) => n.fixSlug === f.slug))) {
    lines.push({
      kind: 'fix',
      description: `Repair followed: ${fix.title} (r${fix.revisionNumber})`,
      quantity: 1,
      unit: '',
      link: new URL(fix.permalink, config().PUBLIC_ORIGIN).href,
    });
  }
  return { jobSheetId: job.id, customerRef: job.customerRef, lines };
}

export const jobSheetIdSchema = z.coerce.number().int().positive().max(2_147_483_647);

/** A sheet that does not exist, is someone else's, or has a malformed number: all answered alike. */
export const jobSheetMissing = refuse('not_found', 'You have no job sheet with that number.');

/** The signed-in owner and the sheet number of a job sheet endpoint, or why not. */
export function jobSheetRequest(user: SessionUser | null | undefined, rawId: string | undefined): Outcome<{ ownerId: number; id: number }> {
  if (!user) return refuse('unauthorised', 'Sign in to use your job sheets.');
  if (!can(user, 'own_job_sheets')) return refuse('forbidden', 'Confirm your e-mail address before you keep job sheets.');
  const id = jobSheetIdSchema.safeParse(rawId);
  // A malformed number is as unknown as someone else's sheet.
  if (!id.success) return jobSheetMissing;
  return { ok: true, value: { ownerId: user.id, id: id.data } };
}
