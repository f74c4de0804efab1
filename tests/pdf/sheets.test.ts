/**
 * Sheets for desktop printers (a set's `sheet: { paper, up }`, render/sheet.ts and
 * render/pdf/sheet.ts): the grid's cells, and on the demo (three sets with a sheet: 2-up
 * US letter, 2-up A4, 4-up A4) the sheet PDFs' page counts and sizes, the 7 pt floor on
 * every sheet page, each card on its sheet with the logo, crop marks at the occupied
 * cells' corners, the set page's link; then caching, and the sheet's removal with `sheet:`.
 *
 * Paper sizes: ISO 216 (A4 210 × 297 mm); US letter 8.5 × 11 in (ANSI Y14.1, from memory);
 * 1 in = 72 pt = 25.4 mm (PDF 32000-1 default user space unit, 1/72 in). The 6 mm printer
 * margin, the 4 mm mark room and the 1 + 2.5 mm marks are our own rules (render/sheet.ts).
 */
import { cp, mkdtemp, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PaperSize, SheetUp } from '../../generator/content/types.ts';
import { droppedLines } from '../../generator/cli/build.ts';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { paperMm } from '../../generator/render/card-view.ts';
import { OPTIONAL_ORDER } from '../../generator/render/pdf/card.ts';
import {
  CELL_INSET_MM,
  CROP_MARK_LENGTH_MM,
  CROP_MARK_OFFSET_MM,
  PRINTER_MARGIN_MM,
  sheetGeometry,
  type SheetGeometry,
} from '../../generator/render/sheet.ts';
import type { SetView } from '../../generator/render/site-view.ts';
import { wordsFor } from '../../generator/words/catalogue.ts';
import { BUILD_ENV } from '../browser/demo-builds.ts';
import { DEMO_CONTENT } from '../hostile/cli-run.ts';
import { describeWithTools, pageLines, pdfinfoSizes, renderGray } from './poppler.ts';
import { readPdf, smallestText, squash, type StructNode } from './read-pdf.ts';

const MM = 72 / 25.4;
const FLOOR_PT = 7;
const PAPERS: readonly PaperSize[] = ['A4', 'A5', 'A6', 'letter', 'half-letter', '4x6in'];
const UPS: readonly SheetUp[] = [2, 4, 8];

