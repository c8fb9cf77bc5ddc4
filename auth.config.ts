// Auth.js configuration (auth-astro): password sign-in and e-mailed sign-in links, JWT session cookies.
// The role is read from the database on every request by the middleware, never trusted from the token.
import Credentials from '@auth/core/providers/credentials';
import Nodemailer from '@auth/core/providers/nodemailer';
import PostgresAdapter from '@auth/pg-adapter';
import { defineConfig } from 'auth-astro';
import { authorizeCredentials } from './src/server/auth/credentials';
import { allowSignIn, refreshToken } from './src/server/auth/sign-in-gate';
import { sendSignInLink, SIGN_IN_LINK_SECONDS } from './src/server/auth/sign-in-link';
import { authPool } from './src/server/auth/pg-pool';
import { useSecureCookies } from './src/server/auth/session-cookie';
import { authLogger } from './src/server/auth/auth-logger';
import { smtpServer } from './src/server/mail/transport';
import { config } from './src/server/core/config';

export default defineConfig({
  // Read at run time: values through import.meta.env would be frozen into the build.
  secret: process.env.AUTH_SECRET,
  trustHost: true,
  useSecureCookies: useSecureCookies(),
  // The e-mail provider needs an adapter; with one, Auth.js would default to database sessions.
  adapter: PostgresAdapter(authPool()),
  session: { strategy: 'jwt', maxAge: 60 * 60 * 24 * 14 },
  pages: { signIn: '/sign-in', verifyRequest: '/sign-in/link-sent', error: '/sign-in/problem' },
  logger: authLogger,
  providers: [
    Credentials({
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      authorize: authorizeCredentials,
    }),
    Nodemailer({
      server: smtpServer(),
      from: config().MAIL_FROM,
      maxAge: SIGN_IN_LINK_SECONDS,
      sendVerificationRequest: sendSignInLink,
    }),
  ],
  callbacks: {
    signIn: allowSignIn,
    // Only the user id goes into the token; never spread the user (the adapter's row holds the password hash).
    jwt: refreshToken,
    session({ session, token }) {
      return { ...session, user: { id: token.sub ?? '', email: '', emailVerified: null } };
    },
  },
});
