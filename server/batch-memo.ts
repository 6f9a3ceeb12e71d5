/**
 * Loads shared by the checks of one unit of work (a device's sync batch): the first caller of
 * a key loads it, later callers get the same promise. Lives only as long as the batch, so
 * nothing read here outlives the request that read it.
 */
export interface BatchMemo {
  once<T>(key: string, load: () => Promise<T>): Promise<T>;
}

export function batchMemo(): BatchMemo {
  const loaded = new Map<string, Promise<unknown>>();
  return {
    once<T>(key: string, load: () => Promise<T>): Promise<T> {
      let p = loaded.get(key) as Promise<T> | undefined;
      if (!p) {
        p = load();
        // A failed load is not kept: the next caller tries again (and meets its own error).
        p.catch(() => loaded.delete(key));
        loaded.set(key, p);
      }
      return p;
    },
  };
}
