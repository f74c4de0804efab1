/**
 * Paper per set and the readable floor, on the demo content with a `paper:` on each set:
 * every set PDF's pages have the set's paper size (read back by poppler's pdfinfo and by
 * pdfjs), and no text on any page of any PDF is set below 7 pt (the size pdfjs reports
 * for each text item: its text matrix's vertical scale, which includes the scaling of the
 * drawings and the chart). When a card does not fit at the floor, it leaves out optional
 * blocks in the documented order (render/pdf/card.ts OPTIONAL_ORDER: the chart first),
 * never its recipe or its cautions, and the build log says what it left out.
 *
 * Paper sizes: ISO 216 (A5 148 × 210 mm, A6 105 × 148 mm); US letter 8.5 × 11 in (ANSI
 * Y14.1, from memory); 4 × 6 in index and photo cards (common practice, no source);
 * 1 in = 72 pt (PDF 32000-1 default user space unit, 1/72 in).
 */
import { cp, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { OPTIONAL_ORDER } from '../../generator/render/pdf/card.ts';
import { droppedLines } from '../../generator/cli/build.ts';
import { BUILD_ENV } from '../browser/demo-builds.ts';
import { DEMO_CONTENT } from '../hostile/cli-run.ts';
import { describeWithTools, pdfinfoSizes } from './poppler.ts';
import { openPdf, smallestText, squash } from './read-pdf.ts';

const MM = 72 / 25.4;
const A5: [number, number] = [148 * MM, 210 * MM];
const A6: [number, number] = [105 * MM, 148 * MM];
const CARD_4X6: [number, number] = [4 * 72, 6 * 72];
const LETTER: [number, number] = [8.5 * 72, 11 * 72];
const FLOOR_PT = 7;

async function pdfsUnder(dir: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true, recursive: true }))
    if (entry.isFile() && entry.name.endsWith('.pdf'))
      out.push(path.join(entry.parentPath, entry.name));
  return out.sort();
}

let root: string;
let site: string;
let result: BuildResult;

describeWithTools(
  ['pdfinfo'],
  'paper per set and the 7 pt floor (demo with a paper on each set)',
  () => {
    beforeAll(async () => {
      root = await mkdtemp(path.join(tmpdir(), 'stovecard-paper-'));
      const content = path.join(root, 'content');
      await cp(DEMO_CONTENT, content, { recursive: true });
      const file = path.join(content, 'site.yaml');
      let yaml = await readFile(file, 'utf8');
      yaml = yaml
        .replace(/^paper: .*$/m, 'paper: A5')
        .replace('    layout: station\n', '    layout: station\n    paper: A6\n')
        .replace(/    layout: binder.*\n/, '    layout: binder\n    paper: 4x6in\n')
        .replace('    layout: insert\n', '    layout: insert\n    paper: letter\n');
      // An insert small enough for A6 at the floor: one pot on one stove.
      yaml += `
  - id: pocket-insert
    title: Pocket insert
    layout: insert
    paper: A6
    coffees: [house-blend]
    pots: [one-cup]
    stoves: [bar-gas]
`;
      await writeFile(file, yaml);
      site = path.join(root, 'site');
      result = await buildSite({
        contentDir: content,
        outDir: site,
        cacheDir: path.join(root, 'cache'),
        env: BUILD_ENV,
        workers: 1,
        extraSteps: [sitePdfStep],
      });
    }, 600_000);

    afterAll(async () => {
      if (root) await rm(root, { recursive: true, force: true });
    });

    it('gives each set PDF its own paper on every page (pdfinfo and pdfjs agree)', async () => {
      const expected: Record<string, [number, number]> = {
        'quorvel-bar': A6,
        'barista-training': CARD_4X6,
        'shipping-inserts': LETTER,
        'pocket-insert': A6,
      };
      for (const [id, size] of Object.entries(expected)) {
        const file = path.join(site, 'sets', `${id}.pdf`);
        const { pages } = await smallestText(await readFile(file));
        expect(pages.length, id).toBeGreaterThan(0);
        for (const [w, h] of [...pages, ...pdfinfoSizes(file, pages.length)]) {
          expect(w, id).toBeCloseTo(size[0], 1);
          expect(h, id).toBeCloseTo(size[1], 1);
        }
      }
      // The cards' own PDFs keep the site's paper.
      const card = path.join(site, 'cards', 'three-cup--house-blend--bar-gas.pdf');
      const [w, h] = pdfinfoSizes(card, 1)[0]!;
      expect(w).toBeCloseTo(A5[0], 1);
      expect(h).toBeCloseTo(A5[1], 1);
    });

    it('sets no text below 7 pt on any page of any PDF, the cautions and page numbers included', async () => {
      const files = await pdfsUnder(site);
      expect(files.length).toBeGreaterThan(50);
      let smallest = Number.POSITIVE_INFINITY;
      for (const file of files) {
        const { sizes } = await smallestText(await readFile(file));
        sizes.forEach((size, i) => {
          expect(size, `${path.relative(site, file)} page ${i + 1}`).toBeGreaterThanOrEqual(
            FLOOR_PT - 1e-3,
          );
          smallest = Math.min(smallest, size);
        });
      }
      expect(smallest).toBeLessThan(FLOOR_PT + 0.5); // the floor is reached, so it is what holds
    });

    it('drops optional blocks in the documented order, chart first, and the log says so', () => {
      const dropped = result.stats.dropped;
      expect(dropped.length).toBeGreaterThan(0);
      for (const { pdf, blocks } of dropped) {
        const order: readonly string[] =
          pdf.startsWith('inserts/') || pdf.includes('inserts/')
            ? OPTIONAL_ORDER.insert
            : OPTIONAL_ORDER.station;
        // Always a leading part of the order: nothing later goes while something earlier stays.
        expect(blocks, pdf).toEqual(order.slice(0, blocks.length));
      }
      expect(dropped.some((d) => d.blocks[0] === 'chart')).toBe(true);
      const log = droppedLines(result);
      expect(log).toContain('leave out the chart');
      expect(log).toMatch(/7 pt or more/);
    });

    it('a card that left out its chart still prints its recipe and the cautions', async () => {
      const a6 = result.stats.dropped.find((d) => d.pdf.startsWith('sets/quorvel-bar.pdf'));
      expect(a6, 'an A6 card of the bar set dropped something').toBeDefined();
      const card = result.data.stationCards.find(
        (c) => c.recipe !== null && a6!.pdf.includes(c.paths.pdfFile),
      )!;
      const set = await readFile(path.join(site, 'sets', 'quorvel-bar.pdf'));
      const doc = await openPdf(set);
      const bar = result.data.sets.find((s) => s.id === 'quorvel-bar')!;
      const index = bar.cards.findIndex((c) => c.pdfFile === card.paths.pdfFile);
      const page = await doc.getPage(index + 1);
      const text = squash(
        (await page.getTextContent()).items.map((i) => ('str' in i ? i.str : '')).join(''),
      );
      await doc.destroy();
      const r = card.recipe!;
      for (const t of [
        r.water.fillVolume.value,
        r.coffee.dose.value,
        r.timings.offHeat.text,
        r.heat.level,
      ])
        expect(text).toContain(squash(t));
      expect(text).toContain(squash(card.cautions.heading));
      expect(text).toContain(squash(card.cautions.deferral));
      expect(text).not.toContain(squash(r.chart.heading));
    });
  },
);
