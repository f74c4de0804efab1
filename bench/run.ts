/**
 * `npm run bench [-- --cards N] [--sets by-stove|by-coffee] [--workers N] [--pdf-step site|module]
 * [--seed S] [--keep]`: the site build under a roaster's load, in one process, on a
 * synthetic catalogue (bench/catalogue.ts; 1,000 station cards by default) in a temporary
 * folder:
 *
 *   full      a cold cache: every plan, view, page and PDF made
 *   floor     the same site again with every plan and view (chart, cross-section, QR code,
 *             words) from the warm cache, and every HTML page and PDF (cards and sets)
 *             rendered: the pages and PDFs with no simulation and no chart behind them
 *   strict    bare pages through the same layout and bare one-page PDFs in the same fonts
 *             (bench/floors.ts), with no card on them
 *   rebuild   one coffee's permeability changed by 10 %, everything else cached, in a new
 *             pool of workers (as `stovecard build` after an edit)
 *   no-op     nothing changed
 *   session   three more one-coffee edits, each rebuilt on one pool kept across them (as
 *             `stovecard build --serve` does); the table shows the last
 *
 * Each build is buildSite with a PDF step as its extra step, as `stovecard build` runs it:
 * `site` (default), the build's incremental step on the workers (generator/pipeline/pdf-step.ts),
 * or `module`, the PDF module's own step (render/pdf/site-pdfs.ts pdfBuildStep: every PDF,
 * in one thread; its PDFs are not counted in the table). Prints a table and each target
 * of issue 14 as a ratio beside its target (bench/report.ts), and the size of the first
 * station set's and the insert set's PDFs against the same cards drawn afresh. Timings are
 * only compared within one run (shared machine). Workers start from dist/ when it is up to
 * date (pool.ts), as under `stovecard build`; `npm run bench` compiles it first.
 * For a CPU profile: `node --cpu-prof --cpu-prof-dir=prof --import tsx bench/run.ts
 * --cards 200`, then `npx tsx bench/profile-summary.ts prof/<file>.cpuprofile`.
 */
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { availableParallelism, tmpdir } from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { buildSite, type BuildResult, type BuildStep } from '../generator/pipeline/build-site.ts';
import { expandCards } from '../generator/pipeline/cards.ts';
import { sitePdfStep } from '../generator/pipeline/pdf-step.ts';
import { WorkerPool } from '../generator/pipeline/pool.ts';
import { loadCatalogue } from '../generator/content/index.ts';
import { pdfBuildStep } from '../generator/render/pdf/site-pdfs.ts';
import { freshCompiledWorker } from '../generator/pipeline/pool.ts';
import { DEFAULT_SIZE, sizeForCards, stationCount, writeCatalogue } from './catalogue.ts';
import { setSizes, strictFloor } from './floors.ts';
import { formatTable, memorySampler, type Measured } from './report.ts';

const EPOCH = { SOURCE_DATE_EPOCH: '1714521600' };

interface Run {
  readonly root: string;
  readonly contentDir: string;
  readonly workers: number;
  readonly pdfStep: BuildStep;
  /** A pool kept across builds (the session); default a new one per build. */
  readonly pool?: WorkerPool;
}

async function measured(name: string, run: Run): Promise<Measured> {
  const memory = memorySampler();
  const cpu = process.cpuUsage();
  const started = performance.now();
  let result: BuildResult;
  try {
    result = await buildSite({
      contentDir: run.contentDir,
      outDir: path.join(run.root, 'site'),
      cacheDir: path.join(run.root, 'cache'),
      env: EPOCH,
      workers: run.workers,
      ...(run.pool ? { pool: run.pool } : {}),
      extraSteps: [run.pdfStep],
    });
  } finally {
    memory.stop();
  }
  const wallMs = performance.now() - started;
  const used = process.cpuUsage(cpu);
  const cpuMs = (used.user + used.system) / 1000;
  process.stderr.write(`  ${name}: ${(wallMs / 1000).toFixed(1)} s\n`);
  return { name, wallMs, cpuMs, result, peakRssBytes: memory.peakBytes() };
}

