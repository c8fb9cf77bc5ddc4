// Finds and runs PostgreSQL's own client tools (pg_dump, pg_restore) for backups.
import { spawn } from 'node:child_process';
import { existsSync, readdirSync } from 'node:fs';
import { join } from 'node:path';

/** The newest Debian-installed version's binary, else whatever is on PATH. */
export function pgTool(name: 'pg_dump' | 'pg_restore'): string {
  const base = '/usr/lib/postgresql';
  if (existsSync(base)) {
    const versions = readdirSync(base)
      .filter((v) => existsSync(join(base, v, 'bin', name)))
      .sort((a, b) => Number(b) - Number(a));
    if (versions[0]) return join(base, versions[0], 'bin', name);
  }
  return name;
}

/** Runs a tool to completion; a failure is an Error carrying the tool's own last lines. */
export function runTool(command: string, args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: ['ignore', 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => {
      stderr = (stderr + chunk.toString('utf8')).slice(-4000);
    });
    child.on('error', reject);
    child.on('close', (code) => {
      if (code === 0) resolve();
      else reject(new Error(`${command.split('/').pop()} failed (exit ${code}): ${stderr.trim()}`));
    });
  });
}
