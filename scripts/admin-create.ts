// `npm run admin:create -- --email x@y --name "..." [--password "..."]`: creates or promotes an admin.
// Without --password it prints a one-time link to choose one (valid one hour).
import { parseArgs } from 'node:util';
import { z } from 'zod';
import { readConfig } from '../src/server/core/config.ts';
import { displayNameSchema, emailSchema, newPasswordSchema } from '../src/lib/schemas/account-fields.ts';
import { db, closeDb } from '../src/server/core/db.ts';
import { writeAudit } from '../src/server/core/audit.ts';
import { hashPassword } from '../src/server/auth/passwords.ts';
import { passwordWeaknesses } from '../src/server/auth/password-strength.ts';
import { issueToken } from '../src/server/auth/user-tokens.ts';
import { findUserByEmail, roleOf } from '../src/server/auth/users.ts';
import { ensureDatabase } from './lib/prepare.ts';

const argsSchema = z.object({ email: emailSchema, name: displayNameSchema, password: newPasswordSchema.optional() });

function fail(lines: string[]): never {
  console.error(lines.join('\n'));
  process.exit(1);
}

function readArgs(): z.infer<typeof argsSchema> {
  let values: Record<string, string | boolean | undefined>;
  try {
    ({ values } = parseArgs({
      options: { email: { type: 'string' }, name: { type: 'string' }, password: { type: 'string' } },
      strict: true,
    }));
  } catch (error) {
    fail([
      `admin:create: ${error instanceof Error ? error.message : String(error)}`,
      'Usage: npm run admin:create -- --email you@example.org --name "Your Name" [--password "..."]',
    ]);
  }
  const parsed = argsSchema.safeParse(values);
  if (!parsed.success)
    fail(['admin:create: the arguments are not valid:', ...parsed.error.issues.map((i) => `  --${i.path.join('.')}: ${i.message}`)]);
  if (parsed.data.password) {
    const weaknesses = passwordWeaknesses(parsed.data.password, [parsed.data.name, parsed.data.email]);
    if (weaknesses.length > 0) fail(['admin:create: --password is refused:', ...weaknesses.map((w) => `  ${w}`)]);
  }
  return parsed.data;
}

/** Creates the account or raises it to admin; confirmed, since whoever runs this controls the server. */
async function makeAdmin(email: string, name: string): Promise<{ id: number; created: boolean }> {
  return db().transaction(async (trx) => {
    const existing = await findUserByEmail(email, trx);
    if (existing) {
      await trx('users')
        .where({ id: existing.id })
        .update({ role: 'admin', suspended_at: null, suspended_reason: null, emailVerified: existing.emailVerified ?? trx.fn.now() });
      await writeAudit(
        {
          actorId: null,
          action: 'user.role_change',
          subjectType: 'user',
          subjectId: existing.id,
          detail: { before: { role: roleOf(existing) }, after: { role: 'admin' }, via: 'admin:create' },
        },
        trx,
      );
      return { id: existing.id, created: false };
    }
    const [row] = await trx('users').insert({ email, name, role: 'admin', emailVerified: trx.fn.now() }).returning<{ id: number }[]>('id');
    if (!row) throw new Error('the new account was not created');
    await writeAudit(
      {
        actorId: null,
        action: 'user.create_admin',
        subjectType: 'user',
        subjectId: row.id,
        detail: { after: { role: 'admin' }, via: 'admin:create' },
      },
      trx,
    );
    return { id: row.id, created: true };
  });
}

const args = readArgs();
const config = readConfig();
await ensureDatabase(process.env);
try {
  const { id, created } = await makeAdmin(args.email, args.name);
  console.log(
    created ? `Created admin account ${args.email} (id ${id}).` : `${args.email} (id ${id}) is now an admin; its name was left as it was.`,
  );
  if (args.password) {
    await db()('users')
      .where({ id })
      .update({ password_hash: await hashPassword(args.password), sessions_valid_after: new Date() });
    console.log('The password is set. Sign in at', new URL('/sign-in', config.PUBLIC_ORIGIN).href);
  } else {
    const token = await issueToken(id, 'reset_password');
    console.log('Choose the password here (the link works once, within one hour):');
    console.log(`  ${new URL(`/reset/password?token=${token}`, config.PUBLIC_ORIGIN).href}`);
  }
} catch (error) {
  fail([
    `admin:create: ${error instanceof Error ? error.message : String(error)}`,
    'Is the database migrated? `npm start` or `npm run db:migrate` prepares it.',
  ]);
} finally {
  await closeDb();
}