describe('sheet geometry (render/sheet.ts)', () => {
  // closed form: (210 − 2 × 6) / 2 − 2 × 4 = 91 mm, (297 − 2 × 6) / 2 − 2 × 4 = 134.5 mm (ISO 216 A4)
  it('4 up on A4: a 2 × 2 grid of 91 × 134.5 mm cells, the sheet upright', () => {
    const g = sheetGeometry('A4', 4);
    expect([g.widthMm, g.heightMm]).toEqual([210, 297]);
    expect([g.columns, g.rows]).toEqual([2, 2]);
    expect([g.cellWidthMm, g.cellHeightMm]).toEqual([91, 134.5]);
    expect(g.cells).toEqual([
      { xMm: 10, yMm: 10 },
      { xMm: 109, yMm: 10 },
      { xMm: 10, yMm: 152.5 },
      { xMm: 109, yMm: 152.5 },
    ]);
  });

  // closed form: A4 turned: (297 − 12) / 2 − 8 = 134.5 mm wide, 210 − 12 − 8 = 190 mm high;
  // 8 up: (297 − 12) / 4 − 8 = 63.25 mm, (210 − 12) / 2 − 8 = 91 mm
  it('2 and 8 up turn the sheet landscape, so the cells stand upright like the cards', () => {
    const two = sheetGeometry('A4', 2);
    expect([two.widthMm, two.heightMm, two.columns, two.rows]).toEqual([297, 210, 2, 1]);
    expect([two.cellWidthMm, two.cellHeightMm]).toEqual([134.5, 190]);
    const eight = sheetGeometry('A4', 8);
    expect([eight.widthMm, eight.heightMm, eight.columns, eight.rows]).toEqual([297, 210, 4, 2]);
    expect([eight.cellWidthMm, eight.cellHeightMm]).toEqual([63.25, 91]);
  });

  // own rule: cells and their marks inside the printer's margin, apart from each other
  it('on every paper and up: `up` upright cells, their marks inside the printable area and clear of the neighbours', () => {
    const reach = CROP_MARK_OFFSET_MM + CROP_MARK_LENGTH_MM;
    expect(reach).toBeLessThan(CELL_INSET_MM);
    for (const paper of PAPERS)
      for (const up of UPS) {
        const g = sheetGeometry(paper, up);
        const label = `${up} up on ${paper}`;
        const portrait = paperMm(paper);
        expect(g.widthMm * g.heightMm, label).toBeCloseTo(portrait.widthMm * portrait.heightMm, 6);
        expect(g.cells, label).toHaveLength(up);
        expect(g.cellHeightMm, label).toBeGreaterThan(g.cellWidthMm);
        for (const [i, c] of g.cells.entries()) {
          expect(c.xMm - reach, label).toBeGreaterThanOrEqual(PRINTER_MARGIN_MM - 1e-9);
          expect(c.yMm - reach, label).toBeGreaterThanOrEqual(PRINTER_MARGIN_MM - 1e-9);
          expect(c.xMm + g.cellWidthMm + reach, label).toBeLessThanOrEqual(
            g.widthMm - PRINTER_MARGIN_MM + 1e-9,
          );
          expect(c.yMm + g.cellHeightMm + reach, label).toBeLessThanOrEqual(
            g.heightMm - PRINTER_MARGIN_MM + 1e-9,
          );
          for (const d of g.cells.slice(i + 1)) {
            const apartX = Math.max(d.xMm - c.xMm, c.xMm - d.xMm) - g.cellWidthMm;
            const apartY = Math.max(d.yMm - c.yMm, c.yMm - d.yMm) - g.cellHeightMm;
            // Two cells are 2 × 4 mm apart along one axis at least: two marks' reach and 1 mm
            // (the sizes and places are rounded to 0.01 mm).
            expect(Math.max(apartX, apartY), label).toBeGreaterThanOrEqual(2 * reach + 1 - 0.011);
          }
        }
      }
  });
});

/** A sheet page's expected size, pt: the sheet paper, turned landscape for 2 and 8 up. */
function sheetPagePt(g: SheetGeometry): [number, number] {
  return [g.widthMm * MM, g.heightMm * MM];
}

/** Figures of a page's structure tree whose text alternative is `alt`. */
function figuresWithAlt(node: StructNode | null, alt: string): number {
  if (!node) return 0;
  const own = node.role === 'Figure' && node.alt === alt ? 1 : 0;
  return (
    own +
    (node.children ?? []).reduce(
      (sum, child) =>
        sum +
        ('role' in child || 'children' in child ? figuresWithAlt(child as StructNode, alt) : 0),
      0,
    )
  );
}

/** Darkest pixel within `r` px of (x, y) mm on a page rendered at `dpi`. */
function darkest(
  image: { width: number; height: number; pixels: Uint8Array },
  xMm: number,
  yMm: number,
  dpi: number,
  r = 2,
): number {
  const px = Math.round((xMm / 25.4) * dpi);
  const py = Math.round((yMm / 25.4) * dpi);
  let min = 255;
  for (let y = py - r; y <= py + r; y++)
    for (let x = px - r; x <= px + r; x++)
      if (x >= 0 && y >= 0 && x < image.width && y < image.height)
        min = Math.min(min, image.pixels[y * image.width + x]!);
  return min;
}

