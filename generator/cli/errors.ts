/** Turning failures into one clear line on stderr and an exit code. */
import { ContentErrors } from '../content/index.ts';
import { BrewSetupError } from '../brew/errors.ts';
import { brewWords } from '../words/brew.ts';
import { issueLine } from '../words/content.ts';
import { OutOfRangeError } from '../physics/errors.ts';
import { PageCollisionError } from '../pipeline/cards.ts';
import { OutFolderError } from '../pipeline/swap.ts';
import { MIN_MODULE_MM, QR_PRINTED_MM, QrTooDenseError } from '../render/qr-density.ts';
import { faultWords } from '../words/build-faults.ts';
import { shown } from '../words/shown.ts';
import { outFolderMessage } from './out-folder.ts';

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
  if (error instanceof PageCollisionError) {
    process.stderr.write(
      `stovecard: ${faultWords.pageCollision(error.page, error.first, error.second)}\n`,
    );
    return 2;
  }
  if (error instanceof QrTooDenseError) {
    const d = error.density;
    process.stderr.write(
      `stovecard: ${faultWords.qrTooDense(error.url, d.modules, d.moduleMm, QR_PRINTED_MM, MIN_MODULE_MM)}\n`,
    );
    return 2;
  }
  // A card too long for its paper at the 7 pt floor (render/pdf/card.ts PdfLayoutError; it
  // reaches here by name when a build worker drew the card): the words say what to change.
  // Also a card too big for its set's sheet cell (render/pdf/sheet.ts SheetLayoutError):
  // its message names site.yaml:line, the set's `sheet` field, the cell and the fix.
  if (
    error instanceof Error &&
    (error.name === 'PdfLayoutError' || error.name === 'SheetLayoutError')
  ) {
    process.stderr.write(`stovecard: ${error.message}\n`);
    return 2;
  }
  if (error instanceof OutFolderError) {
    process.stderr.write(`stovecard: ${outFolderMessage(error.folder, error)}\n`);
    return 2;
  }
  const fsMessage = fileSystemMessage(error);
  if (fsMessage !== null) {
    process.stderr.write(`stovecard: ${fsMessage}\n`);
    return 2;
  }
  const message = error instanceof Error ? error.message : String(error);
  process.stderr.write(`stovecard: internal error: ${shown(message, 400)}\n`);
  if (process.env.STOVECARD_DEBUG && error instanceof Error)
    process.stderr.write(`${error.stack}\n`);
  return 1;
}

/** The words for a file-system failure the user can fix (disk full, permissions, …), or null. */
export function fileSystemMessage(error: unknown): string | null {
  if (!(error instanceof Error)) return null;
  const { code, path: file, dest } = error as NodeJS.ErrnoException & { dest?: string };
  if (typeof code !== 'string' || !faultWords.knownFileSystemCode(code)) return null;
  return faultWords.fileSystem(code, file ?? dest);
}
