/**
 * The site's PDFs as a build step, incremental and on the worker pool: the same files and
 * bytes as the PDF module's own step (render/pdf/site-pdfs.ts, writeSitePdfs), made with
 * the same pure cores (cardPdf, setPdf, setCards, isBinderSet), but
 *
 *   - each PDF is keyed by the hashes of the views it is drawn from (render-cache.ts); a
 *     key already in the cache is copied from there instead of made;
 *   - the cards come first, then the sets: a set is assembled from its cards' PDFs as the
 *     site now has them (binder.ts, merge.ts), so a rebuild after one coffee's edit draws
 *     only that coffee's cards and re-assembles the sets that hold them;
 *   - the rest are made on the build's workers (a set's worker reads its cards' files);
 *   - the PDF dates follow the build's env (BuildOptions.env), like the pages.
 *
 *   card views ─ key ─▶ cached? ── yes ─▶ copy <cacheDir>/pdfs/<key>.pdf into the site
 *                                └─ no ──▶ cardPdf (pool) ─▶ the site and the cache
 *   then sets  ─ key ─▶ cached? ── yes ─▶ copy
 *                                └─ no ──▶ assembleSet of the site's card PDFs (pool) ─▶ site, cache
 *   then sheets ─ key ─▶ cached? ── yes ─▶ copy
 *                                └─ no ──▶ sheetPdf of the cards laid out for a cell (pool)
 *
 * A set is assembled from its cards' pages in the set's object form, cached beside each
 * card PDF (set-assembly.ts, `<key>.page.json`): after an edit only the new cards' pages
 * are converted, the rest is a concatenation. The new segments the workers made are
 * cached here.
 */
