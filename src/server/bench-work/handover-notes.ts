// Hand-over notes: a customer-facing page pinned to one proofed revision, behind a short random code.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { refuse, succeed, type Failure, type Outcome } from '../http/result';
import { config } from '../core/config';
import { liveFixBySlug, proofedRevisionId } from './bench-reports';
import { generateHandoverCode, normaliseHandoverCode } from '@/lib/handover-code';
import type { Caution, CautionKind } from '@/lib/schemas/revision';
import { fixRefFromText, formNumber, formText, type FormFields } from '@/lib/form-fields';
import { type HandoverNoteData, type HandoverNotePatch } from '@/lib/schemas/handover-note';
import { type JobStatus } from '@/lib/schemas/job-sheet';

export interface NoteAuthor {
  id: number;
  shopName: string | null;
}

export function noteUrl(code: string): string {
  return new URL(`/n/${code}`, config().PUBLIC_ORIGIN).href;
}

/** The one line a shop pastes into any invoicing program. */
export function invoiceLine(code: string): string {
  return `Repair notes: ${noteUrl(code)}`;
}

/** Created (the note's code under `code`), or the shared refusal. */
export type CreateNoteResult = { ok: true; code: string } | Failure;

const MAX_CODE_ATTEMPTS = 5;

export async function createHandoverNote(author: NoteAuthor, data: HandoverNoteData): Promise<CreateNoteResult> {
  const knex = db();
  const fix = await liveFixBySlug(data.fix, knex);
  if (!fix) return { ok: false, code: 'not_found', message: `No fix "${data.fix}".` };
  const revisionId = data.revision === undefined ? fix.currentRevisionId : await proofedRevisionId(fix.id, data.revision, knex);
  if (revisionId === null) {
    return {
      ok: false,
      code: 'bad_request',
      message: 'A note can only point at a proofed revision.',
      fields: { revision: [`The fix has no proofed revision r${data.revision}.`] },
    };
  }
  if (data.jobSheetId !== null && !(await knex('job_sheets').where({ id: data.jobSheetId, owner_id: author.id }).first('id'))) {
    return {
      ok: false,
      code: 'bad_request',
      message: 'That job sheet is not one of yours.',
      fields: { jobSheetId: ['Choose one of your own job sheets.'] },
    };
  }
  const row = {
    fix_id: fix.id,
    revision_id: revisionId,
    member_id: author.id,
    job_sheet_id: data.jobSheetId,
    include_job_details: data.jobSheetId !== null && data.includeJobDetails,
    shop_name: data.shopName ?? author.shopName ?? '',
    message: data.message,
    parts_replaced: JSON.stringify(data.partsReplaced),
    warranty: data.warranty,
  };
  for (let attempt = 1; ; attempt++) {
    const code = generateHandoverCode();
    try {
      await knex('handover_notes').insert({ ...row, code });
      return { ok: true, code };
    } catch (error) {
      // A collision on the unique code is astronomically rare but possible: draw again.
      if (!isCodeCollision(error) || attempt >= MAX_CODE_ATTEMPTS) throw error;
    }
  }
}

function isCodeCollision(error: unknown): boolean {
  const e = error as { code?: string; constraint?: string };
  return e.code === '23505' && (e.constraint ?? '').includes('code');
}

export interface JobDetailsForCustomer {
  machine: string | null;
  serialNumber: string;
  reportedSymptom: string;
  findings: string;
  outcome: string;
  status: JobStatus;
  bookedInAt: Date;
}

export interface PublicNote {
  code: string;
  createdAt: Date;
  shopName: string;
  message: string;
  partsReplaced: string[];
  warranty: string;
  fix: {
    slug: string;
    title: string;
    revisionNumber: number;
    permalink: string;
    symptoms: string[];
    cause: string;
    cautionKinds: CautionKind[];
    /** False when the fix has been hidden or removed since: the note still stands, the link does not. */
    readable: boolean;
    /** True when the fix has a newer live revision than the one the repair followed. */
    hasNewerRevision: boolean;
  };
  /** Only when the member chose to include it and the job sheet still exists. */
  job: JobDetailsForCustomer | null;
}