/** The mid-points of a cell's eight crop marks and the four points diagonally off its corners. */
function markPoints(g: SheetGeometry, cell: number) {
  const { xMm, yMm } = g.cells[cell]!;
  const mid = CROP_MARK_OFFSET_MM + CROP_MARK_LENGTH_MM / 2;
  const marks: [number, number][] = [];
  const clear: [number, number][] = [];
  for (const cx of [xMm, xMm + g.cellWidthMm])
    for (const cy of [yMm, yMm + g.cellHeightMm]) {
      const sx = cx === xMm ? -1 : 1;
      const sy = cy === yMm ? -1 : 1;
      marks.push([cx + sx * mid, cy], [cx, cy + sy * mid]);
      clear.push([cx + sx * mid, cy + sy * mid]);
    }
  return { marks, clear };
}

const SHEET_SETS = ['shipping-inserts', 'counter-inserts', 'quorvel-barra'];

let root: string;
let site: string;
let result: BuildResult;
const sheetSets = (): SetView[] => result.data.sets.filter((set) => set.sheet !== null);

describeWithTools(['pdfinfo', 'pdftotext', 'pdftoppm'], 'the demo’s sheets', () => {
  beforeAll(async () => {
    root = await mkdtemp(path.join(tmpdir(), 'stovecard-sheets-'));
    site = path.join(root, 'site');
    result = await buildSite({
      contentDir: DEMO_CONTENT,
      outDir: site,
      cacheDir: path.join(root, 'cache'),
      env: BUILD_ENV,
      workers: 2,
      extraSteps: [sitePdfStep],
    });
  }, 600_000);

  afterAll(async () => {
    if (root) await rm(root, { recursive: true, force: true });
  });

  // own rule: ceil(cards / up) sheets (content/README.md); ISO 216 A4, US letter from memory
  it('writes sets/<id>-sheet.pdf for each set with a sheet: ceil(cards / up) pages of the sheet’s paper', async () => {
    expect(sheetSets().map((set) => set.id)).toEqual(SHEET_SETS);
    const expected: Record<string, { paper: PaperSize; up: SheetUp; size: [number, number] }> = {
      'shipping-inserts': { paper: 'letter', up: 2, size: [11 * 72, 8.5 * 72] },
      'counter-inserts': { paper: 'A4', up: 4, size: [210 * MM, 297 * MM] },
      'quorvel-barra': { paper: 'A4', up: 2, size: [297 * MM, 210 * MM] },
    };
    for (const set of sheetSets()) {
      const g = set.sheet!.geometry;
      const want = expected[set.id]!;
      expect([g.paper, g.up], set.id).toEqual([want.paper, want.up]);
      expect(sheetPagePt(g)[0], set.id).toBeCloseTo(want.size[0], 1);
      expect(set.sheet!.pdfFile).toBe(`sets/${set.id}-sheet.pdf`);
      const file = path.join(site, set.sheet!.pdfFile);
      const { pages } = await smallestText(await readFile(file));
      expect(pages.length, set.id).toBe(Math.ceil(set.cards.length / g.up));
      for (const [w, h] of [...pages, ...pdfinfoSizes(file, pages.length)]) {
        expect(w, set.id).toBeCloseTo(want.size[0], 1);
        expect(h, set.id).toBeCloseTo(want.size[1], 1);
      }
      // The set's own PDF is still there, one card a page.
      const own = await readPdf(await readFile(path.join(site, set.paths.pdfFile)));
      expect(own.pages, set.id).toBe(set.cards.length);
    }
  });

  // common practice, no source: 7 pt, the readable floor of style.ts PDF_TEXT_FLOOR_PT
  it('sets no text below 7 pt on any sheet page', async () => {
    let smallest = Number.POSITIVE_INFINITY;
    for (const set of sheetSets()) {
      const { sizes } = await smallestText(await readFile(path.join(site, set.sheet!.pdfFile)));
      sizes.forEach((size, i) => {
        expect(size, `${set.id} sheet ${i + 1}`).toBeGreaterThanOrEqual(FLOOR_PT - 1e-3);
        smallest = Math.min(smallest, size);
      });
    }
    expect(smallest).toBeLessThan(FLOOR_PT + 0.5); // the cells are small: the floor is reached
  });

  it('holds every card of the set in order, `up` to a sheet, each with its title and the logo', async () => {
    for (const set of sheetSets()) {
      const g = set.sheet!.geometry;
      const file = path.join(site, set.sheet!.pdfFile);
      const read = await readPdf(await readFile(file));
      const alt = wordsFor(set.language).card.footer.logoAlt(result.data.site.businessName);
      for (let page = 0; page < read.pages; page++) {
        const onPage = set.cards.slice(page * g.up, (page + 1) * g.up);
        // pdfjs reads in drawing order (card by card); poppler's text must hold each title too.
        const text = squash(read.text[page]!);
        const poppler = squash(pageLines(file, page + 1).join(' '));
        let at = -1;
        for (const card of onPage) {
          const found = text.indexOf(squash(card.coffeeName), at + 1);
          expect(found, `${set.id} sheet ${page + 1}: ${card.coffeeName}`).toBeGreaterThan(at);
          at = found;
          const firstWord = squash(card.coffeeName).split(' ')[0]!;
          expect(poppler, `${set.id} sheet ${page + 1}`).toContain(firstWord);
        }
        expect(figuresWithAlt(read.structure[page]!, alt), `${set.id} sheet ${page + 1}`).toBe(
          onPage.length,
        );
      }
      expect(read.marked, set.id).toBe(true);
    }
  });

  it('draws crop marks at every corner of each card’s cell, outside it, and none for an empty cell', () => {
    const dpi = 200;
    let emptyCells = 0;
    for (const set of sheetSets()) {
      const g = set.sheet!.geometry;
      const file = path.join(site, set.sheet!.pdfFile);
      const pages = Math.ceil(set.cards.length / g.up);
      for (let page = 1; page <= pages; page++) {
        const image = renderGray(file, page, dpi, path.join(root, `${set.id}-${page}`));
        const filled = Math.min(g.up, set.cards.length - (page - 1) * g.up);
        for (let cell = 0; cell < g.up; cell++) {
          const { marks, clear } = markPoints(g, cell);
          const label = `${set.id} sheet ${page} cell ${cell + 1}`;
          for (const [x, y] of clear) expect(darkest(image, x, y, dpi), label).toBe(255);
          const ink = marks.map(([x, y]) => darkest(image, x, y, dpi));
          if (cell < filled) expect(Math.max(...ink), `${label}: ${ink}`).toBeLessThan(160);
          else {
            emptyCells += 1;
            expect(Math.min(...ink), `${label} (empty): ${ink}`).toBe(255);
          }
        }
      }
    }
    expect(emptyCells).toBe(1); // quorvel-barra: three cards, two to a sheet
  });

  it('the set page links its sheet PDF, in the set’s language; a set without a sheet has no such link', async () => {
    for (const set of result.data.sets) {
      const html = await readFile(path.join(site, set.paths.pageFile), 'utf8');
      const link = /<p class="[^"]*sheet-link[^"]*">([^<]*)<a href="([^"]+)">([^<]+)<\/a>/.exec(
        html,
      );
      if (!set.sheet) {
        expect(link, set.id).toBeNull();
        continue;
      }
      expect(link, set.id).not.toBeNull();
      const words = wordsFor(set.language).print;
      const g = set.sheet.geometry;
      expect(link![1]!.trim()).toBe(words.sheetLink(g.up, words.paperNames[g.paper]));
      expect(link![3]).toBe(words.sheetPdf);
      const target = path.resolve(path.dirname(path.join(site, set.paths.pageFile)), link![2]!);
      expect(target).toBe(path.join(site, set.sheet.pdfFile));
      expect((await stat(target)).size, set.id).toBeGreaterThan(0);
    }
  });

  it('cards that leave out blocks to fit their cell do so in the documented order, and the log says which', () => {
    const fromSheets = result.stats.dropped.filter((d) => d.pdf.includes('-sheet.pdf ('));
    // The 4-up cells (91 × 134.5 mm) are small: every counter insert leaves something out.
    const counter = sheetSets().find((set) => set.id === 'counter-inserts')!;
    const counterDrops = fromSheets.filter((d) => d.pdf.startsWith(counter.sheet!.pdfFile));
    expect(counterDrops).toHaveLength(counter.cards.length);
    for (const d of fromSheets) {
      const order: readonly string[] = d.pdf.includes('(inserts/')
        ? OPTIONAL_ORDER.insert
        : OPTIONAL_ORDER.station;
      expect(d.blocks, d.pdf).toEqual(order.slice(0, d.blocks.length));
    }
    const log = droppedLines(result);
    expect(log).toContain(`${counter.sheet!.pdfFile} (`);
    expect(log).toContain('in its cell');
  });
});