/** Changes one coffee's permeability by 10 %: a real edit, re-planning its cards. */
async function editCoffee(contentDir: string, coffeeId: string): Promise<void> {
  const file = path.join(contentDir, 'coffees', `${coffeeId}.yaml`);
  const yaml = await readFile(file, 'utf8');
  const edited = yaml.replace(/^permeability_m2: (.*)$/m, (_line, value: string) => {
    return `permeability_m2: ${(Number(value) * 1.1).toPrecision(3)}`;
  });
  if (edited === yaml) throw new Error(`bench: ${file} has no permeability_m2 to edit`);
  await writeFile(file, edited);
}

async function main(): Promise<void> {
  const { values } = parseArgs({
    options: {
      cards: { type: 'string' },
      workers: { type: 'string' },
      seed: { type: 'string' },
      sets: { type: 'string' },
      'pdf-step': { type: 'string' },
      keep: { type: 'boolean' },
    },
  });
  const size = values.cards ? sizeForCards(Number(values.cards)) : DEFAULT_SIZE;
  const workers = values.workers !== undefined ? Number(values.workers) : availableParallelism();
  const seed = values.seed !== undefined ? Number(values.seed) : 1;
  const layout = values.sets ?? 'by-stove';
  if (layout !== 'by-stove' && layout !== 'by-coffee') {
    throw new Error(`bench: --sets is by-stove or by-coffee, not "${layout}"`);
  }
  const stepName = values['pdf-step'] ?? 'site';
  const steps: Record<string, BuildStep> = { site: sitePdfStep, module: pdfBuildStep };
  const pdfStep = steps[stepName];
  if (!pdfStep) throw new Error(`bench: --pdf-step is site or module, not "${stepName}"`);
  const root = await mkdtemp(path.join(tmpdir(), 'stovecard-bench-'));
  const contentDir = path.join(root, 'content');
  try {
    const ids = await writeCatalogue(contentDir, size, seed, layout);
    // The real loader validates every file (it throws with file:line on any problem).
    const catalogue = await loadCatalogue(contentDir);
    const jobs = expandCards(catalogue);
    process.stderr.write(
      `stovecard bench: ${size.pots} pots × ${size.coffees} coffees × ${size.stoves} stoves = ` +
        `${stationCount(size)} station cards, ${jobs.inserts.length} inserts, ` +
        `${jobs.sets.length} sets (${layout}); ${workers} workers ` +
        `(${freshCompiledWorker() ? 'from dist/' : 'through tsx: dist/ is stale'}); PDF step ${stepName}; ${root}\n`,
    );
    const run: Run = { root, contentDir, workers, pdfStep };
    const full = await measured('full', run);
    const sizes = await setSizes(
      full.result,
      path.join(root, 'site'),
      [jobs.sets.find((set) => set.layout === 'station')?.id ?? '', 'shipping-inserts'],
      EPOCH,
    );
    const strict = await strictFloor(full.result, root, workers, EPOCH);
    process.stderr.write(`  strict floor: ${(strict.wallMs / 1000).toFixed(1)} s\n`);
    // The floor: plans and views stay cached; pages and PDFs are rendered again.
    await rm(path.join(root, 'cache', 'pdfs'), { recursive: true, force: true });
    await rm(path.join(root, 'cache', 'pages'), { recursive: true, force: true });
    const floor = await measured('floor', run);
    const edited = ids.coffees[Math.min(6, ids.coffees.length - 1)]!;
    await editCoffee(contentDir, edited);
    const rebuild = await measured(`rebuild (${edited})`, run);
    const noop = await measured('no-op rebuild', run);
    // A --serve session: one pool for three edits; the first starts the workers.
    const pool = new WorkerPool({ size: workers });
    let session: Measured | null = null;
    try {
      for (const index of [8, 9, 10]) {
        const coffee = ids.coffees[Math.min(index, ids.coffees.length - 1)]!;
        await editCoffee(contentDir, coffee);
        session = await measured(`session rebuild (${coffee})`, { ...run, pool });
      }
    } finally {
      await pool.close();
    }
    process.stdout.write(
      `${formatTable({ size, layout, pdfStep: stepName, inserts: jobs.inserts.length, sets: jobs.sets.length, full, floor, rebuild, noop, session: session!, strict, sizes })}\n`,
    );
  } finally {
    if (values.keep) process.stderr.write(`kept ${root}\n`);
    else await rm(root, { recursive: true, force: true });
  }
}

await main();
