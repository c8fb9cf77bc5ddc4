// What the writing pages hand the editor island: the writer's draft, or where a new one starts (empty, live, restored).
import { can, type SessionUser } from '@/lib/permissions';
import { emptyDraft } from '@/lib/schemas/fix-draft';
import { machinesBySlug } from '../catalogue/lookup';
import { db } from '../core/db';
import { openDraftOf } from './drafts';
import { loadRevision, revisionIdByNumber, type RevisionRecord } from './revisions';
import type { EditorRevisionData, FixEditorProps } from '@/lib/writing/editor-data';

export type EditorPage =
  | { kind: 'editor'; props: FixEditorProps; title: string; waiting: { number: number } | null }
  | { kind: 'redirect'; to: string }
  | { kind: 'not_found' }
  | { kind: 'message'; title: string; text: string; link?: { href: string; label: string } };

/** The record as the island reads it: nothing beyond the writer's own revision and public labels. */
export function editorRevision(record: RevisionRecord): EditorRevisionData {
  return {
    id: record.id,
    number: record.number,
    state: record.state,
    fixSlug: record.fixSlug,
    liveRevisionId: record.liveRevisionId,
    baseRevisionId: record.baseRevisionId,
    baseRevisionNumber: record.baseRevisionNumber,
    authorName: record.authorName,
    updatedAt: record.updatedAt,
    values: record.values,
    held: record.held,
    machines: record.machines,
    chassis: record.chassis,
    photos: record.photos,
  };
}

const yours = { href: '/write/mine', label: 'Your revisions' };

/**
 * While a writer amends a returned revision, the moderator's note stays in view above the form: the line says who
 * returned which revision and quotes the note. Null for any other draft.
 */
export async function returnNoteFor(draft: Pick<RevisionRecord, 'amendsRevisionId' | 'authorId'>): Promise<string | null> {
  if (!draft.amendsRevisionId) return null;
  const returned = await loadRevision(db(), draft.amendsRevisionId);
  if (!returned || returned.state !== 'returned' || returned.authorId !== draft.authorId || !returned.note) return null;
  const who = returned.prooferName ?? 'A moderator';
  return `${who} returned r${returned.number} with this note: “${returned.note}” Your changes here become a new revision that answers it.`;
}

/** `/write`: a new fix, or (`?draft=`) the writer's draft of one; `?symptom=` and `?machine=` prefill a new one. */
export async function newFixEditor(user: SessionUser, url: URL): Promise<EditorPage> {
  const draftParam = url.searchParams.get('draft');
  if (draftParam !== null) {
    const id = /^\d{1,9}$/.test(draftParam) ? Number(draftParam) : 0;
    const record = id ? await loadRevision(db(), id) : null;
    if (!record || record.authorId !== user.id) return { kind: 'not_found' };
    if (record.fixSlug) return { kind: 'redirect', to: `/fixes/${record.fixSlug}/edit` };
    if (record.state !== 'draft') {
      return {
        kind: 'message',
        title: `r${record.number} is ${record.state}`,
        text: 'This revision is no longer a draft, so it cannot change. Your revisions page shows where it stands and lets you amend it.',
        link: yours,
      };
    }
    return {
      kind: 'editor',
      title: 'Write a fix',
      waiting: null,
      props: {
        fixSlug: null,
        draft: editorRevision(record),
        start: { values: record.values, machines: record.machines, chassis: record.chassis, photos: record.photos },
        liveRevisionNumber: null,
        notice: await returnNoteFor(record),
        doneHref: '/write/mine',
      },
    };
  }
  const symptom = (url.searchParams.get('symptom') ?? '').trim().slice(0, 200);
  const machines = await machinesBySlug(url.searchParams.getAll('machine').filter((s) => /^[a-z0-9-]{1,120}$/.test(s)));
  const values = emptyDraft({ symptom, machineIds: machines.map((m) => m.id) });
  const notice =
    symptom || machines.length ? 'Started from your search: check the symptom and the machine, then write what fixed it.' : null;
  return {
    kind: 'editor',
    title: 'Write a fix',
    waiting: null,
    props: {
      fixSlug: null,
      draft: null,
      start: { values, machines, chassis: [], photos: [] },
      liveRevisionNumber: null,
      notice,
      doneHref: '/write/mine',
    },
  };
}

/** `/fixes/:slug/edit`: the writer's open draft of the fix, or a new one from the live revision (or `?from=n`, restored). */
export async function liveFixEditor(user: SessionUser, slug: string, url: URL): Promise<EditorPage> {
  const knex = db();
  const fix = await knex('fixes')
    .where({ slug })
    .whereNull('deleted_at')
    .whereNotNull('current_revision_id')
    .first('id', 'current_revision_id', 'locked_at', 'hidden_at');
  if (!fix || (fix.hidden_at && !can(user, 'hide_fix'))) return { kind: 'not_found' };
  if (!can(user, 'write_fix', { locked: fix.locked_at !== null })) {
    return {
      kind: 'message',
      title: 'This fix is locked',
      text: 'A moderator has locked this fix against edits for now. You can still report a problem with it from the fix page.',
      link: { href: `/fixes/${slug}`, label: 'Back to the fix' },
    };
  }
  const live = await loadRevision(knex, fix.current_revision_id);
  if (!live) return { kind: 'not_found' };
  const waitingRow = await knex('revisions')
    .where({ fix_id: fix.id, author_id: user.id, state: 'submitted' })
    .orderBy('number', 'desc')
    .first('number');
  const waiting = waitingRow ? { number: waitingRow.number as number } : null;
  const base = { fixSlug: slug, liveRevisionNumber: live.number, doneHref: '/write/mine' };
  const title = `Edit: ${live.values.title}`;
  const draft = await openDraftOf(user, fix.id);
  if (draft)
    return {
      kind: 'editor',
      title,
      waiting,
      props: {
        ...base,
        draft: editorRevision(draft),
        start: { values: draft.values, machines: draft.machines, chassis: draft.chassis, photos: draft.photos },
        notice: await returnNoteFor(draft),
      },
    };
  const fromParam = Number(url.searchParams.get('from') ?? '');
  if (Number.isSafeInteger(fromParam) && fromParam >= 1 && fromParam !== live.number) {
    const oldId = await revisionIdByNumber(knex, fix.id, fromParam);
    const old = oldId ? await loadRevision(knex, oldId) : null;
    if (old?.state === 'proofed') {
      const values = { ...old.values, editSummary: `Restores r${old.number} as a new revision.` };
      const notice = `You are restoring r${old.number}. It becomes a new revision on top of the live r${live.number}, and a moderator proofs it like any other; r${live.number} stays in the history.`;
      return {
        kind: 'editor',
        title,
        waiting,
        props: { ...base, draft: null, start: { values, machines: old.machines, chassis: old.chassis, photos: old.photos }, notice },
      };
    }
  }
  return {
    kind: 'editor',
    title,
    waiting,
    props: {
      ...base,
      draft: null,
      start: { values: { ...live.values, editSummary: '' }, machines: live.machines, chassis: live.chassis, photos: live.photos },
      notice: null,
    },
  };
}
