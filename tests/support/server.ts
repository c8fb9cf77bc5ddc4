// Starts the built Astro server for tests on a port of its own and stops it afterwards.
import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { startMailSink } from '../../src/server/mail/sink-process';
import { DIST_DIR, mailDirFor, sinkPortFor, testEnv } from './test-env';

/** `env` overrides the server's environment, e.g. an https PUBLIC_ORIGIN for the cookie tests. */
export async function startServer(port: number, env: NodeJS.ProcessEnv = {}): Promise<() => Promise<void>> {
  // The server's mail goes to a sink of its own; tests read its folder (tests/support/mail.ts).
  const mail = { SMTP_SINK_PORT: String(sinkPortFor(port)), BENCHLORE_MAIL_DIR: mailDirFor(port) };
  rmSync(mail.BENCHLORE_MAIL_DIR, { recursive: true, force: true });
  const sink = await startMailSink({ port: sinkPortFor(port), dir: mail.BENCHLORE_MAIL_DIR, env: testEnv(), stdio: 'pipe' });
  const child: ChildProcess = spawn(process.execPath, [`${DIST_DIR}/server/entry.mjs`], {
    env: { ...testEnv(), ...mail, HOST: '127.0.0.1', PORT: String(port), PUBLIC_ORIGIN: `http://127.0.0.1:${port}`, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) {
      await sink.stop();
      throw new Error(`Test server exited early:\n${output}`);
    }
    try {
      const res = await fetch(`http://127.0.0.1:${port}/`);
      if (res.status < 500) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill('SIGTERM');
      await sink.stop();
      throw new Error(`Test server did not answer within 30 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return async () => {
    child.kill('SIGTERM');
    await new Promise((r) => child.once('exit', r));
    await sink.stop();
  };
}
