// Starts the built app for tests through its server entry (scripts/serve.ts, built as dist/serve.mjs) on a port of its own, and stops it afterwards.
import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { startMailSink } from '../../src/server/mail/sink-process';
import { DIST_DIR, mailDirFor, sinkPortFor, testEnv } from './test-env';

export interface TestApp {
  base: string;
  child: ChildProcess;
  /** Everything the server and its background work printed so far. */
  output(): string;
  /** Stops the mail sink (the relay goes down) and starts it again on the same port and folder. */
  sink: { stop(): Promise<void>; start(): Promise<void> };
  /** SIGTERM (or the given signal), waits for the exit and stops the sink; resolves to the exit code or signal. */
  stop(signal?: NodeJS.Signals): Promise<number | string | null>;
}

/**
 * Starts the server entry and resolves once it says it is listening, before any request has reached it.
 * `env` overrides the server's environment, e.g. an https PUBLIC_ORIGIN for the cookie tests.
 */
export async function startApp(
  port: number,
  env: NodeJS.ProcessEnv = {},
  /** keepMail: keep the sink's folder from before; sink: false starts no sink (the relay is down, or a test's own). */
  options: { keepMail?: boolean; sink?: boolean } = {},
): Promise<TestApp> {
  // The server's mail goes to a sink of its own; tests read its folder (tests/support/mail.ts).
  const mail = { SMTP_SINK_PORT: String(sinkPortFor(port)), BENCHLORE_MAIL_DIR: mailDirFor(port) };
  if (!options.keepMail) rmSync(mail.BENCHLORE_MAIL_DIR, { recursive: true, force: true });
  const startSink = () => startMailSink({ port: sinkPortFor(port), dir: mail.BENCHLORE_MAIL_DIR, env: testEnv(), stdio: 'pipe' });
  let sink: Awaited<ReturnType<typeof startMailSink>> | null = options.sink === false ? null : await startSink();
  const child: ChildProcess = spawn(process.execPath, [`${DIST_DIR}/serve.mjs`], {
    env: {
      ...testEnv(),
      ...mail,
      BENCHLORE_DIST: DIST_DIR,
      HOST: '127.0.0.1',
      PORT: String(port),
      PUBLIC_ORIGIN: `http://127.0.0.1:${port}`,
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  const exited = new Promise<number | string | null>((resolve) => child.once('exit', (code, signal) => resolve(code ?? signal)));
  const stopSink = async () => {
    await sink?.stop();
    sink = null;
  };
  const deadline = Date.now() + 30_000;
  while (!output.includes('Benchlore is listening')) {
    if (child.exitCode !== null || child.signalCode !== null) {
      await stopSink();
      throw new Error(`Test server exited early:\n${output}`);
    }
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      await stopSink();
      throw new Error(`Test server did not start within 30 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  return {
    base: `http://127.0.0.1:${port}`,
    child,
    output: () => output,
    sink: {
      stop: stopSink,
      async start() {
        sink ??= await startSink();
      },
    },
    async stop(signal: NodeJS.Signals = 'SIGTERM') {
      if (child.exitCode === null && child.signalCode === null) child.kill(signal);
      const result = await exited;
      await stopSink();
      return result;
    },
  };
}

/** Starts the app and waits until its home page answers; resolves to a function that stops it. */
export async function startServer(port: number, env: NodeJS.ProcessEnv = {}): Promise<() => Promise<void>> {
  const app = await startApp(port, env);
  const deadline = Date.now() + 30_000;
  for (;;) {
    try {
      const res = await fetch(`${app.base}/`);
      await res.arrayBuffer();
      if (res.status < 500) break;
    } catch {
      // not answering yet
    }
    if (Date.now() > deadline) {
      await app.stop();
      throw new Error(`Test server did not answer within 30 s:\n${app.output()}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return async () => {
    await app.stop();
  };
}