import { mkdir, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { cardPdf, type CardView } from '../render/pdf/card.ts';
import { setCard, type SetPdfInput } from '../render/pdf/binder.ts';
import { sheetPdf, type SheetPdfInput } from '../render/pdf/sheet.ts';
import { frontMatterOf, isBinderSet, setCards, sheetCards } from '../render/pdf/site-pdfs.ts';
import type { BuildContext, ViewText } from './build-site.ts';
import { renderCodeVersion } from './code-version.ts';
import { allSettledOrThrow, IO_LIMIT, mapConcurrent } from './concurrent.ts';
import {
  cardPdfKey,
  RenderCache,
  setPdfKey,
  setShellKey,
  sha256,
  sheetPdfKey,
} from './render-cache.ts';
import { toTaggedJson } from './plan-cache.ts';
import { assembleSet, PAGE_SEGMENT_EXT, SET_SHELL_EXT, type AssembledSet } from './set-assembly.ts';
import { FileCache } from './file-cache.ts';

/** Scratch folder of the site for the cards of sets on their own paper (removed after). */
const SET_CARDS_DIR = '.set-paper-cards';

interface PdfJob {
  readonly file: string;
  /** How the build log names it (the file, or the set and card of a set-paper card). */
  readonly label: string;
  readonly key: string;
  /**
   * Card PDFs: the optional blocks left out are noted (stats.dropped), as a list of blocks;
   * sheet PDFs: the same for each of their cards, as a list of { card, blocks }.
   */
  readonly notes: 'card' | 'sheet' | null;
  render(): Promise<{
    bytes: Uint8Array;
    pages: number;
    ms: number;
    /** The cache note's text (notes: the JSON the cache keeps beside the PDF). */
    note?: string;
  }>;
}

type SheetNote = readonly { readonly card: string; readonly blocks: readonly string[] }[];

/** The build log's entries of a card's or a sheet's note (stats.dropped). */
function droppedOf(job: PdfJob, note: string): { pdf: string; blocks: readonly string[] }[] {
  if (job.notes === 'card') {
    const blocks = JSON.parse(note) as string[];
    return blocks.length > 0 ? [{ pdf: job.label, blocks }] : [];
  }
  if (job.notes === 'sheet')
    return (JSON.parse(note) as SheetNote).map(({ card, blocks }) => ({
      pdf: `${job.label} (${card} in its cell)`,
      blocks,
    }));
  return [];
}

export async function sitePdfStep(context: BuildContext): Promise<void> {
  const { data, siteDir, pool, stats } = context;
  const cache = new RenderCache(context.cacheDir);
  const renderVersion = await renderCodeVersion();
  const author = data.site.businessName;
  // Of the environment, a PDF reads only the date setting (render/pdf/document.ts pdfDate).
  const epoch = context.env.SOURCE_DATE_EPOCH;
  const env: NodeJS.ProcessEnv = epoch === undefined ? {} : { SOURCE_DATE_EPOCH: epoch };
  const sitePaper = data.site.page.paper;
  const textOf = (card: CardView): ViewText => {
    // A card re-laid for a set's own paper is another view than the site's card.
    const known =
      card.page.paper === sitePaper ? context.viewTexts.get(card.paths.pdfFile) : undefined;
    if (known) return known;
    const text = toTaggedJson(card);
    return { text, hash: sha256(text) };
  };
  const hashOf = (card: CardView) => textOf(card).hash;

  const cards: CardView[] = [...data.stationCards, ...data.insertCards];
  const keyOf = (view: CardView) =>
    cardPdfKey({ viewHash: hashOf(view), author, sourceDateEpoch: epoch, renderVersion });
  // Card pages in the set's object form, beside their PDFs (set-assembly.ts).
  const segments = new FileCache(cache.pdfs.dir, PAGE_SEGMENT_EXT);
  const shells = new FileCache(cache.pdfs.dir, SET_SHELL_EXT);
  const segmentsPut = new Set<string>();
  const cacheParts = async (made: AssembledSet) => {
    for (const { key, text } of made.madeSegments) {
      if (segmentsPut.has(key)) continue;
      segmentsPut.add(key);
      await segments.put(key, text);
    }
    if (made.madeShell) await shells.put(made.madeShell.key, made.madeShell.bytes);
  };
  const cardJob = (view: CardView, file: string, label = file): PdfJob => ({
    file,
    label,
    notes: 'card',
    key: keyOf(view),
    async render() {
      if (pool) {
        const { result, ms } = await pool.run({
          kind: 'card-pdf',
          viewJson: textOf(view).text,
          context: { author, env },
        });
        return { bytes: result.bytes, pages: 1, ms, note: JSON.stringify(result.dropped) };
      }
      const started = performance.now();
      const pdf = await cardPdf(view, { author, env });
      const note = JSON.stringify(pdf.fit.dropped ?? []);
      return { bytes: pdf.bytes, pages: 1, ms: performance.now() - started, note };
    },
  });
  const cardJobs: PdfJob[] = cards.map((view) => cardJob(view, view.paths.pdfFile));
  // Cards of a set on other paper than the site's: drawn at that paper into a scratch
  // folder of the site (removed once the sets are made), once per set paper and card.
  const setPaperJobs = new Map<string, PdfJob>();
  const setPaperFile = (card: CardView) =>
    path.join(SET_CARDS_DIR, card.page.paper, card.paths.pdfFile);
  const setJobs: PdfJob[] = data.sets.map((set) => {
    const members = setCards(set, data);
    const input: Omit<SetPdfInput, 'cardPdfs' | 'cardSegments'> = {
      set,
      cards: members.map(setCard),
      frontMatter: isBinderSet(set) ? frontMatterOf(set, data) : null,
      page: set.page,
      author,
      builtOn: data.site.builtOn,
      env,
      brand: data.site.brand,
    };
    // The set's sheet is a PDF of its own (below): a new `sheet:` keeps the set's PDF.
    const setOwn = { ...set, sheet: null };
    // Counted as used (the sweep keeps them) in this thread, whoever reads them, so an edit
    // a week on still finds the set's other pages converted.
    const segmentKeys = members.map(keyOf);
    for (const key of segmentKeys) segments.file(key);
    // What the set's PDF and its shell are both keyed by: all the set reads but its cards.
    const keyed = {
      set: setOwn,
      frontMatter: input.frontMatter,
      page: input.page,
      author,
      builtOn: input.builtOn,
      sourceDateEpoch: epoch,
      renderVersion,
      brand: input.brand ?? null,
    };
    const shellKey = setShellKey({ ...keyed, cards: input.cards });
    shells.file(shellKey);
    const cardFiles = members.map((card) => {
      if (card.page.paper === sitePaper) return path.join(siteDir, card.paths.pdfFile);
      const file = setPaperFile(card);
      const label = `${set.paths.pdfFile} (${card.paths.pdfFile} on ${card.page.paper})`;
      if (!setPaperJobs.has(file)) setPaperJobs.set(file, cardJob(card, file, label));
      return path.join(siteDir, file);
    });
    return {
      file: set.paths.pdfFile,
      label: set.paths.pdfFile,
      notes: null,
      key: setPdfKey({ ...keyed, cardHashes: members.map(hashOf) }),
      async render() {
        const source = { dir: segments.dir, keys: segmentKeys, shellKey };
        let made: AssembledSet;
        let ms: number;
        if (pool) {
          const timed = await pool.run({ kind: 'set-pdf', input, cardFiles, segments: source });
          made = timed.result;
          ms = timed.ms;
        } else {
          const started = performance.now();
          made = await assembleSet(input, cardFiles, source);
          ms = performance.now() - started;
        }
        await cacheParts(made);
        return { bytes: made.bytes, pages: made.pages, ms };
      },
    };
  });

  // Sets with `sheet:`: their cards laid out again for the sheet's cell and drawn several to
  // a page (render/pdf/sheet.ts), keyed like the set's PDF by its cards' views.
  const sheetJobs: PdfJob[] = data.sets.flatMap((set) => {
    const sheet = set.sheet;
    if (!sheet) return [];
    const members = setCards(set, data);
    const input: Omit<SheetPdfInput, 'cards'> = {
      set: { id: set.id, lang: set.lang },
      sheet,
      author,
      builtOn: data.site.builtOn,
      env,
    };
    const job: PdfJob = {
      file: sheet.pdfFile,
      label: sheet.pdfFile,
      notes: 'sheet',
      key: sheetPdfKey({
        set: input.set,
        sheet,
        cardHashes: members.map(hashOf),
        author,
        builtOn: input.builtOn,
        sourceDateEpoch: epoch,
        renderVersion,
      }),
      async render() {
        const cells = sheetCards(set, data);
        if (pool) {
          const viewsJson = cells.map((view) => toTaggedJson(view));
          const { result, ms } = await pool.run({ kind: 'sheet-pdf', input, viewsJson });
          return {
            bytes: result.bytes,
            pages: result.pages,
            ms,
            note: JSON.stringify(result.dropped),
          };
        }
        const started = performance.now();
        const pdf = await sheetPdf({ ...input, cards: cells });
        const note = JSON.stringify(pdf.dropped);
        return { bytes: pdf.bytes, pages: pdf.pages, ms: performance.now() - started, note };
      },
    };
    return [job];
  });

  const total = cardJobs.length + setPaperJobs.size + setJobs.length + sheetJobs.length;
  let done = 0;
  context.onProgress({ phase: 'steps', done, total });
  const folders = new Set(
    [...cardJobs, ...setPaperJobs.values(), ...setJobs, ...sheetJobs].map((job) =>
      path.dirname(path.join(siteDir, job.file)),
    ),
  );
  await Promise.all([...folders].map((folder) => mkdir(folder, { recursive: true })));

  /** Copies the cached jobs into the site and makes the others. */
  const run = async (jobs: readonly PdfJob[]) => {
    // Cache lookups first: every hit is copied, and the misses are queued at once, in order.
    const copied = await mapConcurrent(jobs, IO_LIMIT, async (job) => {
      const hit = await cache.pdfs.copyTo(job.key, path.join(siteDir, job.file));
      if (hit) {
        if (job.notes) {
          const note = await cache.pdfNotes.getText(job.key);
          if (note !== null) stats.dropped.push(...droppedOf(job, note));
        }
        stats.pdfs.reused += 1;
        context.onProgress({ phase: 'steps', done: ++done, total });
      }
      return hit;
    });
    const misses = jobs.filter((_, i) => !copied[i]);
    const make = async (job: PdfJob) => {
      let made;
      try {
        made = await job.render();
      } catch (error) {
        pool?.clearQueue();
        throw error;
      }
      const { bytes, pages, ms } = made;
      await writeFile(path.join(siteDir, job.file), bytes);
      await cache.pdfs.put(job.key, bytes);
      if (job.notes && made.note !== undefined) {
        await cache.pdfNotes.put(job.key, made.note);
        stats.dropped.push(...droppedOf(job, made.note));
      }
      stats.pdfs.made += 1;
      stats.pdfs.pdfPages += pages;
      stats.pdfs.ms += ms;
      context.onProgress({ phase: 'steps', done: ++done, total });
    };
    // On workers all at once (the pool queues them); in this thread one document at a time.
    if (pool) await allSettledOrThrow(misses.map(make));
    else for (const job of misses) await make(job);
  };
  await run(cardJobs);
  await run([...setPaperJobs.values()]);
  await run(setJobs);
  await run(sheetJobs);
  await rm(path.join(siteDir, SET_CARDS_DIR), { recursive: true, force: true });
}
