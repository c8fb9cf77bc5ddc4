// Password hashing with argon2id at (at least) OWASP's recommended minimum parameters.
import { hash, verify } from '@node-rs/argon2';

// The package's Algorithm enum is a const enum, which isolated modules cannot read: 2 is Argon2id.
const ARGON2ID = 2;

// OWASP Password Storage Cheat Sheet: argon2id, m = 19 MiB, t = 2, p = 1 as the minimum configuration.
export const ARGON2_OPTIONS = { algorithm: ARGON2ID, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_OPTIONS);
}

export async function verifyPassword(stored: string, password: string): Promise<boolean> {
  try {
    return await verify(stored, password);
  } catch {
    return false;
  }
}
