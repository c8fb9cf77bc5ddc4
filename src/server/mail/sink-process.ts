// Starts scripts/mail-sink.ts as a child process and waits until it listens (for `npm start` and the tests).
import { spawn, type ChildProcess } from 'node:child_process';

export interface SinkOptions {
  port: number;
  /** Folder for received messages (BENCHLORE_MAIL_DIR). */
  dir?: string;
  env?: NodeJS.ProcessEnv;
  /** Where its output goes; the tests keep it quiet. */
  stdio?: 'inherit' | 'pipe';
}

export async function startMailSink(options: SinkOptions): Promise<{ child: ChildProcess; stop: () => Promise<void> }> {
  const env: NodeJS.ProcessEnv = { ...(options.env ?? process.env), SMTP_SINK_PORT: String(options.port) };
  if (options.dir) env.BENCHLORE_MAIL_DIR = options.dir;
  const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/mail-sink.ts'], { env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`The mail sink did not start within 20 s:\n${output}`)), 20_000);
    child.stdout?.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (options.stdio === 'inherit') process.stdout.write(chunk);
      if (output.includes('mail sink listening')) {
        clearTimeout(timer);
        resolve();
      }
    });
    child.stderr?.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (options.stdio === 'inherit') process.stderr.write(chunk);
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`The mail sink exited (code ${code}):\n${output}`));
    });
  });
  const stop = async (): Promise<void> => {
    if (child.exitCode !== null || child.signalCode !== null) return;
    const exited = new Promise((resolve) => child.once('exit', resolve));
    child.kill('SIGTERM');
    await exited;
  };
  return { child, stop };
}
