// Reading and writing accounts in the users table: lookups, sign-up, profile, password, confirmation.
import type { Knex } from 'knex';
import { db } from '../core/db';
import { isRole, type Role, type SessionUser } from '@/lib/permissions';

export interface UserRow {
  id: number;
  name: string | null;
  email: string;
  emailVerified: Date | null;
  shop_name: string | null;
  password_hash: string | null;
  role: string;
  suspended_at: Date | null;
  suspended_reason: string | null;
  deleted_at: Date | null;
  sessions_valid_after: Date | null;
  created_at: Date;
}

/** Every column but the password hash, for pages and lists. */
export const publicUserColumns = [
  'id',
  'name',
  'email',
  'emailVerified',
  'shop_name',
  'role',
  'suspended_at',
  'suspended_reason',
  'deleted_at',
  'created_at',
] as const;

export function roleOf(row: Pick<UserRow, 'role'>): Role {
  return isRole(row.role) ? row.role : 'member';
}

export function toSessionUser(row: Pick<UserRow, 'id' | 'name' | 'email' | 'role' | 'emailVerified' | 'shop_name'>): SessionUser {
  return {
    id: row.id,
    name: row.name ?? row.email,
    email: row.email,
    role: roleOf(row),
    verified: row.emailVerified !== null,
    shopName: row.shop_name,
  };
}

export async function findUserByEmail(email: string, knex: Knex = db()): Promise<UserRow | undefined> {
  return knex<UserRow>('users').where({ email }).whereNull('deleted_at').first();
}

export async function findUserById(id: number, knex: Knex = db()): Promise<UserRow | undefined> {
  return knex<UserRow>('users').where({ id }).first();
}

export type SessionLookup = { user: SessionUser } | { user: null; reason: 'missing' | 'deleted' | 'suspended' | 'ended' };

/** The account behind a session token, read fresh on every request so role changes and suspensions apply at once. */
export async function loadSessionUser(id: number, signedInAtMs: number | undefined, knex: Knex = db()): Promise<SessionLookup> {
  const row = await knex<UserRow>('users')
    .where({ id })
    .first('id', 'name', 'email', 'role', 'emailVerified', 'shop_name', 'suspended_at', 'deleted_at', 'sessions_valid_after')
    .options({ name: 'session-user' }); // planned once per connection: every signed-in request asks
  if (!row) return { user: null, reason: 'missing' };
  if (row.deleted_at) return { user: null, reason: 'deleted' };
  if (row.suspended_at) return { user: null, reason: 'suspended' };
  // A token issued before the cut-off (a password change, "sign out everywhere") no longer counts.
  if (row.sessions_valid_after && (signedInAtMs ?? 0) < row.sessions_valid_after.getTime()) return { user: null, reason: 'ended' };
  return { user: toSessionUser(row) };
}

export interface NewMember {
  name: string;
  email: string;
  passwordHash: string;
  shopName: string | null;
}

/** Creates a member; null when the address is already taken (a race with another sign-up included). */
export async function createMember(member: NewMember, knex: Knex = db()): Promise<number | null> {
  const rows = await knex('users')
    .insert({ name: member.name, email: member.email, password_hash: member.passwordHash, shop_name: member.shopName, role: 'member' })
    .onConflict(knex.raw('(email)'))
    .ignore()
    .returning<{ id: number }[]>('id');
  return rows[0]?.id ?? null;
}

/** Changes the fields given; a missing field stays as it is. */
export async function updateProfile(id: number, profile: { name?: string; shopName?: string | null }, knex: Knex = db()): Promise<void> {
  const changes = {
    ...(profile.name !== undefined ? { name: profile.name } : {}),
    ...(profile.shopName !== undefined ? { shop_name: profile.shopName } : {}),
  };
  if (Object.keys(changes).length === 0) return;
  await knex('users').where({ id }).whereNull('deleted_at').update(changes);
}

/** The app's clock, like the authAt claim it is compared with: sessions started before this moment end. */
function sessionCutoff(): Date {
  return new Date();
}

/** A new password ends every session issued before it, other browsers included. */
export async function setPassword(id: number, passwordHash: string, knex: Knex = db()): Promise<void> {
  await knex('users').where({ id }).whereNull('deleted_at').update({ password_hash: passwordHash, sessions_valid_after: sessionCutoff() });
}

export async function markVerified(id: number, knex: Knex = db()): Promise<void> {
  await knex('users').where({ id }).whereNull('emailVerified').update({ emailVerified: knex.fn.now() });
}

export async function endAllSessions(id: number, knex: Knex = db()): Promise<void> {
  await knex('users').where({ id }).update({ sessions_valid_after: sessionCutoff() });
  await knex('sessions').where({ userId: id }).delete();
}