/** The demo's site.yaml with only one set: four one-row inserts, four to an A4 sheet. */
async function smallSite(dir: string, sheet: string | null): Promise<void> {
  const file = path.join(dir, 'site.yaml');
  const text = await readFile(file, 'utf8');
  await writeFile(
    file,
    `${text.slice(0, text.indexOf('sets:'))}sets:
  - id: counter
    title: Counter
    layout: insert
    coffees: [house-blend, ember-blend, morning-lantern, slow-river-decaf]
    pots: [three-cup]
    stoves: [home-radiant]
${sheet === null ? '' : `    sheet: ${sheet}\n`}`,
  );
}

describeWithTools(['pdfinfo'], 'a sheet through rebuilds', () => {
  let dir: string;
  let content: string;
  const build = () =>
    buildSite({
      contentDir: content,
      outDir: path.join(dir, 'site'),
      cacheDir: path.join(dir, 'cache'),
      env: BUILD_ENV,
      workers: 0,
      extraSteps: [sitePdfStep],
    });

  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'stovecard-sheet-rebuild-'));
    content = path.join(dir, 'content');
    await cp(DEMO_CONTENT, content, { recursive: true });
  });

  afterAll(async () => {
    if (dir) await rm(dir, { recursive: true, force: true });
  });

  it('is made once, then copied from the cache; gone with its link once `sheet:` is removed', async () => {
    const sheetFile = path.join(dir, 'site', 'sets', 'counter-sheet.pdf');
    const pageFile = path.join(dir, 'site', 'sets', 'counter', 'index.html');
    await smallSite(content, '{ paper: A4, up: 4 }');
    const first = await build();
    // Every card (four inserts, and the station card of each insert's row), the set's PDF, the sheet.
    const cards = first.data.stationCards.length + first.data.insertCards.length;
    expect(first.data.insertCards).toHaveLength(4);
    expect(first.stats.pdfs.made).toBe(cards + 1 + 1);
    expect(pdfinfoSizes(sheetFile, 1)).toHaveLength(1);
    const bytes = await readFile(sheetFile);
    expect(await readFile(pageFile, 'utf8')).toContain('counter-sheet.pdf');

    const again = await build();
    expect(again.stats.pdfs).toMatchObject({ made: 0, reused: cards + 2 });
    expect((await readFile(sheetFile)).equals(bytes)).toBe(true);

    // Another up is another sheet PDF: made again, the inserts and the set's PDF reused.
    await smallSite(content, '{ paper: A4, up: 2 }');
    const two = await build();
    expect(two.stats.pdfs).toMatchObject({ made: 1, reused: cards + 1 });
    expect(pdfinfoSizes(sheetFile, 2)).toHaveLength(2);

    await smallSite(content, null);
    const none = await build();
    expect(none.data.sets[0]!.sheet).toBeNull();
    await expect(stat(sheetFile)).rejects.toMatchObject({ code: 'ENOENT' });
    const page = await readFile(pageFile, 'utf8');
    expect(page).not.toContain('counter-sheet.pdf');
    expect(page).not.toContain('sheet-link');
    expect(none.stats.pdfs).toMatchObject({ made: 0, reused: cards + 1 });
    expect((await stat(path.join(dir, 'site', 'sets', 'counter.pdf'))).size).toBeGreaterThan(0);
  }, 600_000);
});
