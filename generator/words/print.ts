/**
 * Words of the print jobs: what a set page says about the combinations it left out and
 * the binder's label (`setPrintWords`, in the language catalogue as `print`: en.ts, es.ts),
 * and the build log's note on the blocks a card PDF left out (`printWords`, the CLI's
 * English: terminal output, not printed on anything). Each sentence is a function of facts
 * (counts and codes); the short reasons are the ones the insert rows use
 * (cardWords.refusal.short), so one refusal reads the same everywhere.
 */
import type { PaperSize } from '../content/types.ts';
import type { RefusalCode } from '../planning/types.ts';
import { cardWords } from './card.ts';

const plural = (n: number, one: string, many: string): string =>
  n === 1 ? `one ${one}` : `${n} ${many}`;

/** The optional blocks of a card (render/pdf/card.ts OPTIONAL_ORDER), as the log names them. */
const OPTIONAL_NAMES: Record<string, string> = {
  chart: 'the chart',
  'cross-section': 'the cross-section drawing',
  'long-cautions': 'the long form of the cautions (the short form printed)',
  expect: 'what to expect',
  'qr-code': 'the QR code',
  pictograms: 'the step pictograms',
  'pot-names': 'the pot names under the cup sizes',
  'tasting-notes': 'the tasting notes',
  'web-line': 'the web address line',
};

export const printWords = {
  /**
   * A build-log line: the card PDFs that left out the same blocks to keep their text at
   * the floor (the first few named, the rest counted).
   */
  dropped: (pdfs: readonly string[], blocks: readonly string[], floorPt: number): string => {
    const shownPdfs = pdfs.slice(0, 3).join(', ');
    const rest = pdfs.length > 3 ? ` and ${pdfs.length - 3} more` : '';
    const what = blocks.map((b) => OPTIONAL_NAMES[b] ?? b).join(', ');
    const count = pdfs.length === 1 ? 'one card PDF leaves' : `${pdfs.length} card PDFs leave`;
    return `warning: ${count} out ${what} to keep every text at ${floorPt} pt or more on its paper: ${shownPdfs}${rest}`;
  },
  /**
   * A card too big for a sheet's cell at the floor, even without its optional blocks: where
   * `sheet:` is written, the cell's size and what to change. Stops the build (exit 2).
   */
  sheetDoesNotFit: (f: {
    readonly at: string;
    readonly field: string;
    readonly card: string;
    readonly up: number;
    readonly paper: string;
    readonly cellWidthMm: number;
    readonly cellHeightMm: number;
    readonly floorPt: number;
  }): string => {
    const fewer = f.up === 8 ? '`up: 4` or `up: 2`' : '`up: 2`';
    const fix =
      f.up > 2
        ? `write ${fewer}, or a larger \`paper:\` for the sheet`
        : 'write a larger `paper:` for the sheet, or leave `sheet:` out of the set';
    return `${f.at} ${f.field} — the card "${f.card}" does not fit its cell on the ${f.paper} sheet at ${f.up} up (${mm(f.cellWidthMm)} × ${mm(f.cellHeightMm)} mm) with every text at ${f.floorPt} pt or more, even without its optional blocks. ${fix[0]!.toUpperCase()}${fix.slice(1)}.`;
  },
} as const;

const mm = (value: number): string => `${Math.round(value * 10) / 10}`;

/** What a set page and the index print about a set (the catalogue's `print`). */
export const setPrintWords = {
  /** A binder set's kind, on the index and its page (beside "Station cards", "Bag inserts"). */
  binderLabel: 'Training binder',
  /** How a sheet's paper is named on a set page. */
  paperNames: {
    A4: 'A4',
    A5: 'A5',
    A6: 'A6',
    letter: 'US letter',
    'half-letter': 'half-letter',
    '4x6in': '4 × 6 in',
  } satisfies Record<PaperSize, string>,
  /** A set page's line before the link to the set's PDF (the link itself says "PDF"). */
  setPdf: (binder: boolean): string =>
    binder
      ? 'The whole binder in one PDF: its training pages, then the cards.'
      : 'Every card of this set in one PDF, one card to a page.',
  /** The link's own text (the set's PDF link beside it says "PDF"). */
  sheetPdf: 'Sheets (PDF)',
  /** A set page's line before the link to its sheet PDF (a set with `sheet:`). */
  sheetLink: (up: number, paper: string): string =>
    `For a desktop printer: ${up} cards to each ${paper} sheet, with crop marks to cut along.`,
  /**
   * A set page's note on the pot × coffee combinations it left out because none of them
   * gets a recipe, with how many of each reason ("2 × base does not work on induction").
   */
  leftOut: (codes: readonly RefusalCode[]): string | null => {
    if (codes.length === 0) return null;
    const counts = new Map<RefusalCode, number>();
    for (const code of codes) counts.set(code, (counts.get(code) ?? 0) + 1);
    const reasons = [...counts.entries()]
      .map(([code, n]) => `${n} × ${cardWords.refusal.short[code]}`)
      .join('; ');
    const what = plural(codes.length, 'combination', 'combinations');
    return `Left out of this set: ${what} of pot and coffee that would get no recipe (${reasons}).`;
  },
} as const;
