/**
 * Runs tasks that share a key one after another, in this process; tasks with other keys run freely. A task that
 * fails does not stop the ones queued behind it.
 */
export function createKeyedQueue<K>() {
  const tails = new Map<K, Promise<unknown>>();
  return function run<T>(key: K, task: () => Promise<T>): Promise<T> {
    const before = tails.get(key) ?? Promise.resolve();
    const result = before.then(task);
    const tail = result.then(
      () => undefined,
      () => undefined,
    );
    tails.set(key, tail);
    void tail.then(() => {
      if (tails.get(key) === tail) tails.delete(key);
    });
    return result;
  };
}
