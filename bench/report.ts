/**
 * The benchmark's measurements and its printed table: one row per build, per-stage time
 * per card of the full build, and the ratios against their targets (restated in issue 14:
 * rebuild/ideal, the session rebuild's seconds, full/floor, per-card times).
 */
import { availableParallelism, loadavg } from 'node:os';
import { resourceUsage } from 'node:process';
import type { BuildResult } from '../generator/pipeline/build-site.ts';
import type { BuildStats } from '../generator/pipeline/stats.ts';
import type { CatalogueSize } from './catalogue.ts';
import type { SetSize, StrictFloor } from './floors.ts';

export interface Measured {
  readonly name: string;
  readonly wallMs: number;
  /** CPU time of the whole process (every thread), user + system. */
  readonly cpuMs: number;
  readonly result: BuildResult;
  /** Highest process RSS sampled during the build (worker threads included). */
  readonly peakRssBytes: number;
}

/** Samples process.memoryUsage.rss() every `everyMs` until stopped. */
export function memorySampler(everyMs = 50): { stop(): void; peakBytes(): number } {
  let peak = process.memoryUsage.rss();
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage.rss());
  }, everyMs);
  return {
    stop() {
      clearInterval(timer);
      peak = Math.max(peak, process.memoryUsage.rss());
    },
    peakBytes: () => peak,
  };
}

export const TARGETS = {
  /** rebuild / ideal, ideal = (cards the edit affects / all cards) × the full build's wall time. */
  rebuildOverIdeal: 1.3,
  /** A one-coffee rebuild in a --serve session, wall seconds (on 1,000 cards). */
  sessionRebuildS: 1.5,
  fullOverFloor: 1.3,
  /** Per card, thread time, ms. */
  planMs: 8,
  viewMs: 6,
  cardPdfMs: 20,
  /** A set's PDF against the same cards drawn afresh into one document, bytes. */
  setPdfOverFresh: 1.15,
} as const;

const mb = (bytes: number): string => `${(bytes / 2 ** 20).toFixed(0)} MB`;
const s = (ms: number): string => `${(ms / 1000).toFixed(1)} s`;
const per = (ms: number, n: number): string => (n > 0 ? `${(ms / n).toFixed(1)} ms` : '—');

function row(cells: readonly string[], widths: readonly number[]): string {
  return cells
    .map((cell, i) => (i === 0 ? cell.padEnd(widths[i]!) : cell.padStart(widths[i]!)))
    .join('  ');
}

function phases(stats: BuildStats): string {
  const w = stats.wallMs;
  return (['load', 'plan', 'render', 'write', 'steps', 'swap'] as const)
    .map((phase) => `${phase} ${s(w[phase] ?? 0)}`)
    .join(', ');
}

export interface Report {
  readonly size: CatalogueSize;
  readonly layout: string;
  readonly pdfStep: string;
  readonly inserts: number;
  readonly sets: number;
  readonly full: Measured;
  readonly floor: Measured;
  readonly rebuild: Measured;
  readonly noop: Measured;
  /** The last of a --serve session's one-coffee rebuilds (one pool kept across them). */
  readonly session: Measured;
  /** Bare pages through the same layout and bare PDFs in the same fonts (floors.ts). */
  readonly strict: StrictFloor;
  readonly sizes: readonly SetSize[];
}

