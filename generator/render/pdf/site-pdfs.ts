/**
 * Every PDF of the site, written into the build's temporary folder before it is swapped
 * in (buildSite's `extraSteps`):
 *
 *   cards/<pot>--<coffee>--<stove>.pdf   each station card, beside its index.html folder
 *   inserts/<slug>.pdf                   each bag insert
 *   sets/<set>.pdf                       each set's cards in order; a set with
 *                                        `layout: binder` opens with the binder's front
 *                                        matter (binder.ts)
 *   sets/<set>-sheet.pdf                 a set with `sheet:`: its cards several to a
 *                                        sheet, with crop marks (sheet.ts)
 *
 * The cards first: a set is assembled from its cards' PDFs (binder.ts), not drawn again.
 *
 * The file names are the views' `paths.pdfFile` (../paths.ts), the same the pages link.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { onPaper } from '../card-view.ts';
import { onCell } from '../sheet.ts';
import type { SetView, SiteData } from '../site-view.ts';
import { cardPdf, type CardView } from './card.ts';
import { setPdf, type FrontMatter } from './binder.ts';
import { sheetPdf } from './sheet.ts';

/** What the step reports, in the build's terms (phase 'steps', PDFs written of all). */
export type PdfProgress = (event: {
  readonly phase: 'steps';
  readonly done: number;
  readonly total: number;
}) => void;

export interface PdfFile {
  /** Site-relative path. */
  readonly file: string;
  readonly pages: number;
  readonly bytes: number;
  readonly ms: number;
}

export interface PdfReport {
  readonly files: readonly PdfFile[];
  readonly ms: number;
}

/** A set gets the binder's front matter when it says `layout: binder`. */
export function isBinderSet(set: Pick<SetView, 'binder'>): boolean {
  return set.binder;
}

/** A binder's method and troubleshooting pages, in the set's language. */
export function frontMatterOf(set: Pick<SetView, 'language'>, data: SiteData): FrontMatter {
  return (
    data.frontMatter?.[set.language] ?? {
      method: data.method,
      troubleshooting: data.troubleshooting,
    }
  );
}

/** The set's cards as views, in the set's order, laid out for the set's paper. */
export function setCards(set: SetView, data: SiteData): CardView[] {
  const byPdf = new Map<string, CardView>();
  for (const card of [...data.stationCards, ...data.insertCards])
    byPdf.set(card.paths.pdfFile, card);
  return set.cards.map((link) => {
    const card = byPdf.get(link.pdfFile);
    if (!card)
      throw new Error(`PDF: set "${set.id}" lists ${link.pdfFile}, which no card view has`);
    return onPaper(card, set.page.paper);
  });
}

/** A set's cards laid out for its sheet's cell (the set has `sheet:`), in the set's order. */
export function sheetCards(set: SetView, data: SiteData): CardView[] {
  const sheet = set.sheet;
  if (!sheet) throw new Error(`PDF: set "${set.id}" has no sheet`);
  return setCards(set, data).map((card) => onCell(card, sheet.geometry));
}

async function write(siteDir: string, file: string, bytes: Buffer): Promise<void> {
  const target = path.join(siteDir, file);
  await mkdir(path.dirname(target), { recursive: true });
  await writeFile(target, bytes);
}

/** Writes every card's PDF and every set's PDF into `siteDir`. */
export async function writeSitePdfs(
  siteDir: string,
  data: SiteData,
  onProgress: PdfProgress = () => {},
  env: NodeJS.ProcessEnv = process.env,
): Promise<PdfReport> {
  const started = performance.now();
  const author = data.site.businessName;
  const cards: CardView[] = [...data.stationCards, ...data.insertCards];
  const total = cards.length + data.sets.length + data.sets.filter((set) => set.sheet).length;
  const files: PdfFile[] = [];
  const cardPdfs = new Map<string, Uint8Array>();
  onProgress({ phase: 'steps', done: 0, total });
  for (const card of cards) {
    const t = performance.now();
    const pdf = await cardPdf(card, { author, env });
    cardPdfs.set(card.paths.pdfFile, pdf.bytes);
    await write(siteDir, card.paths.pdfFile, pdf.bytes);
    files.push({
      file: card.paths.pdfFile,
      pages: 1,
      bytes: pdf.bytes.length,
      ms: performance.now() - t,
    });
    onProgress({ phase: 'steps', done: files.length, total });
  }
  for (const set of data.sets) {
    const t = performance.now();
    const members = setCards(set, data);
    const pdf = await setPdf({
      set,
      cards: members,
      // A set on other paper than the site's draws its cards again at that paper.
      cardPdfs: await Promise.all(
        members.map(async (card) =>
          card.page.paper === data.site.page.paper
            ? cardPdfs.get(card.paths.pdfFile)!
            : (await cardPdf(card, { author, env })).bytes,
        ),
      ),
      frontMatter: isBinderSet(set) ? frontMatterOf(set, data) : null,
      page: set.page,
      author,
      builtOn: data.site.builtOn,
      env,
      brand: data.site.brand,
    });
    await write(siteDir, set.paths.pdfFile, pdf.bytes);
    files.push({
      file: set.paths.pdfFile,
      pages: pdf.pages,
      bytes: pdf.bytes.length,
      ms: performance.now() - t,
    });
    onProgress({ phase: 'steps', done: files.length, total });
  }
  for (const set of data.sets) {
    if (!set.sheet) continue;
    const t = performance.now();
    const pdf = await sheetPdf({
      set: { id: set.id, lang: set.lang },
      sheet: set.sheet,
      cards: sheetCards(set, data),
      author,
      builtOn: data.site.builtOn,
      env,
    });
    await write(siteDir, set.sheet.pdfFile, pdf.bytes);
    files.push({
      file: set.sheet.pdfFile,
      pages: pdf.pages,
      bytes: pdf.bytes.length,
      ms: performance.now() - t,
    });
    onProgress({ phase: 'steps', done: files.length, total });
  }
  return { files, ms: performance.now() - started };
}

/** buildSite's extra step (generator/pipeline/build-site.ts BuildStep). */
export async function pdfBuildStep(context: {
  readonly siteDir: string;
  readonly data: SiteData;
  readonly onProgress: PdfProgress;
}): Promise<void> {
  await writeSitePdfs(context.siteDir, context.data, context.onProgress);
}
