// Moving a writer's revision along: submit (409 on a stale base, with a field merge when the changes do not overlap), withdraw, and amend a returned or waiting revision.
import type { Knex } from 'knex';
import { can } from '@/lib/permissions';
import { submissionIssues } from '@/lib/schemas/fix-draft';
import { db } from '../core/db';
import { insertDraftRow, ownDraft, saveDraft, writeRevisionContent, type DraftSaved } from './drafts';
import { writeAudit } from '../proofing/audit';
import { notifyAuthorOf } from '../proofing/mail';
import { issuesToFields, refuse, succeed, type Outcome, type Writer } from '../http/result';
import { loadRevision, type RevisionRecord } from './revisions';
import { mergeRevisions } from './merge';

export interface Submitted {
  revision: RevisionRecord;
  /** The revision this one replaced (withdrawn with a note), when it was an amendment of a waiting one. */
  replaced: number | null;
}

/** Withdraws the waiting revision an amendment replaces, with a note saying into what. */
async function replaceAmended(
  trx: Knex.Transaction,
  writer: Writer,
  amendedId: number,
  newNumber: number,
): Promise<Outcome<RevisionRecord | null>> {
  const amended = await loadRevision(trx, amendedId);
  if (!amended || amended.state !== 'submitted') return succeed(null);
  const byModerator = amended.authorId !== writer.id;
  if (byModerator && !can(writer, 'moderate')) return refuse('forbidden', 'Only a moderator may amend someone else’s revision.');
  const note = byModerator ? `Amended by a moderator into r${newNumber}.` : `Replaced by its author with r${newNumber}.`;
  await trx('revisions').where({ id: amendedId }).update({ state: 'withdrawn', withdrawn_at: trx.fn.now(), proof_note: note });
  await writeAudit(trx, {
    actorId: writer.id,
    action: 'revision.amend',
    subjectType: 'revision',
    subjectId: amendedId,
    detail: { into: newNumber, byModerator },
  });
  return succeed(byModerator ? amended : null);
}

/**
 * Submits the writer's draft for proofing. With `values` the draft is saved first, so the last keystrokes are in.
 * Refuses with the field messages when it is not ready, and with 409 and both versions when the fix went live with
 * another revision since the draft's base.
 */
export async function submitDraft(writer: Writer, revisionId: number, input: { values?: unknown } = {}): Promise<Outcome<Submitted>> {
  if (input.values !== undefined) {
    const saved = await saveDraft(writer, revisionId, { values: input.values });
    if (!saved.ok) return saved;
  }
  const knex = db();
  let amendedOriginal: RevisionRecord | null = null;
  const outcome = await knex.transaction(async (trx): Promise<Outcome<Submitted>> => {
    const draft = await ownDraft(trx, writer, revisionId, { lock: true });
    if (!draft.ok) return draft;
    const fix = await trx('fixes').where({ id: draft.value.fixId }).forUpdate().first('current_revision_id', 'locked_at');
    if (!can(writer, 'write_fix', { locked: fix.locked_at !== null }))
      return refuse('forbidden', 'This fix is locked by a moderator and takes no new revisions for now. Your draft is kept.');
    const mine = await loadRevision(trx, revisionId);
    if (!mine) return refuse('not_found', 'There is no such draft among yours.');
    const issues = submissionIssues(mine.values);
    // Fields the draft holds as typed are stored empty; their own message says what to fix, and replaces any other.
    for (const [path, field] of Object.entries(mine.held)) {
      const held = issues.filter((issue) => issue.path.join('.') === path);
      for (const issue of held) issues.splice(issues.indexOf(issue), 1);
      issues.push({ path: [path], message: field.message });
    }
    // Readers are shown renditions: a photo still being made (or that failed) cannot go to the desk yet.
    for (const photo of mine.photos.filter((p) => p.state !== 'ready')) {
      const message =
        photo.state === 'pending'
          ? `The photo “${photo.alt}” is still being processed; submit again in a moment.`
          : `The photo “${photo.alt}” could not be processed; remove it or upload it again.`;
      issues.push({ path: ['photoIds'], message });
    }
    if (issues.length)
      return refuse(
        'bad_request',
        'The revision is not ready to submit yet; see the marked fields. Your draft is saved.',
        issuesToFields(issues),
      );
    if (mine.baseRevisionId !== fix.current_revision_id) {
      const live = fix.current_revision_id ? await loadRevision(trx, fix.current_revision_id) : null;
      const base = mine.baseRevisionId ? await loadRevision(trx, mine.baseRevisionId) : null;
      const merge = base && live ? mergeRevisions(base.values, live.values, mine.values) : null;
      return refuse(
        'conflict',
        merge?.values
          ? 'The fix changed since you started: another revision went live. Your changes and its changes are in different fields, so they can be combined: check the combined text, then submit again.'
          : 'The fix changed since you started: another revision went live. Both versions are below; carry your text over onto the live one, then submit again.',
        undefined,
        { yours: mine, live, merge },
      );
    }
    let replaced: number | null = null;
    if (mine.amendsRevisionId) {
      const result = await replaceAmended(trx, writer, mine.amendsRevisionId, mine.number);
      if (!result.ok) return result;
      amendedOriginal = result.value;
      replaced = result.value ? result.value.id : null;
    }
    await trx('revisions').where({ id: revisionId }).update({ state: 'submitted', submitted_at: trx.fn.now() });
    await writeAudit(trx, {
      actorId: writer.id,
      action: 'revision.submit',
      subjectType: 'revision',
      subjectId: revisionId,
      detail: { fixId: mine.fixId, number: mine.number },
    });
    const revision = await loadRevision(trx, revisionId);
    return succeed({ revision: revision!, replaced });
  });
  if (outcome.ok && amendedOriginal) {
    const original: RevisionRecord = amendedOriginal;
    await notifyAuthorOf(original.authorId, {
      authorName: original.authorName,
      outcome: 'amended',
      fixTitle: original.values.title,
      revisionNumber: original.number,
      amendedInto: outcome.value.revision.number,
      note: null,
      path: '/write/mine',
    });
  }
  return outcome;
}