export function formatTable(report: Report): string {
  const { full, floor, rebuild, noop, session } = report;
  const runs = [full, floor, rebuild, noop, session];
  const head = [
    'build',
    'wall',
    'CPU',
    'plans made/cached',
    'views made/cached',
    'pages',
    'PDFs made/copied (pages)',
    'peak RSS',
  ];
  const rows = runs.map((m) => {
    const st = m.result.stats;
    return [
      m.name,
      s(m.wallMs),
      s(m.cpuMs),
      `${st.plans.made}/${st.plans.reused}`,
      `${st.views.made}/${st.views.reused}`,
      `${st.pages.made}`,
      `${st.pdfs.made}/${st.pdfs.reused} (${st.pdfs.pdfPages})`,
      mb(m.peakRssBytes),
    ];
  });
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const st = full.result.stats;
  const fullOverFloor = full.wallMs / floor.wallMs;
  const { strict, sizes } = report;
  const fullOverStrict = full.wallMs / strict.wallMs;
  const setRatio = (z: SetSize) => z.assembledBytes / Math.max(1, z.freshBytes);
  const worstSet = Math.max(...sizes.map(setRatio));
  const kB = (bytes: number) => `${(bytes / 1024).toFixed(0)} kB`;
  // The cards an edit affects are the ones whose view is made again; all = the full build's.
  const ideal = (m: Measured) =>
    (m.result.stats.views.made / Math.max(1, st.views.made)) * full.wallMs;
  const rebuildOverIdeal = rebuild.wallMs / ideal(rebuild);
  const sessionOverIdeal = session.wallMs / ideal(session);
  const perCard = (ms: number, n: number) => (n > 0 ? ms / n : NaN);
  const planMs = perCard(st.plans.ms, st.plans.made);
  const viewMs = perCard(st.views.ms, st.views.made);
  const pdfMs = perCard(st.pdfs.ms, st.pdfs.made);
  const cpuRatios = `CPU time: full/floor ${(full.cpuMs / floor.cpuMs).toFixed(2)}, rebuild/full ${(rebuild.cpuMs / full.cpuMs).toFixed(3)}, rebuild/full wall ${(rebuild.wallMs / full.wallMs).toFixed(3)}`;
  const verdict = (value: number, target: number) => (value <= target ? 'met' : 'above target');
  const { size } = report;
  return [
    '',
    `stovecard bench: ${size.pots} pots × ${size.coffees} coffees × ${size.stoves} stoves = ` +
      `${full.result.stationCards} station cards + ${report.inserts} inserts, ${report.sets} sets (${report.layout}); ` +
      `${st.workers} worker threads; PDF step ${report.pdfStep}`,
    '',
    row(head, widths),
    row(
      head.map((h) => '-'.repeat(h.length)),
      widths,
    ),
    ...rows.map((r) => row(r, widths)),
    '',
    'phases (wall):',
    ...runs.map((m) => `  ${m.name}: ${phases(m.result.stats)}`),
    '',
    'full build, per item (thread time, summed over workers):',
    `  plan   ${per(st.plans.ms, st.plans.made)} per card, ${(st.plans.simulations / Math.max(1, st.plans.made)).toFixed(1)} simulations per card, ${per(st.plans.ms, st.plans.simulations)} per simulation`,
    `  views  ${per(st.views.ms, st.views.made)} per card (chart, cross-section, QR code, words)`,
    `  HTML   ${per(st.pages.ms, st.pages.made)} per page (Eleventy, wall)`,
    `  PDF    ${per(st.pdfs.ms, st.pdfs.made)} per file, ${per(st.pdfs.ms, st.pdfs.pdfPages)} per page (${st.pdfs.pdfPages} pages in ${st.pdfs.made} files)`,
    `  peak RSS ${mb(Math.max(...runs.map((m) => m.peakRssBytes)))} sampled; process maxRSS ${mb(resourceUsage().maxRSS * 1024)}`,
    '',
    `rebuild/ideal = ${rebuildOverIdeal.toFixed(2)}  (target ≤ ${TARGETS.rebuildOverIdeal}: ${verdict(rebuildOverIdeal, TARGETS.rebuildOverIdeal)}; ideal ${s(ideal(rebuild))} = ${rebuild.result.stats.views.made}/${st.views.made} cards × full; new workers, as \`stovecard build\`)`,
    `session/ideal = ${sessionOverIdeal.toFixed(2)}  (warm workers, as \`stovecard build --serve\`; ideal ${s(ideal(session))})`,
    `session rebuild = ${(session.wallMs / 1000).toFixed(2)} s (target ≤ ${TARGETS.sessionRebuildS} s on 1,000 cards: ` +
      (full.result.stationCards >= 1000
        ? `${verdict(session.wallMs / 1000, TARGETS.sessionRebuildS)})`
        : `not judged on ${full.result.stationCards} station cards; run --cards 1000)`),
    `full/floor    = ${fullOverFloor.toFixed(2)}  (target ≤ ${TARGETS.fullOverFloor}: ${verdict(fullOverFloor, TARGETS.fullOverFloor)})`,
    `full/strict   = ${fullOverStrict.toFixed(2)}  (no target set; strict floor ${s(strict.wallMs)}: ${strict.pages} bare pages through the same layout ${s(strict.pagesMs)}, ${strict.pdfs} bare one-page PDFs in the same fonts ${s(strict.pdfsMs)}; floor/strict ${(floor.wallMs / strict.wallMs).toFixed(2)})`,
    `set PDF/fresh = ${worstSet.toFixed(2)}  (target ≤ ${TARGETS.setPdfOverFresh}: ${verdict(worstSet, TARGETS.setPdfOverFresh)}; the larger of ${sizes.map((z) => `${z.set} ${z.cards} cards ${kB(z.assembledBytes)} assembled / ${kB(z.freshBytes)} drawn afresh = ${setRatio(z).toFixed(2)}`).join(', ')})`,
    `per card      plan ${planMs.toFixed(1)} ms (≤ ${TARGETS.planMs}: ${verdict(planMs, TARGETS.planMs)}), view ${viewMs.toFixed(1)} ms (≤ ${TARGETS.viewMs}: ${verdict(viewMs, TARGETS.viewMs)}), card PDF ${pdfMs.toFixed(1)} ms (≤ ${TARGETS.cardPdfMs}: ${verdict(pdfMs, TARGETS.cardPdfMs)})`,
    `machine load  ${loadavg()
      .map((l) => l.toFixed(1))
      .join(' / ')} (1, 5, 15 min) on ${availableParallelism()} cores at the end of the run`,
    `(${cpuRatios}; wall time is what the targets are about, CPU time moves less with the machine's load)`,
    '',
  ].join('\n');
}