export type PublicNoteLookup =
  { state: 'found'; note: PublicNote } | { state: 'revoked'; code: string; revokedAt: Date } | { state: 'not_found' };

export async function findPublicNote(input: string): Promise<PublicNoteLookup> {
  const code = normaliseHandoverCode(input);
  if (!code) return { state: 'not_found' };
  const knex = db();
  const row = await noteQuery(knex).where('n.code', code).first();
  if (!row) return { state: 'not_found' };
  if (row.revoked_at) return { state: 'revoked', code, revokedAt: row.revoked_at };
  const job = row.include_job_details && row.job_sheet_id ? await jobDetails(knex, row.job_sheet_id) : null;
  return { state: 'found', note: toPublicNote(row, job) };
}

function noteQuery(knex: Knex): Knex.QueryBuilder {
  return knex('handover_notes as n')
    .join('fixes as f', 'f.id', 'n.fix_id')
    .join('revisions as r', 'r.id', 'n.revision_id')
    .leftJoin('revisions as cur', 'cur.id', 'f.current_revision_id')
    .select(
      'n.*',
      'f.slug',
      'f.deleted_at as fix_deleted_at',
      'f.hidden_at as fix_hidden_at',
      'r.number as revision_number',
      'r.title',
      'r.symptoms',
      'r.cause',
      'r.cautions',
      'cur.number as live_number',
    );
}

async function jobDetails(knex: Knex, jobSheetId: number): Promise<JobDetailsForCustomer | null> {
  const job = await knex('job_sheets as j')
    .leftJoin('machines as m', 'm.id', 'j.machine_id')
    .leftJoin('makers as mk', 'mk.id', 'm.maker_id')
    .where('j.id', jobSheetId)
    .first('j.*', 'm.model_number', 'mk.name as maker_name');
  if (!job) return null;
  return {
    machine: job.model_number ? `${job.maker_name} ${job.model_number}` : null,
    serialNumber: job.serial_number,
    reportedSymptom: job.reported_symptom,
    findings: job.findings,
    outcome: job.outcome,
    status: job.status,
    bookedInAt: job.booked_in_at,
  };
}

// The row comes from noteQuery; its columns are read by name.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
function toPublicNote(row: any, job: JobDetailsForCustomer | null): PublicNote {
  const cautions = row.cautions as Caution[];
  return {
    code: row.code,
    createdAt: row.created_at,
    shopName: row.shop_name,
    message: row.message,
    partsReplaced: row.parts_replaced,
    warranty: row.warranty,
    fix: {
      slug: row.slug,
      title: row.title,
      revisionNumber: row.revision_number,
      permalink: `/fixes/${row.slug}/r/${row.revision_number}`,
      symptoms: row.symptoms,
      cause: row.cause,
      cautionKinds: [...new Set(cautions.map((c) => c.kind))],
      readable: row.fix_deleted_at === null && row.fix_hidden_at === null,
      hasNewerRevision: typeof row.live_number === 'number' && row.live_number > row.revision_number,
    },
    job,
  };
}

