/**
 * The date a build prints. Reproducible builds set SOURCE_DATE_EPOCH (seconds since
 * 1970-01-01 UTC, https://reproducible-builds.org/specs/source-date-epoch/); otherwise
 * today, in UTC.
 */
export function buildDate(env: NodeJS.ProcessEnv = process.env, now: Date = new Date()): string {
  const raw = env.SOURCE_DATE_EPOCH;
  if (raw !== undefined && raw.trim() !== '') {
    const seconds = Number(raw);
    if (!Number.isInteger(seconds) || seconds < 0) {
      throw new Error(`SOURCE_DATE_EPOCH must be a whole number of seconds, got "${raw}"`);
    }
    return new Date(seconds * 1000).toISOString().slice(0, 10);
  }
  return now.toISOString().slice(0, 10);
}