/** An author takes back a revision that waits for proofing; it stays in their list, withdrawn. */
export async function withdrawRevision(writer: Writer, revisionId: number): Promise<Outcome<null>> {
  const knex = db();
  return knex.transaction(async (trx): Promise<Outcome<null>> => {
    const row = await trx('revisions').where({ id: revisionId }).forUpdate().first('author_id', 'state');
    if (!row || row.author_id !== writer.id) return refuse('not_found', 'There is no such revision among yours.');
    if (row.state !== 'submitted')
      return refuse('conflict', `This revision is ${row.state}; only a revision waiting for proofing can be withdrawn.`);
    await trx('revisions')
      .where({ id: revisionId })
      .update({ state: 'withdrawn', withdrawn_at: trx.fn.now(), proof_note: 'Withdrawn by its author.' });
    await writeAudit(trx, { actorId: writer.id, action: 'revision.withdraw', subjectType: 'revision', subjectId: revisionId });
    return succeed(null);
  });
}

/**
 * Starts a draft that continues a revision, which itself stays unchanged: the author's own returned (or still
 * waiting) revision, or, for a moderator, someone else's waiting revision. The draft keeps the same base.
 */
export async function amendRevision(writer: Writer, revisionId: number): Promise<Outcome<DraftSaved>> {
  const knex = db();
  const original = await loadRevision(knex, revisionId);
  if (!original) return refuse('not_found', 'There is no such revision.');
  const own = original.authorId === writer.id;
  const allowed = own
    ? original.state === 'returned' || original.state === 'submitted'
    : original.state === 'submitted' && can(writer, 'moderate');
  if (!allowed) {
    return refuse(
      own ? 'conflict' : 'forbidden',
      own
        ? `This revision is ${original.state}; only a returned or waiting revision can be amended.`
        : 'Only a moderator may amend someone else’s revision, and only while it waits for proofing.',
    );
  }
  if (!can(writer, 'write_fix', { locked: original.fixLocked }))
    return refuse('forbidden', 'This fix is locked by a moderator and takes no new revisions for now.');
  const existing = await knex('revisions').where({ fix_id: original.fixId, author_id: writer.id, state: 'draft' }).first('id');
  if (existing)
    return refuse('conflict', 'You already have a draft of this fix; finish or discard it first.', undefined, { draftId: existing.id });
  const id = await knex.transaction(async (trx) => {
    const draftId = await insertDraftRow(trx, {
      fixId: original.fixId,
      authorId: writer.id,
      baseRevisionId: original.baseRevisionId,
      amendsRevisionId: original.id,
    });
    await writeRevisionContent(trx, draftId, {
      ...original.values,
      editSummary: own ? original.values.editSummary : `Moderator's amendment of r${original.number}.`,
    });
    return draftId;
  });
  const revision = await loadRevision(knex, id);
  return succeed({ revision: revision!, baseIsStale: revision!.baseRevisionId !== revision!.liveRevisionId });
}