export interface OwnNote {
  code: string;
  url: string;
  invoiceLine: string;
  createdAt: Date;
  revokedAt: Date | null;
  shopName: string;
  fixSlug: string;
  fixTitle: string;
  revisionNumber: number;
  jobSheetId: number | null;
  includeJobDetails: boolean;
  message: string;
  partsReplaced: string[];
  warranty: string;
  /** Counts every change: the ETag and If-Match of the API. */
  version: number;
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any
function toOwnNote(row: any): OwnNote {
  return {
    code: row.code,
    url: noteUrl(row.code),
    invoiceLine: invoiceLine(row.code),
    createdAt: row.created_at,
    revokedAt: row.revoked_at,
    shopName: row.shop_name,
    fixSlug: row.slug,
    fixTitle: row.title,
    revisionNumber: row.revision_number,
    jobSheetId: row.job_sheet_id,
    includeJobDetails: row.include_job_details,
    message: row.message,
    partsReplaced: row.parts_replaced,
    warranty: row.warranty,
    version: row.version,
  };
}

/** The member's notes, newest first; optionally only those made from one job sheet. */
export async function listOwnNotes(memberId: number, jobSheetId?: number): Promise<OwnNote[]> {
  const q = noteQuery(db())
    .where('n.member_id', memberId)
    .orderBy([
      { column: 'n.created_at', order: 'desc' },
      { column: 'n.id', order: 'desc' },
    ]);
  if (jobSheetId !== undefined) q.where('n.job_sheet_id', jobSheetId);
  return (await q).map(toOwnNote);
}

/** One of the member's notes; another member's code answers null, exactly like an unknown one. */
export async function getOwnNote(memberId: number, input: string): Promise<OwnNote | null> {
  const code = normaliseHandoverCode(input);
  if (!code) return null;
  const row = await noteQuery(db()).where({ 'n.code': code, 'n.member_id': memberId }).first();
  return row ? toOwnNote(row) : null;
}

/**
 * Changes what the customer reads beside the fix (message, parts, warranty, shop name, job details shown). With
 * `expectedVersion` (If-Match) only if nobody changed the note since; otherwise a 412 carrying the current note.
 */
export async function updateOwnNote(
  memberId: number,
  input: string,
  patch: HandoverNotePatch,
  expectedVersion?: number,
): Promise<Outcome<OwnNote>> {
  const code = normaliseHandoverCode(input);
  const missing = refuse('not_found', 'You have no hand-over note with that code.');
  if (!code) return missing;
  const knex = db();
  const changes: Record<string, unknown> = {};
  if (patch.message !== undefined) changes.message = patch.message;
  if (patch.warranty !== undefined) changes.warranty = patch.warranty;
  if (patch.shopName !== undefined) changes.shop_name = patch.shopName ?? '';
  if (patch.includeJobDetails !== undefined) changes.include_job_details = patch.includeJobDetails;
  if (patch.partsReplaced !== undefined) changes.parts_replaced = JSON.stringify(patch.partsReplaced);
  const write = knex('handover_notes').where({ code, member_id: memberId });
  if (expectedVersion !== undefined) write.where({ version: expectedVersion });
  // An empty change still counts as a write, so a stale If-Match is refused the same way.
  const updated = await write.update(Object.keys(changes).length > 0 ? changes : { version: knex.raw('version') });
  const note = await getOwnNote(memberId, code);
  if (!note) return missing;
  if (updated === 0)
    return refuse(
      'precondition_failed',
      `The note changed since you read it: it is now version ${note.version}. Read it again, merge your change and send it with If-Match: "v${note.version}".`,
      undefined,
      { current: note },
    );
  return succeed(note);
}

export type RevokeResult = 'revoked' | 'already_revoked' | 'not_found';

export async function revokeNote(memberId: number, input: string): Promise<RevokeResult> {
  const code = normaliseHandoverCode(input);
  if (!code) return 'not_found';
  const knex = db();
  const updated = await knex('handover_notes')
    .where({ code, member_id: memberId })
    .whereNull('revoked_at')
    .update({ revoked_at: knex.fn.now() });
  if (updated > 0) return 'revoked';
  return (await knex('handover_notes').where({ code, member_id: memberId }).first('id')) ? 'already_revoked' : 'not_found';
}

/** Reads the note form: one part per line, the job details box ticked or not, a blank shop name kept blank. */
export function handoverNoteFromForm(form: FormFields): Record<string, unknown> {
  const jobSheetId = formNumber(form, 'jobSheetId');
  // The fix may be pasted as a link; a revision number typed in the form wins over one in the link.
  const ref = fixRefFromText(formText(form, 'fix'));
  return {
    fix: ref?.slug ?? formText(form, 'fix'),
    revision: formNumber(form, 'revision') ?? ref?.revision,
    jobSheetId: jobSheetId ?? null,
    includeJobDetails: formText(form, 'includeJobDetails') !== undefined,
    // The form shows the account's shop name already: an emptied field means "no shop name".
    shopName: form.get('shopName') === null ? null : (formText(form, 'shopName') ?? ''),
    message: formText(form, 'message') ?? '',
    partsReplaced: (formText(form, 'partsReplaced') ?? '')
      .split(/\r?\n/)
      .map((line) => line.trim())
      .filter((line) => line !== ''),
    warranty: formText(form, 'warranty') ?? '',
  };
}
