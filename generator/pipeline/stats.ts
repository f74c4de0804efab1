/**
 * What a build did and where its time went, for the summary, the tests (what was
 * re-rendered) and the benchmark (time per stage per card). Counts are items; `ms` sums
 * the time spent on each item in whichever thread did it (so with workers it can exceed
 * the wall time); `wallMs` is the time each phase of buildSite took from start to end.
 */
import type { BuildPhase } from './progress.ts';

export interface StageCount {
  /** Items made in this build. */
  made: number;
  /** Items taken from the cache. */
  reused: number;
  /** Time spent making them, summed over threads, ms. */
  ms: number;
}

export interface BuildStats {
  /** Station plans (a made plan is a planCard call). */
  readonly plans: StageCount & { simulations: number };
  /** Station card views (chart, cross-section, QR code, words). */
  readonly views: StageCount;
  /** HTML pages: made by Eleventy, or reused from the page cache. */
  readonly pages: StageCount;
  /** PDF files: cards and sets (`pdfPages` counts the pages of the rendered ones). */
  readonly pdfs: StageCount & { pdfPages: number };
  /** Wall time of each phase, ms. */
  readonly wallMs: Partial<Record<BuildPhase, number>>;
  /** Worker threads started (0: everything ran in the build's own thread). */
  workers: number;
  /** Cache files deleted by the build's sweep (file-cache.ts sweepCacheFolders). */
  cacheFilesDeleted: number;
  /**
   * Card PDFs that left out optional blocks to keep every text at the floor (render/pdf/
   * card.ts OPTIONAL_ORDER), with the blocks, for the build log.
   */
  readonly dropped: { readonly pdf: string; readonly blocks: readonly string[] }[];
}

export function emptyStats(): BuildStats {
  const count = (): StageCount => ({ made: 0, reused: 0, ms: 0 });
  return {
    plans: { ...count(), simulations: 0 },
    views: count(),
    pages: count(),
    pdfs: { ...count(), pdfPages: 0 },
    wallMs: {},
    workers: 0,
    cacheFilesDeleted: 0,
    dropped: [],
  };
}

/** Runs `work` and adds its wall time to `stats.wallMs[phase]`. */
export async function timedPhase<T>(
  stats: BuildStats,
  phase: BuildPhase,
  work: () => Promise<T>,
): Promise<T> {
  const started = performance.now();
  try {
    return await work();
  } finally {
    stats.wallMs[phase] = (stats.wallMs[phase] ?? 0) + performance.now() - started;
  }
}
