/** Turning failures into one clear line on stderr and an exit code. */
import { ContentErrors, formatContentErrors } from '../content/index.ts';
import { BrewSetupError } from '../brew/errors.ts';
import { OutOfRangeError } from '../physics/errors.ts';

/** Wrong flags or arguments: the message says what to type instead. */
export class UsageError extends Error {
  override readonly name = 'UsageError';
}

/** A refused or impossible request that the user can fix by changing an input. */
export class InputError extends Error {
  override readonly name = 'InputError';
}

export function reportError(error: unknown): number {
  if (error instanceof ContentErrors) {
    process.stderr.write(formatContentErrors(error) + '\n');
    return 2;
  }
  if (
    error instanceof UsageError ||
    error instanceof InputError ||
    error instanceof BrewSetupError ||
    error instanceof OutOfRangeError
  ) {
    process.stderr.write(`stovecard: ${error.message}\n`);
    return 2;
  }
  const message = error instanceof Error ? error.message : String(error);
  process.stderr.write(`stovecard: internal error: ${message}\n`);
  if (process.env.STOVECARD_DEBUG && error instanceof Error) process.stderr.write(`${error.stack}\n`);
  return 1;
}
