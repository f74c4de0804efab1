/**
 * `npx tsx bench/session.ts [--cards N] [--root DIR] [--reuse] [--edits 8,9,10,11]`: only
 * the bench's `--serve` scenario, with a timeline. On the synthetic catalogue of
 * bench/catalogue.ts (sets by stove) in DIR (a new temporary folder by default): a full
 * build (skipped with --reuse, on a DIR a run before left), then one one-coffee edit per
 * --edits index, each rebuilt on one pool kept across them (the first starts the
 * workers). Prints each build's wall and CPU time (every thread of the process) and
 * phases, and for each rebuild but the first the times at which its phases started and
 * its PDFs finished: the last ones are the sets, which wait for their cards. The folder
 * is kept (for --reuse, or a CPU profile: `node --cpu-prof --cpu-prof-dir=prof --import
 * tsx bench/session.ts --reuse --root DIR`). Timings: compare within one run.
 */
import { mkdtemp, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { buildSite } from '../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../generator/pipeline/pdf-step.ts';
import { WorkerPool } from '../generator/pipeline/pool.ts';
import { sizeForCards, writeCatalogue } from './catalogue.ts';

const EPOCH = { SOURCE_DATE_EPOCH: '1714521600' };

const { values } = parseArgs({
  options: {
    cards: { type: 'string' },
    root: { type: 'string' },
    reuse: { type: 'boolean' },
    edits: { type: 'string' },
    workers: { type: 'string' },
  },
});
const root = values.root ?? (await mkdtemp(path.join(tmpdir(), 'stovecard-session-')));
const contentDir = path.join(root, 'content');
const idsFile = path.join(root, 'ids.json');
let ids: { coffees: string[] };
if (values.reuse) ids = JSON.parse(await readFile(idsFile, 'utf8')) as typeof ids;
else {
  ids = await writeCatalogue(contentDir, sizeForCards(Number(values.cards ?? 1000)), 1, 'by-stove');
  await writeFile(idsFile, JSON.stringify(ids));
}

/** Changes one coffee's permeability by 10 % (as bench/run.ts does). */
async function editCoffee(coffeeId: string): Promise<void> {
  const file = path.join(contentDir, 'coffees', `${coffeeId}.yaml`);
  const yaml = await readFile(file, 'utf8');
  await writeFile(
    file,
    yaml.replace(/^permeability_m2: (.*)$/m, (_line, value: string) => {
      return `permeability_m2: ${(Number(value) * 1.1).toPrecision(3)}`;
    }),
  );
}

const workers = Number(values.workers ?? 2);
const pool = new WorkerPool({ size: workers });
const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

async function build(name: string, timeline: boolean): Promise<void> {
  const started = performance.now();
  const cpu = process.cpuUsage();
  const marks: string[] = [];
  let phase = '';
  const result = await buildSite({
    contentDir,
    outDir: path.join(root, 'site'),
    cacheDir: path.join(root, 'cache'),
    env: EPOCH,
    workers,
    pool,
    extraSteps: [sitePdfStep],
    onProgress: (event) => {
      const at = s(performance.now() - started);
      if (event.phase !== phase) marks.push(`  ${at}  ${event.phase}`);
      phase = event.phase;
      // The PDFs made: every one after the copied ones (the last 12 shown).
      if (event.phase === 'steps' && event.total > 0 && event.done > 0)
        marks.push(`  ${at}  PDF ${event.done}/${event.total}`);
    },
  });
  const used = process.cpuUsage(cpu);
  const st = result.stats;
  const phases = Object.entries(st.wallMs)
    .map(([key, ms]) => `${key} ${s(ms ?? 0)}`)
    .join(', ');
  process.stdout.write(
    `${name}: ${s(performance.now() - started)} wall, ${s((used.user + used.system) / 1000)} CPU; ${phases}; ` +
      `PDFs made ${st.pdfs.made}, copied ${st.pdfs.reused}\n`,
  );
  if (timeline) {
    const steps = marks.filter((m) => !m.includes('PDF '));
    process.stdout.write(
      `${[...steps, ...marks.filter((m) => m.includes('PDF ')).slice(-12)].join('\n')}\n`,
    );
  }
}

try {
  if (!values.reuse) await build('full', false);
  const edits = (values.edits ?? '8,9,10,11').split(',').map(Number);
  for (const [i, index] of edits.entries()) {
    const coffee = ids.coffees[Math.min(index, ids.coffees.length - 1)]!;
    await editCoffee(coffee);
    await build(`session rebuild ${i + 1} (${coffee})`, i > 0);
  }
} finally {
  await pool.close();
}
process.stdout.write(`kept ${root}\n`);
