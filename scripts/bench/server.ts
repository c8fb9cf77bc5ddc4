// Starts the built app for a benchmark on a port of its own, through its real server entry (dist/serve.mjs, what
// `npm start` runs), in production mode, and reports its process id.
import { spawn, type ChildProcess } from 'node:child_process';

export interface BenchServer {
  base: string;
  child: ChildProcess;
  stop(): Promise<void>;
}

export async function startBenchServer(
  port: number,
  env: NodeJS.ProcessEnv,
  distDir = 'dist',
  nodeArgs: string[] = [],
): Promise<BenchServer> {
  const child = spawn(process.execPath, [...nodeArgs, `${distDir}/serve.mjs`], {
    env: { ...env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), PUBLIC_ORIGIN: `http://127.0.0.1:${port}` },
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr?.on('data', (d) => (stderr = (stderr + d).slice(-4000)));
  const base = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The app exited before it answered:\n${stderr}`);
    try {
      const res = await fetch(`${base}/`);
      await res.arrayBuffer();
      if (res.status < 500) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill('SIGTERM');
      throw new Error(`The app did not answer within 30 s:\n${stderr}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    base,
    child,
    stop: async () => {
      child.kill('SIGTERM');
      await new Promise((r) => child.once('exit', r));
    },
  };
}

/** Resident memory of a process now, in MB, read from /proc (Linux). */
export async function rssMb(pid: number): Promise<number> {
  const { readFile } = await import('node:fs/promises');
  const status = await readFile(`/proc/${pid}/status`, 'utf8').catch(() => '');
  const kb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
  return kb / 1024;
}
