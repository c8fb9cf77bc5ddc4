// Shared reads: callers arriving while a read of their key runs join it; the next caller after it starts afresh.
import { describe, expect, it } from 'vitest';
import { sharedReads } from '@/lib/shared-read';

/** Runs the test finishes by hand, counting how many were started. */
function controlledRuns() {
  const finish: ((value: string) => void)[] = [];
  const fail: ((error: Error) => void)[] = [];
  const run = () =>
    new Promise<string>((resolve, reject) => {
      finish.push(resolve);
      fail.push(reject);
    });
  return { finish, fail, run, started: () => finish.length };
}

const tick = () => new Promise((r) => setTimeout(r, 0));

describe('sharedReads', () => {
  it('lets callers arriving during a run join it, and starts a fresh run for the next caller once it ended', async () => {
    const read = sharedReads<string>();
    const runs = controlledRuns();
    const together = [read('k', runs.run), read('k', runs.run), read('k', runs.run)];
    await tick();
    expect(runs.started()).toBe(1);
    runs.finish[0]!('one');
    expect(await Promise.all(together)).toEqual(['one', 'one', 'one']);
    const later = read('k', runs.run);
    await tick();
    expect(runs.started()).toBe(2);
    runs.finish[1]!('two');
    expect(await later).toBe('two');
  });

  it('keeps keys apart', async () => {
    const read = sharedReads<string>();
    const a = controlledRuns();
    const b = controlledRuns();
    const ra = read('a', a.run);
    const rb = read('b', b.run);
    await tick();
    expect([a.started(), b.started()]).toEqual([1, 1]);
    a.finish[0]!('A');
    b.finish[0]!('B');
    expect([await ra, await rb]).toEqual(['A', 'B']);
  });

  it('fails only the callers that joined a failed run; the next caller gets a run of its own', async () => {
    const read = sharedReads<string>();
    const runs = controlledRuns();
    const first = read('k', runs.run);
    const joined = read('k', runs.run);
    await tick();
    runs.fail[0]!(new Error('connection lost'));
    await expect(first).rejects.toThrow('connection lost');
    await expect(joined).rejects.toThrow('connection lost');
    const after = read('k', runs.run);
    await tick();
    expect(runs.started()).toBe(2);
    runs.finish[1]!('back');
    expect(await after).toBe('back');
  });

  it('starts a run for a caller alone at once', async () => {
    const read = sharedReads<number>();
    let runs = 0;
    expect(await read('k', async () => ++runs)).toBe(1);
    expect(await read('k', async () => ++runs)).toBe(2);
  });
});
