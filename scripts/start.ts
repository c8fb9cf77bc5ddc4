// `npm start`: local PostgreSQL, migrations, the demo world, a build when sources changed, then the server (scripts/serve.ts, built as dist/serve.mjs).
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { readConfig } from '../src/server/core/config.ts';
import { buildIfStale, ensureDatabase, migrateAndSeed } from './lib/prepare.ts';
import { distDir } from './lib/build-stamp.ts';
import { mailDir } from '../src/server/mail/sink-store.ts';
import { startMailSink } from '../src/server/mail/sink-process.ts';

const config = readConfig();
const env: NodeJS.ProcessEnv = { ...process.env, AUTH_SECRET: process.env.AUTH_SECRET ?? localSecret(config.BENCHLORE_DATA_DIR) };

await ensureDatabase(env);
migrateAndSeed(env);
buildIfStale(env);

// No SMTP relay configured: mail goes to the local sink, readable at /dev/mail.
const sink = config.SMTP_URL ? null : await startMailSink({ port: config.SMTP_SINK_PORT, dir: mailDir(config), env, stdio: 'inherit' });

const port = process.env.PORT ?? '4321';
const host = process.env.HOST ?? '127.0.0.1';
console.log(`\nBenchlore is starting on http://${host}:${port}  (Ctrl+C stops it; \`npm run db -- stop\` stops PostgreSQL)\n`);
const server = spawn(process.execPath, [join(distDir, 'serve.mjs')], {
  stdio: 'inherit',
  env: { ...env, HOST: host, PORT: port },
});
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => server.kill(signal));
server.on('exit', (code) => {
  void (sink ? sink.stop() : Promise.resolve()).finally(() => process.exit(code ?? 0));
});

/** A sign-in secret for this machine's local runs, kept under the data folder (never in git). */
function localSecret(dataDir: string): string {
  const file = join(dataDir, 'auth-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}
