// Deciding on a waiting revision: proofing it (it goes live) or returning it to its author (with a note).
import type { Knex } from 'knex';
import { can } from '@/lib/permissions';
import { submissionIssues } from '@/lib/schemas/fix-draft';
import { proofNoteSchema } from '@/lib/schemas/proof-note';
import { returnNoteSchema } from '@/lib/schemas/return-note';
import { db } from '../core/db';
import { writeAudit } from './audit';
import { notifyAuthorOf } from './mail';
import { publishRevision } from './publish';
import { issuesToFields, refuse, succeed, type Outcome, type Writer } from '../http/result';
import { loadRevision, type RevisionRecord } from '../writing/revisions';
import { queueProofedNews, recordModeratorReply } from '../notifications/news';

type Decision = 'proof' | 'return';

function revisionFacts(record: RevisionRecord): { id: number; fixId: number; authorId: number; title: string; number: number } {
  return { id: record.id, fixId: record.fixId, authorId: record.authorId, title: record.values.title, number: record.number };
}

/** Locks the revision and its fix and checks the moderator may decide on it now. */
async function decidable(
  trx: Knex.Transaction,
  moderator: Writer,
  revisionId: number,
  decision: Decision,
): Promise<Outcome<RevisionRecord>> {
  const locked = await trx('revisions').where({ id: revisionId }).forUpdate().first('id', 'fix_id');
  if (!locked) return refuse('not_found', 'There is no such revision.');
  await trx('fixes').where({ id: locked.fix_id }).forUpdate().first('id');
  const revision = await loadRevision(trx, revisionId);
  if (!revision) return refuse('not_found', 'There is no such revision.');
  if (revision.state !== 'submitted')
    return refuse('conflict', `This revision is already ${revision.state}; another moderator may have decided on it.`);
  if (!can(moderator, 'proof', { authorId: revision.authorId })) {
    return refuse(
      'forbidden',
      revision.authorId === moderator.id
        ? 'Nobody proofs their own revision: another moderator decides on this one.'
        : 'Only moderators proof revisions.',
    );
  }
  if (decision === 'proof' && revision.baseRevisionId !== revision.liveRevisionId) {
    const live = revision.liveRevisionId ? await loadRevision(trx, revision.liveRevisionId) : null;
    return refuse(
      'conflict',
      'The fix went live with another revision after this one was written. Return it so the author can carry their text over onto the live one.',
      undefined,
      { yours: revision, live },
    );
  }
  return succeed(revision);
}

/** Proofs a waiting revision: it becomes the live text of its fix, the author is told. */
export async function proofRevision(moderator: Writer, revisionId: number, rawNote: unknown = ''): Promise<Outcome<{ slug: string }>> {
  const note = proofNoteSchema.safeParse(rawNote ?? '');
  if (!note.success)
    return refuse('bad_request', 'The note is not valid.', issuesToFields(note.error.issues.map((i) => ({ ...i, path: ['note'] }))));
  const knex = db();
  let record: RevisionRecord | null = null;
  const outcome = await knex.transaction(async (trx): Promise<Outcome<{ slug: string }>> => {
    const checked = await decidable(trx, moderator, revisionId, 'proof');
    if (!checked.ok) return checked;
    record = checked.value;
    const issues = submissionIssues(record.values);
    if (issues.length)
      return refuse('bad_request', 'This revision does not meet the rules for going live; return it with a note.', issuesToFields(issues));
    await trx('revisions')
      .where({ id: revisionId })
      .update({ state: 'proofed', proofer_id: moderator.id, proofed_at: trx.fn.now(), proof_note: note.data || null });
    const published = await publishRevision(trx, record.fixId, revisionId);
    // Followers hear about it from the job queue, and only if this transaction commits.
    await queueProofedNews(trx, revisionId);
    await writeAudit(trx, {
      actorId: moderator.id,
      action: 'revision.proof',
      subjectType: 'revision',
      subjectId: revisionId,
      detail: { fixId: record.fixId, number: record.number },
    });
    return succeed(published);
  });
  if (outcome.ok && record) {
    const proofed: RevisionRecord = record;
    await notifyAuthorOf(proofed.authorId, {
      authorName: proofed.authorName,
      outcome: 'proofed',
      fixTitle: proofed.values.title,
      revisionNumber: proofed.number,
      note: note.data || null,
      path: `/fixes/${outcome.value.slug}`,
    });
    if (note.data) await recordModeratorReply(revisionFacts(proofed), 'proofed', note.data, `/fixes/${outcome.value.slug}`);
  }
  return outcome;
}

/** Returns a waiting revision to its author with a note; it stays unchanged and visible to them. */
export async function returnRevision(moderator: Writer, revisionId: number, rawNote: unknown): Promise<Outcome<null>> {
  const note = returnNoteSchema.safeParse(rawNote ?? '');
  if (!note.success)
    return refuse('bad_request', 'A returned revision needs a note for its author.', { note: note.error.issues.map((i) => i.message) });
  const knex = db();
  let record: RevisionRecord | null = null;
  const outcome = await knex.transaction(async (trx): Promise<Outcome<null>> => {
    const checked = await decidable(trx, moderator, revisionId, 'return');
    if (!checked.ok) return checked;
    record = checked.value;
    await trx('revisions')
      .where({ id: revisionId })
      .update({ state: 'returned', proofer_id: moderator.id, returned_at: trx.fn.now(), proof_note: note.data });
    await writeAudit(trx, {
      actorId: moderator.id,
      action: 'revision.return',
      subjectType: 'revision',
      subjectId: revisionId,
      detail: { note: note.data },
    });
    return succeed(null);
  });
  if (outcome.ok && record) {
    const returned: RevisionRecord = record;
    await notifyAuthorOf(returned.authorId, {
      authorName: returned.authorName,
      outcome: 'returned',
      fixTitle: returned.values.title,
      revisionNumber: returned.number,
      note: note.data,
      path: '/write/mine',
    });
    await recordModeratorReply(revisionFacts(returned), 'returned', note.data, '/write/mine');
  }
  return outcome;
}

/** Where the desk goes after a decision, or why not, with the note as typed in `detail.note`. */
export type DeskDecision = Outcome<{ location: string }>;

/**
 * The revision page's one decision form: a note and two buttons, proof or return. A refusal comes back with the note
 * as typed, so the page shows it again with the message and nothing is lost.
 */
export async function decideFromDesk(moderator: Writer, revisionId: number, fields: Record<string, unknown>): Promise<DeskDecision> {
  const note = typeof fields.note === 'string' ? fields.note : '';
  const decision = fields.decision;
  if (decision !== 'proof' && decision !== 'return')
    return refuse('bad_request', 'Choose “Proof: make it live” or “Return it with this note”.', undefined, { note });
  const outcome =
    decision === 'proof' ? await proofRevision(moderator, revisionId, note) : await returnRevision(moderator, revisionId, note);
  if (outcome.ok) return succeed({ location: decision === 'proof' ? '/proofing?proofed=1' : '/proofing?returned=1' });
  const detail = outcome.fields ? Object.values(outcome.fields).flat() : [];
  const message = [outcome.message, ...detail.filter((line) => line !== outcome.message)].join(' ');
  return refuse(outcome.code, message, undefined, { note });
}
