// One read shared by the callers that ask for the same thing at the same moment.

/**
 * Reads by key, sharing the run under way: a caller that finds a run for its key joins it instead of starting
 * another, and the next caller after it ends starts a fresh one. Under load a hundred readers of the same key cost
 * one read, not a hundred. The price is a bound on freshness: a joined run may have begun just before the caller
 * arrived, so it can miss a change committed in that moment (by at most one read's time); the next run sees it.
 * That suits what it serves: anonymous page keys, whose pages shared caches may keep for a minute anyway. A run
 * that fails fails for the callers that joined it, and only for them. Keys are forgotten when their run ends.
 */
export function sharedReads<T>(): (key: string, run: () => Promise<T>) => Promise<T> {
  const running = new Map<string, Promise<T>>();
  return (key, run) => {
    const under = running.get(key);
    if (under) return under;
    const started = Promise.resolve()
      .then(run)
      .finally(() => running.delete(key));
    running.set(key, started);
    return started;
  };
}
