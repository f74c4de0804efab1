/**
 * `items.map(work)` with at most `limit` calls in flight, results in the items' order: for
 * many small file reads and writes (the caches), which are slower one at a time and run
 * out of file handles all at once. When one call fails no new call starts, and the
 * promise rejects with the first error once the calls in flight have settled, so nothing
 * still writes into a folder the caller is about to remove.
 */
export async function mapConcurrent<T, R>(
  items: readonly T[],
  limit: number,
  work: (item: T, index: number) => Promise<R>,
): Promise<R[]> {
  const results = new Array<R>(items.length);
  let next = 0;
  let failure: { error: unknown } | null = null;
  const lane = async (): Promise<void> => {
    while (next < items.length && !failure) {
      const index = next++;
      try {
        results[index] = await work(items[index]!, index);
      } catch (error) {
        failure ??= { error };
      }
    }
  };
  await Promise.all(Array.from({ length: Math.min(limit, items.length) }, lane));
  if (failure) throw (failure as { error: unknown }).error;
  return results;
}

/** Settles every promise, then rejects with the first failure (or resolves to all values). */
export async function allSettledOrThrow<R>(promises: readonly Promise<R>[]): Promise<R[]> {
  const settled = await Promise.allSettled(promises);
  const failed = settled.find((s): s is PromiseRejectedResult => s.status === 'rejected');
  if (failed) throw failed.reason;
  return settled.map((s) => (s as PromiseFulfilledResult<R>).value);
}

/** The usual limit for cache files. */
export const IO_LIMIT = 32;
