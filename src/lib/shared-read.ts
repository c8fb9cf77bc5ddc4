// One read shared by the callers that ask for the same thing at the same moment, without ever handing a caller an
// answer older than its own arrival.

/**
 * Reads by key, sharing runs. A caller never gets the answer of a run that began before it arrived: that run may have
 * read the database before a change the caller has to see (a page's key read just after a proofing committed). So a
 * caller that finds a run under way waits for the next one, which starts when the current run ends and is shared by
 * every caller that arrived meanwhile. Under load, a hundred readers of the same key cost two reads, not a hundred;
 * alone, a caller starts its run at once. A run that fails fails for the callers that shared it, and only for them.
 * Keys are forgotten once no run is under way, so the table holds only what is being read right now.
 */
export function sharedReads<T>(): (key: string, run: () => Promise<T>) => Promise<T> {
  interface Turn {
    current: Promise<T>;
    next?: Promise<T>;
  }
  const turns = new Map<string, Turn>();
  const ignore = () => undefined;

  function start(key: string, run: () => Promise<T>): Promise<T> {
    const turn: Turn = {
      current: Promise.resolve()
        .then(run)
        .finally(() => {
          // With a next run waiting, that run takes the key over as it starts; otherwise the key is idle.
          if (turns.get(key) === turn && !turn.next) turns.delete(key);
        }),
    };
    turns.set(key, turn);
    return turn.current;
  }

  return (key, run) => {
    const turn = turns.get(key);
    if (!turn) return start(key, run);
    turn.next ??= turn.current.then(ignore, ignore).then(() => start(key, run));
    return turn.next;
  };
}
