// Shared reads: callers arriving together share one run, and no caller is handed a run that began before it arrived.
import { describe, expect, it } from 'vitest';
import { sharedReads } from '@/lib/shared-read';

/** A run the test finishes by hand, recording when it started. */
function controlledRuns() {
  const started: number[] = [];
  const finish: ((value: string) => void)[] = [];
  const fail: ((error: Error) => void)[] = [];
  let version = 0;
  const run = () =>
    new Promise<string>((resolve, reject) => {
      started.push(version);
      finish.push(resolve);
      fail.push(reject);
    });
  return { started, finish, fail, run, change: () => version++ };
}

const tick = () => new Promise((r) => setTimeout(r, 0));

describe('sharedReads', () => {
  it('starts a run at once for a caller alone, and again for the next caller once it ended', async () => {
    const read = sharedReads<string>();
    const runs = controlledRuns();
    const first = read('k', runs.run);
    await tick();
    expect(runs.started).toHaveLength(1);
    runs.finish[0]!('one');
    expect(await first).toBe('one');
    const second = read('k', runs.run);
    await tick();
    expect(runs.started).toHaveLength(2);
    runs.finish[1]!('two');
    expect(await second).toBe('two');
  });

  it('never hands a caller a run that began before it arrived: late callers share the next run', async () => {
    const read = sharedReads<string>();
    const runs = controlledRuns();
    const early = read('k', runs.run);
    await tick();
    runs.change(); // a change commits while the first run is under way
    const late = [read('k', runs.run), read('k', runs.run), read('k', runs.run)];
    await tick();
    expect(runs.started).toEqual([0]); // the late callers wait; they do not start runs of their own
    runs.finish[0]!('before the change');
    expect(await early).toBe('before the change');
    await tick();
    expect(runs.started).toEqual([0, 1]); // one run for the three of them, begun after the change
    runs.finish[1]!('after the change');
    expect(await Promise.all(late)).toEqual(['after the change', 'after the change', 'after the change']);
  });

  it('keeps keys apart', async () => {
    const read = sharedReads<string>();
    const a = controlledRuns();
    const b = controlledRuns();
    const ra = read('a', a.run);
    const rb = read('b', b.run);
    await tick();
    expect([a.started.length, b.started.length]).toEqual([1, 1]);
    a.finish[0]!('A');
    b.finish[0]!('B');
    expect([await ra, await rb]).toEqual(['A', 'B']);
  });

  it('fails only the callers that shared a failed run; the next caller gets a run of its own', async () => {
    const read = sharedReads<string>();
    const runs = controlledRuns();
    const first = read('k', runs.run);
    await tick();
    const waiting = read('k', runs.run);
    runs.fail[0]!(new Error('connection lost'));
    await expect(first).rejects.toThrow('connection lost');
    await tick();
    expect(runs.started).toHaveLength(2); // the waiting caller's run still starts
    runs.finish[1]!('back');
    expect(await waiting).toBe('back');
    const after = read('k', runs.run);
    await tick();
    runs.finish[2]!('again');
    expect(await after).toBe('again');
    expect(runs.started).toHaveLength(3);
  });

  it('a caller arriving while the waiting run is under way waits for a third run', async () => {
    const read = sharedReads<string>();
    const runs = controlledRuns();
    const first = read('k', runs.run);
    await tick();
    const second = read('k', runs.run);
    runs.finish[0]!('1');
    await first;
    await tick();
    expect(runs.started).toHaveLength(2);
    const third = read('k', runs.run); // the second run began before this caller came
    runs.finish[1]!('2');
    expect(await second).toBe('2');
    await tick();
    expect(runs.started).toHaveLength(3);
    runs.finish[2]!('3');
    expect(await third).toBe('3');
  });
});
