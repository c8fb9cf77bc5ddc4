// Who sees which revision in a fix's history and on its compare page.
import { describe, expect, it } from 'vitest';
import type { Actor } from '@/lib/permissions';
import { isPastDraft, mayReadRevision, type RevisionFacts } from '@/lib/revision-visibility';

const author: Actor = { id: 4, role: 'member', verified: true };
const otherMember: Actor = { id: 5, role: 'member', verified: true };
const editor: Actor = { id: 8, role: 'editor', verified: true };
const moderator: Actor = { id: 6, role: 'moderator', verified: true };
const sent = '2026-12-01T10:00:00.000Z';
const revision = (state: RevisionFacts['state'], submittedAt: string | null = sent): RevisionFacts => ({ state, authorId: 4, submittedAt });

describe('isPastDraft', () => {
  it('counts every state after submission, and not a draft or a draft discarded before it was sent', () => {
    expect(isPastDraft(revision('draft', null))).toBe(false);
    expect(isPastDraft(revision('withdrawn', null))).toBe(false);
    for (const state of ['submitted', 'returned', 'withdrawn', 'proofed'] as const) expect(isPastDraft(revision(state))).toBe(true);
  });
});

describe('mayReadRevision', () => {
  it('shows a proofed revision to everyone, signed in or not', () => {
    for (const viewer of [null, author, otherMember, editor, moderator]) expect(mayReadRevision(viewer, revision('proofed'))).toBe(true);
  });

  it('shows submitted, returned and withdrawn revisions to their author and moderators only', () => {
    for (const state of ['submitted', 'returned', 'withdrawn'] as const) {
      expect(mayReadRevision(author, revision(state)), state).toBe(true);
      expect(mayReadRevision(moderator, revision(state)), state).toBe(true);
      expect(mayReadRevision(null, revision(state)), state).toBe(false);
      expect(mayReadRevision(otherMember, revision(state)), state).toBe(false);
      expect(mayReadRevision(editor, revision(state)), state).toBe(false);
    }
  });

  it('shows a draft to nobody here, its author and moderators included', () => {
    for (const viewer of [author, moderator]) {
      expect(mayReadRevision(viewer, revision('draft', null))).toBe(false);
      expect(mayReadRevision(viewer, revision('withdrawn', null))).toBe(false);
    }
  });

  it('treats a suspended author as signed out', () => {
    expect(mayReadRevision({ id: 4, role: 'member', verified: true, suspended: true }, revision('returned'))).toBe(false);
  });
});
