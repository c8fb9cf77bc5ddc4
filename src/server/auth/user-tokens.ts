// Our single-use, expiring tokens for confirming an address, changing it and resetting a password (stored
// only as a hash).
import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import { db } from '../core/db';

export type TokenPurpose = 'verify_email' | 'reset_password' | 'change_email';

/** Confirming an address: 24 hours. Resetting a password: one hour (OWASP Forgot Password Cheat Sheet: short-lived). */
export const tokenLifetimeSeconds: Record<TokenPurpose, number> = {
  verify_email: 24 * 60 * 60,
  reset_password: 60 * 60,
  change_email: 24 * 60 * 60,
};

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** A new token for the user; earlier unused tokens of the same purpose stop working. */
export async function issueToken(
  userId: number,
  purpose: TokenPurpose,
  options: { newEmail?: string; lifetimeSeconds?: number; knex?: Knex } = {},
): Promise<string> {
  const { newEmail = null, lifetimeSeconds = tokenLifetimeSeconds[purpose], knex = db() } = options;
  const token = randomBytes(32).toString('base64url');
  await knex.transaction(async (trx) => {
    await trx('user_tokens').where({ user_id: userId, purpose }).whereNull('used_at').update({ used_at: trx.fn.now() });
    await trx('user_tokens').insert({
      user_id: userId,
      purpose,
      token_hash: hashToken(token),
      new_email: newEmail,
      expires_at: trx.raw(`now() + make_interval(secs => ?)`, [lifetimeSeconds]),
    });
  });
  return token;
}

export type TokenCheck = { ok: true; userId: number; newEmail: string | null } | { ok: false; problem: 'unknown' | 'used' | 'expired' };

async function explain(token: string, purpose: TokenPurpose, knex: Knex): Promise<TokenCheck> {
  const row = await knex('user_tokens')
    .where({ token_hash: hashToken(token), purpose })
    .first<{ used_at: Date | null; expired: boolean } | undefined>('used_at', knex.raw('expires_at <= now() AS expired'));
  if (!row) return { ok: false, problem: 'unknown' };
  if (row.used_at) return { ok: false, problem: 'used' };
  return { ok: false, problem: row.expired ? 'expired' : 'unknown' };
}

/** Whether a token would work, without using it up (to show the new-password form). */
export async function peekToken(token: string, purpose: TokenPurpose, knex: Knex = db()): Promise<TokenCheck> {
  const row = await knex('user_tokens')
    .where({ token_hash: hashToken(token), purpose })
    .whereNull('used_at')
    .where('expires_at', '>', knex.fn.now())
    .first<{ user_id: number; new_email: string | null } | undefined>('user_id', 'new_email');
  return row ? { ok: true, userId: row.user_id, newEmail: row.new_email } : explain(token, purpose, knex);
}

/** Uses a token up in one statement, so two clicks at once cannot both succeed. */
export async function consumeToken(token: string, purpose: TokenPurpose, knex: Knex = db()): Promise<TokenCheck> {
  const [row] = await knex('user_tokens')
    .where({ token_hash: hashToken(token), purpose })
    .whereNull('used_at')
    .where('expires_at', '>', knex.fn.now())
    .update({ used_at: knex.fn.now() })
    .returning<{ user_id: number; new_email: string | null }[]>(['user_id', 'new_email']);
  return row ? { ok: true, userId: row.user_id, newEmail: row.new_email } : explain(token, purpose, knex);
}
