/** Turning failures into one clear line on stderr and an exit code. */
import { ContentErrors } from '../content/index.ts';
import { BrewSetupError } from '../brew/errors.ts';
import { brewWords } from '../words/brew.ts';
import { issueLine } from '../words/content.ts';
import { OutOfRangeError } from '../physics/errors.ts';

/** Wrong flags or arguments: the message says what to type instead. */
export class UsageError extends Error {
  override readonly name = 'UsageError';
}

/** A refused or impossible request that the user can fix by changing an input. */
export class InputError extends Error {
  override readonly name = 'InputError';
}

/**
 * A command that reads single entry files (simulate, plan, fit) prints each problem as one
 * `stovecard: file:line:column field — …` line; `build`, which reads a whole content folder,
 * prints the heading report itself (see build.ts).
 */
export function reportError(error: unknown): number {
  if (error instanceof ContentErrors) {
    const lines = error.issues.length > 0 ? error.issues.map(issueLine) : [error.message];
    process.stderr.write(lines.map((line) => `stovecard: ${line}\n`).join(''));
    return 2;
  }
  if (error instanceof BrewSetupError) {
    process.stderr.write(`stovecard: ${brewWords.setup(error.field, error.code)}\n`);
    return 2;
  }
  if (
    error instanceof UsageError ||
    error instanceof InputError ||
    error instanceof OutOfRangeError
  ) {
    process.stderr.write(`stovecard: ${error.message}\n`);
    return 2;
  }
  const message = error instanceof Error ? error.message : String(error);
  process.stderr.write(`stovecard: internal error: ${message}\n`);
  if (process.env.STOVECARD_DEBUG && error instanceof Error)
    process.stderr.write(`${error.stack}\n`);
  return 1;
}
