// Who may do what: the one permission matrix, asked as can(user, action, resource?) everywhere.

export const roles = ['member', 'editor', 'moderator', 'admin'] as const;
export type Role = (typeof roles)[number];

/** What the middleware puts on Astro.locals for a signed-in, active account. */
export interface SessionUser {
  id: number;
  name: string;
  email: string;
  role: Role;
  /** The e-mail address has been confirmed; only then may the account write. */
  verified: boolean;
  shopName: string | null;
}

/** Anyone asking: a session user, or a fuller record where suspension is known; null when signed out. */
export type Actor = (Pick<SessionUser, 'id' | 'role' | 'verified'> & { suspended?: boolean; deleted?: boolean }) | null | undefined;

export const actions = [
  'read',
  'manage_account',
  'follow',
  'view_dev_mail',
  'read_unproofed_revision',
  'write_fix',
  'report_fix',
  'bench_report',
  'upload_photo',
  'own_job_sheets',
  'write_handover_note',
  'own_order_lists',
  'curate_catalogue',
  'manage_word_families',
  'proof',
  'moderate',
  'lock_fix',
  'hide_fix',
  'suspend_user',
  'view_audit_log',
  'manage_users',
  'manage_settings',
] as const;
export type Action = (typeof actions)[number];

/** Facts about the thing acted on, where the answer depends on it. */
export interface Resource {
  /** The author of a revision: nobody proofs their own. */
  authorId?: number;
  /** The owner of a private record (job sheet, order list, hand-over note). */
  ownerId?: number;
  /** A locked fix takes new revisions from moderators and admins only. */
  locked?: boolean;
  /** The account being suspended or given a role. */
  subject?: { id: number; role: Role };
}

/** The level at which each action opens; anonymous and unverified levels come first. */
type Level = 'anyone' | 'account' | 'verified' | Role;

const opensAt: Record<Action, Level> = {
  read: 'anyone',
  // The sink only exists outside production (its pages answer 404 there), and a new member must read
  // their confirmation mail before they can sign in.
  view_dev_mail: 'anyone',
  manage_account: 'account',
  // Following and the notification list are personal and in-app; mail goes only to confirmed addresses.
  follow: 'account',
  // Checked per revision: its author, or a moderator (see resourceAllows).
  read_unproofed_revision: 'account',
  write_fix: 'verified',
  report_fix: 'verified',
  bench_report: 'verified',
  upload_photo: 'verified',
  own_job_sheets: 'verified',
  write_handover_note: 'verified',
  own_order_lists: 'verified',
  curate_catalogue: 'editor',
  manage_word_families: 'editor',
  proof: 'moderator',
  moderate: 'moderator',
  lock_fix: 'moderator',
  hide_fix: 'moderator',
  suspend_user: 'moderator',
  view_audit_log: 'moderator',
  manage_users: 'admin',
  manage_settings: 'admin',
};

const roleRank: Record<Role, number> = { member: 0, editor: 1, moderator: 2, admin: 3 };

/** A suspended or deleted account counts as signed out. */
function activeActor(user: Actor): Exclude<Actor, null | undefined> | null {
  if (!user || user.suspended || user.deleted) return null;
  return user;
}

function reachesLevel(user: Exclude<Actor, null | undefined> | null, level: Level): boolean {
  if (level === 'anyone') return true;
  if (!user) return false;
  if (level === 'account') return true;
  // Every write starts at a confirmed address, whatever the role.
  if (!user.verified) return false;
  if (level === 'verified') return true;
  return roleRank[user.role] >= roleRank[level];
}

/** Rules that depend on the resource, after the role level is reached. */
function resourceAllows(user: Exclude<Actor, null | undefined>, action: Action, resource: Resource): boolean {
  switch (action) {
    case 'proof':
      return resource.authorId === undefined || resource.authorId !== user.id;
    case 'read_unproofed_revision':
      // A revision on its way (submitted, returned, withdrawn) is its author's and the moderators' business.
      return resource.authorId === undefined || resource.authorId === user.id || reachesLevel(user, 'moderator');
    case 'write_fix':
      return !resource.locked || roleRank[user.role] >= roleRank.moderator;
    case 'own_job_sheets':
    case 'own_order_lists':
    case 'write_handover_note':
      // Private to their owner: no role reads another member's job sheets.
      return resource.ownerId === undefined || resource.ownerId === user.id;
    case 'suspend_user':
      return subjectBelow(user, resource.subject);
    case 'manage_users':
      // Nobody changes their own role: an admin cannot lock themselves (or the site) out.
      return resource.subject === undefined || resource.subject.id !== user.id;
    default:
      return true;
  }
}

/** Moderators suspend members and editors; admins suspend anyone but themselves. */
function subjectBelow(user: Exclude<Actor, null | undefined>, subject: Resource['subject']): boolean {
  if (!subject) return true;
  if (subject.id === user.id) return false;
  if (user.role === 'admin') return true;
  return roleRank[subject.role] < roleRank.moderator;
}

export function can(user: Actor, action: Action, resource?: Resource): boolean {
  const active = activeActor(user);
  if (!reachesLevel(active, opensAt[action])) return false;
  if (!active || !resource) return true;
  return resourceAllows(active, action, resource);
}

/** Every action this user may take (without a resource): for the navigation and the account API. */
export function allowedActions(user: Actor): Action[] {
  return actions.filter((action) => can(user, action));
}

export function isRole(value: unknown): value is Role {
  return typeof value === 'string' && (roles as readonly string[]).includes(value);
}

export const roleLabels: Record<Role, string> = { member: 'Member', editor: 'Editor', moderator: 'Moderator', admin: 'Admin' };
