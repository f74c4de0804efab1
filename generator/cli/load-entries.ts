/**
 * Loading the entry files a command names all at once, so a person sees the problems of
 * every file in one run rather than one file per try.
 */
import { ContentErrors } from '../content/index.ts';

/**
 * Like Promise.all over entry loads, but waits for all of them: when any fails, the issues
 * of every failed file come back as one ContentErrors (any other error is rethrown as is).
 */
export async function allEntries<T extends readonly unknown[] | []>(
  loads: T,
): Promise<{ -readonly [K in keyof T]: Awaited<T[K]> }> {
  const settled = await Promise.allSettled(loads);
  const failures = settled.flatMap((each) => (each.status === 'rejected' ? [each.reason] : []));
  const others = failures.filter((failure) => !(failure instanceof ContentErrors));
  if (others.length > 0) throw others[0];
  if (failures.length > 0)
    throw new ContentErrors(failures.flatMap((failure) => (failure as ContentErrors).issues));
  return settled.map((each) => (each as PromiseFulfilledResult<unknown>).value) as {
    -readonly [K in keyof T]: Awaited<T[K]>;
  };
}
