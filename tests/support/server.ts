// Starts the built Astro server for tests on a port of its own and stops it afterwards.
import { spawn, type ChildProcess } from 'node:child_process';
import { DIST_DIR, testEnv } from './test-env';

export async function startServer(port: number): Promise<() => Promise<void>> {
  const child: ChildProcess = spawn(process.execPath, [`${DIST_DIR}/server/entry.mjs`], {
    env: { ...testEnv(), HOST: '127.0.0.1', PORT: String(port), PUBLIC_ORIGIN: `http://127.0.0.1:${port}` },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout?.on('data', (d) => (output += d));
  child.stderr?.on('data', (d) => (output += d));
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`Test server exited early:\n${output}`);
    try {
      const res = await fetch(`http://127.0.0.1:${port}/`);
      if (res.status < 500) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`Test server did not answer within 30 s:\n${output}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return async () => {
    child.kill('SIGTERM');
    await new Promise((r) => child.once('exit', r));
  };
}
