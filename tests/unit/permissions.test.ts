// The permission matrix, written out in full here so a change to can() has to change this table too.
import { describe, expect, it } from 'vitest';
import { actions, allowedActions, can, type Action, type Actor, type Role } from '@/lib/permissions';

type Who = 'anonymous' | 'unverified' | 'suspended' | Role;

const people: Record<Who, Actor> = {
  anonymous: null,
  unverified: { id: 2, role: 'member', verified: false },
  suspended: { id: 3, role: 'admin', verified: true, suspended: true },
  member: { id: 4, role: 'member', verified: true },
  editor: { id: 5, role: 'editor', verified: true },
  moderator: { id: 6, role: 'moderator', verified: true },
  admin: { id: 7, role: 'admin', verified: true },
};

/** Who may take each action, with no resource given. */
const expected: Record<Action, Who[]> = {
  read: ['anonymous', 'unverified', 'suspended', 'member', 'editor', 'moderator', 'admin'],
  view_dev_mail: ['anonymous', 'unverified', 'suspended', 'member', 'editor', 'moderator', 'admin'],
  manage_account: ['unverified', 'member', 'editor', 'moderator', 'admin'],
  follow: ['unverified', 'member', 'editor', 'moderator', 'admin'],
  read_unproofed_revision: ['unverified', 'member', 'editor', 'moderator', 'admin'],
  write_fix: ['member', 'editor', 'moderator', 'admin'],
  report_fix: ['member', 'editor', 'moderator', 'admin'],
  bench_report: ['member', 'editor', 'moderator', 'admin'],
  upload_photo: ['member', 'editor', 'moderator', 'admin'],
  own_job_sheets: ['member', 'editor', 'moderator', 'admin'],
  write_handover_note: ['member', 'editor', 'moderator', 'admin'],
  own_order_lists: ['member', 'editor', 'moderator', 'admin'],
  curate_catalogue: ['editor', 'moderator', 'admin'],
  manage_word_families: ['editor', 'moderator', 'admin'],
  proof: ['moderator', 'admin'],
  moderate: ['moderator', 'admin'],
  lock_fix: ['moderator', 'admin'],
  hide_fix: ['moderator', 'admin'],
  suspend_user: ['moderator', 'admin'],
  view_audit_log: ['moderator', 'admin'],
  manage_users: ['admin'],
  manage_settings: ['admin'],
};

describe('can', () => {
  it('has an expected row for every action', () => {
    expect(Object.keys(expected).sort()).toEqual([...actions].sort());
  });

  for (const action of actions) {
    it(`lets exactly ${expected[action].join(', ')} ${action}`, () => {
      const allowed = (Object.keys(people) as Who[]).filter((who) => can(people[who], action));
      expect(allowed).toEqual(expected[action]);
    });
  }

  it('treats an undefined user like a signed-out one', () => {
    expect(can(undefined, 'read')).toBe(true);
    expect(can(undefined, 'manage_account')).toBe(false);
  });

  it('treats a deleted account as signed out', () => {
    expect(can({ id: 9, role: 'admin', verified: true, deleted: true }, 'manage_account')).toBe(false);
  });

  it('keeps an unverified editor or moderator from writing until the address is confirmed', () => {
    expect(can({ id: 10, role: 'moderator', verified: false }, 'proof')).toBe(false);
    expect(can({ id: 10, role: 'editor', verified: false }, 'write_fix')).toBe(false);
  });
});

describe('can with a resource', () => {
  const moderator = people.moderator;
  const admin = people.admin;

  it('never lets anyone proof their own revision', () => {
    expect(can(moderator, 'proof', { authorId: 6 })).toBe(false);
    expect(can(moderator, 'proof', { authorId: 4 })).toBe(true);
    expect(can(admin, 'proof', { authorId: 7 })).toBe(false);
  });

  it('keeps job sheets, order lists and hand-over notes to their owner, whatever the role', () => {
    expect(can(people.member, 'own_job_sheets', { ownerId: 4 })).toBe(true);
    expect(can(admin, 'own_job_sheets', { ownerId: 4 })).toBe(false);
    expect(can(moderator, 'own_order_lists', { ownerId: 4 })).toBe(false);
    expect(can(people.member, 'write_handover_note', { ownerId: 5 })).toBe(false);
  });

  it('lets only moderators and admins write to a locked fix', () => {
    expect(can(people.member, 'write_fix', { locked: true })).toBe(false);
    expect(can(people.editor, 'write_fix', { locked: true })).toBe(false);
    expect(can(moderator, 'write_fix', { locked: true })).toBe(true);
    expect(can(people.member, 'write_fix', { locked: false })).toBe(true);
  });

  it('lets moderators suspend members and editors but not moderators, admins or themselves', () => {
    expect(can(moderator, 'suspend_user', { subject: { id: 4, role: 'member' } })).toBe(true);
    expect(can(moderator, 'suspend_user', { subject: { id: 5, role: 'editor' } })).toBe(true);
    expect(can(moderator, 'suspend_user', { subject: { id: 8, role: 'moderator' } })).toBe(false);
    expect(can(moderator, 'suspend_user', { subject: { id: 7, role: 'admin' } })).toBe(false);
    expect(can(moderator, 'suspend_user', { subject: { id: 6, role: 'moderator' } })).toBe(false);
  });

  it('lets admins suspend anyone but themselves', () => {
    expect(can(admin, 'suspend_user', { subject: { id: 11, role: 'admin' } })).toBe(true);
    expect(can(admin, 'suspend_user', { subject: { id: 7, role: 'admin' } })).toBe(false);
  });

  it('keeps an admin from changing their own role', () => {
    expect(can(admin, 'manage_users', { subject: { id: 7, role: 'admin' } })).toBe(false);
    expect(can(admin, 'manage_users', { subject: { id: 4, role: 'member' } })).toBe(true);
  });

  it('shows a revision that is not proofed to its author and to moderators only', () => {
    expect(can(people.member, 'read_unproofed_revision', { authorId: 4 })).toBe(true);
    expect(can(people.member, 'read_unproofed_revision', { authorId: 5 })).toBe(false);
    expect(can(people.editor, 'read_unproofed_revision', { authorId: 4 })).toBe(false);
    expect(can(moderator, 'read_unproofed_revision', { authorId: 4 })).toBe(true);
    expect(can(admin, 'read_unproofed_revision', { authorId: 4 })).toBe(true);
    expect(can(null, 'read_unproofed_revision', { authorId: 4 })).toBe(false);
    // A moderator whose address is unconfirmed has no moderator's reach yet.
    expect(can({ id: 10, role: 'moderator', verified: false }, 'read_unproofed_revision', { authorId: 4 })).toBe(false);
    expect(can(people.suspended, 'read_unproofed_revision', { authorId: 3 })).toBe(false);
  });

  it('refuses a suspended account even with a matching resource', () => {
    expect(can(people.suspended, 'own_job_sheets', { ownerId: 3 })).toBe(false);
  });
});

describe('allowedActions', () => {
  it('lists what a verified member may do, and nothing of the editors', () => {
    const list = allowedActions(people.member);
    expect(list).toContain('write_fix');
    expect(list).not.toContain('curate_catalogue');
  });

  it('lists only reading for a signed-out visitor', () => {
    expect(allowedActions(null)).toEqual(['read', 'view_dev_mail']);
  });
});
