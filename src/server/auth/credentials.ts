// Checks an e-mail address and password for Auth.js's Credentials provider; returns the database user id.
import { randomBytes } from 'node:crypto';
import { CredentialsSignin } from '@auth/core/errors';
import { signInSchema } from '@/lib/schemas/sign-in';
import { hashPassword, verifyPassword } from './passwords';
import { findUserByEmail } from './users';

/** A correct password for a suspended account: said plainly, since only the owner can get this far. */
export class SuspendedSignIn extends CredentialsSignin {
  code = 'suspended';
}

let decoyHash: Promise<string> | undefined;

/** Unknown addresses still cost one argon2 verification, so the answer takes as long either way. */
function decoy(): Promise<string> {
  decoyHash ??= hashPassword(randomBytes(24).toString('base64url'));
  return decoyHash;
}

export async function authorizeCredentials(
  raw: Partial<Record<string, unknown>>,
): Promise<{ id: string; name: string | null; email: string } | null> {
  const parsed = signInSchema.pick({ email: true, password: true }).safeParse(raw);
  if (!parsed.success) return null;
  const { email, password } = parsed.data;
  const user = await findUserByEmail(email);
  if (!user?.password_hash) {
    await verifyPassword(await decoy(), password);
    return null;
  }
  if (!(await verifyPassword(user.password_hash, password))) return null;
  if (user.suspended_at) throw new SuspendedSignIn();
  return { id: String(user.id), name: user.name, email: user.email };
}
