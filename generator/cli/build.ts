/** `stovecard build [--content DIR] [--out DIR] [--serve]`: the site of cards. */
import { buildSite, type BuildResult } from '../pipeline/build-site.ts';
import { terminalProgress } from '../pipeline/progress.ts';
import { checkPort, serveSite } from '../pipeline/serve.ts';
import { sitePdfStep } from '../pipeline/pdf-step.ts';
import { ContentErrors } from '../content/index.ts';
import { formatContentErrors } from '../words/content.ts';
import { buildWords } from '../words/card.ts';
import { faultWords } from '../words/build-faults.ts';
import { printWords } from '../words/print.ts';
import { PDF_TEXT_FLOOR_PT } from '../render/pdf/style.ts';
import { TEXT_CONTRAST_MIN } from '../content/colour.ts';
import { UsageError } from './errors.ts';
import { checkOutFolder } from './out-folder.ts';
import { parseOptions } from './options.ts';

export function summaryLine(result: BuildResult): string {
  return buildWords.summary({
    outDir: result.outDir,
    pages: result.pages,
    stations: result.stationCards,
    inserts: result.insertCards,
    planned: result.planned,
    cached: result.cached,
    refused: result.refused,
    seconds: result.durationMs / 1000,
  });
}

/**
 * The build log's copy of every warning the station cards print, one line each, then one
 * line per set of blocks card PDFs left out to keep their text at the floor.
 */
export function warningLines(result: BuildResult): string {
  return cardWarningLines(result) + droppedLines(result) + brandLines(result);
}

/** Once per build: the brand's colour is too light for text, so it colours only the rules. */
export function brandLines(result: BuildResult): string {
  const brand = result.data.site.brand;
  if (!brand || brand.accent === null || brand.text !== null || brand.contrastOnWhite === null)
    return '';
  const ratio = (Math.floor(brand.contrastOnWhite * 100) / 100).toFixed(2);
  return `${buildWords.brandColourLight(brand.accent, ratio, String(TEXT_CONTRAST_MIN))}\n`;
}

/** What card PDFs left out to fit at the floor (stats.dropped), grouped by what they left out. */
export function droppedLines(result: BuildResult): string {
  const byBlocks = new Map<string, string[]>();
  for (const d of result.stats?.dropped ?? []) {
    const key = d.blocks.join('\n');
    byBlocks.set(key, [...(byBlocks.get(key) ?? []), d.pdf]);
  }
  return [...byBlocks]
    .map(
      ([blocks, pdfs]) =>
        `${printWords.dropped(pdfs.sort(), blocks.split('\n'), PDF_TEXT_FLOOR_PT)}\n`,
    )
    .join('');
}

function cardWarningLines(result: BuildResult): string {
  return result.data.stationCards
    .flatMap((card) =>
      (card.warnings?.items ?? []).map(
        (text) => `${buildWords.cardWarning(card.potId, card.coffeeId, card.stoveId, text)}\n`,
      ),
    )
    .join('');
}

/** What the build did besides the site: leftovers removed, cache files made again, a previous site kept. */
export function noteLines(result: BuildResult): string {
  const notes: string[] = [];
  if ((result.skippedFiles ?? []).length > 0)
    notes.push(faultWords.skippedFiles(result.skippedFiles));
  if (result.sweptLeftovers.length > 0)
    notes.push(faultWords.sweptLeftovers(result.sweptLeftovers));
  if (Object.keys(result.damagedCache).length > 0)
    notes.push(faultWords.damagedCache(result.damagedCache));
  const kept = result.swap.notRemoved;
  if (kept) notes.push(faultWords.previousNotRemoved(kept.folder, kept.code));
  return notes.map((note) => `${note}\n`).join('');
}

/** The port --serve will listen on is free now, or a UsageError says what to change. */
async function portFree(port: number): Promise<void> {
  try {
    await checkPort(port);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'EADDRINUSE')
      throw new UsageError(faultWords.portInUse(port));
    if ((error as NodeJS.ErrnoException).code === 'EACCES')
      throw new UsageError(faultWords.portNotAllowed(port));
    throw error;
  }
}

function portOption(raw: string | boolean | undefined): number {
  if (raw === undefined || typeof raw === 'boolean') return 8080;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 1 || port > 65535)
    throw new UsageError(buildWords.badPort(raw));
  return port;
}

export async function run(argv: string[]): Promise<number> {
  const { values, help } = parseOptions(argv, {
    content: { type: 'string' },
    out: { type: 'string' },
    serve: { type: 'boolean' },
    port: { type: 'string' },
    host: { type: 'string' },
  });
  if (help) {
    process.stdout.write(buildWords.help);
    return 0;
  }
  const contentDir = typeof values.content === 'string' ? values.content : 'content';
  const outDir = typeof values.out === 'string' ? values.out : 'site';
  const port = portOption(values.port);
  await checkOutFolder(contentDir, outDir);
  if (values.serve) await portFree(port);
  const progress = terminalProgress(process.stderr);
  let result: BuildResult;
  try {
    result = await buildSite({
      contentDir,
      outDir,
      onProgress: progress,
      extraSteps: [sitePdfStep],
    });
  } catch (error) {
    progress.finish();
    process.stderr.write(`stovecard: ${buildWords.failed(outDir)}\n`);
    // A whole content folder: the report with its heading, every problem of every file.
    if (error instanceof ContentErrors) {
      process.stderr.write(`${formatContentErrors(error)}\n`);
      return 2;
    }
    throw error;
  }
  progress.finish();
  process.stderr.write(warningLines(result));
  process.stderr.write(`${summaryLine(result)}\n`);
  process.stderr.write(noteLines(result));
  if (values.serve) {
    await serveSite({
      contentDir,
      outDir,
      port,
      ...(typeof values.host === 'string' && values.host !== '' ? { host: values.host } : {}),
      extraSteps: [sitePdfStep],
      describe: summaryLine,
      log: (line) => process.stderr.write(`${line}\n`),
    });
    return await new Promise<number>(() => {});
  }
  return 0;
}
