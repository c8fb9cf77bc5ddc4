// Auth.js configuration (auth-astro): password sign-in against our users table, JWT session cookies.
// The role is read from the database on every request by the middleware, never trusted from the token.
import Credentials from '@auth/core/providers/credentials';
import { defineConfig } from 'auth-astro';
import { z } from 'zod';
import { verifyPassword } from './src/server/auth/passwords';
import { db } from './src/server/db';

const credentialsSchema = z.object({ email: z.string().trim().toLowerCase().pipe(z.email()), password: z.string().min(1).max(1024) });

export default defineConfig({
  // Read at run time: values through import.meta.env would be frozen into the build.
  secret: process.env.AUTH_SECRET,
  trustHost: true,
  session: { strategy: 'jwt', maxAge: 60 * 60 * 24 * 14 },
  providers: [
    Credentials({
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(raw) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const user = await db()('users').where({ email: parsed.data.email }).whereNull('deleted_at').first('id', 'name', 'email', 'password_hash', 'suspended_at');
        if (!user?.password_hash || user.suspended_at) return null;
        if (!(await verifyPassword(user.password_hash, parsed.data.password))) return null;
        return { id: String(user.id), name: user.name, email: user.email };
      },
    }),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user?.id) token.sub = user.id;
      return token;
    },
  },
});
