/**
 * A set's PDF from its cards' PDF files, with each card's page taken in the set's object
 * form (render/pdf/merge.ts PageSegment) from the cache where it is there:
 *
 *   <cacheDir>/pdfs/<card PDF key>.page.json   a card page's segment (merge.ts
 *                                              encodeSegment), beside the card's PDF
 *
 * A card whose segment is missing, damaged or not for its PDF (decodeSegment: another
 * format, or streams not where it says) has it made from its PDF, and the new segments
 * are handed back for the build's thread to cache (a worker only reads the cache). The
 * set's shell (binder.ts setShell: its own pages, a placeholder per card) is cached the
 * same way, as `<shell key>.shell`: an edit that leaves the cards' titles as they
 * were draws no set page again. The
 * set's bytes are the same with or without them; with them an edit to one coffee costs
 * each of its sets only the new cards' conversion and a concatenation.
 */
import { readFile } from 'node:fs/promises';
import { setPdf, type SetPdfInput } from '../render/pdf/binder.ts';
import { decodeSegment, encodeSegment, pageSegment } from '../render/pdf/merge.ts';
import { FileCache } from './file-cache.ts';

/** The segments' file ending in the PDF cache folder. */
export const PAGE_SEGMENT_EXT = '.page.json';

/**
 * The set shells' file ending in the PDF cache folder (render-cache.ts setShellKey): a PDF,
 * but not named `.pdf`, so nothing takes it for one of the site's PDFs in the cache.
 */
export const SET_SHELL_EXT = '.shell';

/**
 * Where a set's parts are cached: the folder, each card's PDF key in order (its
 * segment's key), and the key of the set's shell.
 */
export interface SegmentSource {
  readonly dir: string;
  readonly keys: readonly string[];
  readonly shellKey: string;
}

export interface AssembledSet {
  readonly bytes: Uint8Array;
  readonly pages: number;
  /** Segments made here (not in the cache), to be cached under their card PDF's key. */
  readonly madeSegments: readonly { readonly key: string; readonly text: string }[];
  /** The shell, when it was drawn here, to be cached under its key. */
  readonly madeShell: { readonly key: string; readonly bytes: Uint8Array } | null;
}

export async function assembleSet(
  input: Omit<SetPdfInput, 'cardPdfs' | 'cardSegments'>,
  cardFiles: readonly string[],
  segments: SegmentSource | null,
): Promise<AssembledSet> {
  if (segments && segments.keys.length !== cardFiles.length)
    throw new Error(`PDF: ${cardFiles.length} card files and ${segments.keys.length} segment keys`);
  const cache = segments ? new FileCache(segments.dir, PAGE_SEGMENT_EXT) : null;
  const shells = segments ? new FileCache(segments.dir, SET_SHELL_EXT) : null;
  const made: { key: string; text: string }[] = [];
  const cachedShell = shells && segments ? shells.getBytes(segments.shellKey) : null;
  const read = await Promise.all(
    cardFiles.map(async (file, i) => {
      const key = segments?.keys[i];
      const [pdf, text] = await Promise.all([
        readFile(file),
        cache && key ? cache.getText(key) : Promise.resolve(null),
      ]);
      let segment = text === null ? null : decodeSegment(text, pdf);
      if (!segment) {
        segment = pageSegment(pdf);
        if (key) made.push({ key, text: encodeSegment(segment, pdf) });
      }
      return { pdf, segment };
    }),
  );
  const shell = await cachedShell;
  const inputs = {
    ...input,
    cardPdfs: read.map((r) => r.pdf),
    cardSegments: read.map((r) => r.segment),
  };
  let pdf;
  let drewShell = shell === null;
  try {
    pdf = await setPdf(inputs, shell);
  } catch (error) {
    // A cached shell that is not one (it passed its check, but does not read): drawn again.
    if (shell === null) throw error;
    pdf = await setPdf(inputs, null);
    drewShell = true;
  }
  const drawn = segments && drewShell ? { key: segments.shellKey, bytes: pdf.shell } : null;
  return { bytes: pdf.bytes, pages: pdf.pages, madeSegments: made, madeShell: drawn };
}
