/**
 * Incremental rebuilds of the demo with its PDFs (the site PDF step on the worker pool):
 * after one coffee is edited, only that coffee's cards are planned and rendered again, and
 * only the PDFs drawn from them; the site equals, byte for byte (HTML and PDF), a clean
 * build in one thread with the PDF module's own step; a failed rebuild leaves the last
 * good site as it was.
 */
import { createHash } from 'node:crypto';
import { cp, mkdtemp, readdir, readFile, rm, stat, writeFile } from 'node:fs/promises';
import { writeCatalogue } from '../../bench/catalogue.ts';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { writeSite } from '../../generator/pipeline/eleventy.ts';
import { CARD_PAGE_GLOBALS } from '../../generator/pipeline/pages.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { pdfBuildStep } from '../../generator/render/pdf/site-pdfs.ts';
import type { SiteData } from '../../generator/render/site-view.ts';

const EPOCH = { SOURCE_DATE_EPOCH: '1714521600' }; // 2024-05-01, midnight UTC
const COFFEE = 'house-blend';

let root: string;
let content: string;
let cacheDir: string;
let first: BuildResult;
let rebuilt: BuildResult;

async function files(dir: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true, recursive: true });
  return entries
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)))
    .sort();
}

/** Each file's sha256, by site-relative path. */
async function tree(dir: string): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  for (const file of await files(dir)) {
    out[file] = createHash('sha256')
      .update(await readFile(path.join(dir, file)))
      .digest('hex');
  }
  return out;
}

const build = (outDir: string, extra: Partial<Parameters<typeof buildSite>[0]> = {}) =>
  buildSite({
    contentDir: content,
    outDir,
    cacheDir,
    env: EPOCH,
    extraSteps: [sitePdfStep],
    ...extra,
  });

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-incremental-'));
  content = path.join(root, 'content');
  cacheDir = path.join(root, 'cache');
  await cp('content', content, { recursive: true });
  first = await build(path.join(root, 'site'));
  const file = path.join(content, 'coffees', `${COFFEE}.yaml`);
  const yaml = await readFile(file, 'utf8');
  await writeFile(file, yaml.replace(/^permeability_m2: .*$/m, 'permeability_m2: 0.9e-12'));
  rebuilt = await build(path.join(root, 'site'));
});

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

describe('a rebuild after editing one coffee', () => {
  it('plans and renders that coffee’s station cards only', () => {
    const mine = rebuilt.data.stationCards.filter((c) => c.coffeeId === COFFEE).length;
    expect(mine).toBeGreaterThan(0);
    // One plan per pot × coffee × stove; one view per card and language.
    const slug = (c: { potId: string; coffeeId: string; stoveId: string }) =>
      `${c.potId}|${c.coffeeId}|${c.stoveId}`;
    const plans = new Set(rebuilt.data.stationCards.map(slug)).size;
    const myPlans = new Set(
      rebuilt.data.stationCards.filter((c) => c.coffeeId === COFFEE).map(slug),
    ).size;
    expect(first.stats.plans.made).toBe(plans);
    expect(rebuilt.stats.plans).toMatchObject({ made: myPlans, reused: plans - myPlans });
    expect(rebuilt.stats.views).toMatchObject({ made: mine, reused: rebuilt.stationCards - mine });
  });

  it('renders the PDFs and card pages drawn from them, and copies the rest', () => {
    const data = rebuilt.data;
    const mine = (card: { coffeeId: string }) => card.coffeeId === COFFEE;
    const cards = [...data.stationCards, ...data.insertCards].filter(mine);
    const touched = new Set(cards.map((c) => c.paths.pdfFile));
    // A set is one PDF: it is drawn again when it holds one of the cards.
    const sets = data.sets.filter((set) => set.cards.some((link) => touched.has(link.pdfFile)));
    // So is a set's sheet PDF (`sheet:`), keyed by the same cards.
    const sheets = sets.filter((set) => set.sheet !== null);
    const allSheets = data.sets.filter((set) => set.sheet !== null);
    const pdfs =
      data.stationCards.length + data.insertCards.length + data.sets.length + allSheets.length;
    const made = cards.length + sets.length + sheets.length;
    expect(rebuilt.stats.pdfs).toMatchObject({ made, reused: pdfs - made });
    const otherPages = 3 + data.sets.length + data.plannerPages.length; // index, method, troubleshooting and the sets
    expect(rebuilt.stats.pages).toMatchObject({
      made: cards.length + otherPages,
      reused: data.stationCards.length + data.insertCards.length - cards.length,
    });
  });

  it('writes the same bytes, HTML and PDF, as a clean one-thread build with the PDF module’s step', async () => {
    const clean = await buildSite({
      contentDir: content,
      outDir: path.join(root, 'site-clean'),
      cacheDir: path.join(root, 'cache-clean'),
      env: EPOCH,
      workers: 0,
      extraSteps: [pdfBuildStep],
    });
    expect(clean.stats.workers).toBe(0);
    expect(rebuilt.stats.workers).toBeGreaterThan(0);
    const expected = await tree(path.join(root, 'site-clean'));
    expect(Object.keys(expected).some((f) => f.endsWith('.pdf'))).toBe(true);
    expect(await tree(path.join(root, 'site'))).toEqual(expected);
  });

  it('a rebuild with nothing changed makes nothing and keeps every byte', async () => {
    const before = await tree(path.join(root, 'site'));
    const again = await build(path.join(root, 'site'));
    expect(again.stats.plans.made + again.stats.views.made + again.stats.pdfs.made).toBe(0);
    expect(again.stats.pages.made).toBe(
      3 + again.data.sets.length + again.data.plannerPages.length,
    );
    expect(again.stats.workers).toBe(0); // no work, no worker started
    expect(await tree(path.join(root, 'site'))).toEqual(before);
  });
});

describe('a failed rebuild', () => {
  it('after its PDFs were rendered, leaves the previous site and no temporary folder', async () => {
    const site = path.join(root, 'site');
    const before = await tree(site);
    const file = path.join(content, 'coffees', `${COFFEE}.yaml`);
    const yaml = await readFile(file, 'utf8');
    await writeFile(file, yaml.replace(/^permeability_m2: .*$/m, 'permeability_m2: 1.0e-12'));
    const failing = build(site, {
      extraSteps: [
        sitePdfStep,
        async () => {
          throw new Error('a later step failed');
        },
      ],
    });
    await expect(failing).rejects.toThrow('a later step failed');
    expect(await tree(site)).toEqual(before);
    expect((await readdir(root)).filter((name) => name.includes('.tmp-'))).toEqual([]);
    await writeFile(file, yaml);
  });
});

describe('a card page', () => {
  it(`reads nothing of the site data but its card and ${CARD_PAGE_GLOBALS.join(', ')}`, async () => {
    const data = rebuilt.data;
    const changed: SiteData = {
      ...data,
      sets: data.sets.map((set) => ({ ...set, title: `${set.title} (changed)`, cards: [] })),
      method: { ...data.method, title: 'Changed', example: 'changed' },
      troubleshooting: { ...data.troubleshooting, title: 'Changed', moves: null },
    };
    const a = path.join(root, 'pages-a');
    const b = path.join(root, 'pages-b');
    await writeSite({ outDir: a, data });
    await writeSite({
      outDir: b,
      data: { ...changed, stationCards: data.stationCards.slice(0, 2) },
    });
    for (const card of [...data.stationCards.slice(0, 2), ...data.insertCards]) {
      const page = card.paths.pageFile;
      expect(await readFile(path.join(b, page), 'utf8'), page).toBe(
        await readFile(path.join(a, page), 'utf8'),
      );
    }
  });
});

describe('a set none of whose cards changed', () => {
  it('is not re-assembled: linked from the cache, with a clean build’s bytes', async () => {
    // Own rule of the pipeline (pdf-step.ts). The bench's catalogue, one set per coffee:
    // 1 pot × 2 coffees × 5 stoves; coffee-01 is edited, binder-coffee-02 holds none of it.
    const dir = await mkdtemp(path.join(tmpdir(), 'stovecard-kept-set-'));
    try {
      const contentDir = path.join(dir, 'content');
      await writeCatalogue(contentDir, { pots: 1, coffees: 2, stoves: 5 }, 1, 'by-coffee');
      const run = (out: string, extra: Partial<Parameters<typeof buildSite>[0]> = {}) =>
        buildSite({
          contentDir,
          outDir: path.join(dir, out),
          cacheDir: path.join(dir, `${out}-cache`),
          env: EPOCH,
          extraSteps: [sitePdfStep],
          ...extra,
        });
      await run('site');
      const file = path.join(contentDir, 'coffees', 'coffee-01.yaml');
      const yaml = await readFile(file, 'utf8');
      await writeFile(file, yaml.replace(/^permeability_m2: .*$/m, 'permeability_m2: 1.23e-12'));
      const again = await run('site');
      const sets = again.data.sets;
      const kept = sets.find((set) => set.id === 'binder-coffee-02')!;
      const edited = sets.find((set) => set.id === 'binder-coffee-01')!;
      // Made again: coffee-01's five cards, its insert, and the three sets holding them (its
      // own, the training binder's, the inserts'); binder-coffee-02 is copied.
      expect(again.stats.pdfs.made).toBe(5 + 1 + 3);
      const keptFile = path.join(dir, 'site', kept.paths.pdfFile);
      expect((await stat(keptFile)).nlink).toBeGreaterThanOrEqual(2); // the cache's file
      expect((await stat(path.join(dir, 'site', edited.paths.pdfFile))).nlink).toBe(1);
      await run('clean', { workers: 0, extraSteps: [pdfBuildStep] });
      for (const set of [kept, edited]) {
        const clean = await readFile(path.join(dir, 'clean', set.paths.pdfFile));
        const site = await readFile(path.join(dir, 'site', set.paths.pdfFile));
        expect(site.equals(clean), set.id).toBe(true);
      }
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});

describe('a set re-assembled from its cards’ cached pages (set-assembly.ts)', () => {
  // Own rule of the pipeline: each card page's segment is cached beside its PDF
  // (<key>.page.json), each set's shell as <key>.shell; a set re-assembled from them
  // has a clean build's bytes, and a damaged cache (set, segment or shell) costs a full
  // assembly, never a wrong set.
  it('converts only the new cards’ pages, and a damaged set or segment is made again', async () => {
    const dir = await mkdtemp(path.join(tmpdir(), 'stovecard-segments-'));
    try {
      const contentDir = path.join(dir, 'content');
      await writeCatalogue(contentDir, { pots: 1, coffees: 3, stoves: 2 }, 1, 'by-stove');
      const cache = path.join(dir, 'cache');
      const pdfCache = path.join(cache, 'pdfs');
      const run = (out: string, extra: Partial<Parameters<typeof buildSite>[0]> = {}) =>
        buildSite({
          contentDir,
          outDir: path.join(dir, out),
          cacheDir: cache,
          env: EPOCH,
          workers: 0,
          extraSteps: [sitePdfStep],
          ...extra,
        });
      const segmentFiles = async () =>
        (await readdir(pdfCache)).filter((name) => name.endsWith('.page.json')).sort();
      const firstRun = await run('site');
      const cardsInSets = new Set(
        firstRun.data.sets.flatMap((set) => set.cards.map((c) => c.pdfFile)),
      );
      // One segment per card that a set holds (the inserts' set, the binder's too), and a
      // shell per set.
      expect((await segmentFiles()).length).toBe(cardsInSets.size);
      const shellFiles = async () =>
        (await readdir(pdfCache)).filter((name) => name.endsWith('.shell')).sort();
      expect(await shellFiles()).toHaveLength(firstRun.data.sets.length);

      const file = path.join(contentDir, 'coffees', 'coffee-02.yaml');
      const yaml = await readFile(file, 'utf8');
      await writeFile(file, yaml.replace(/^permeability_m2: .*$/m, 'permeability_m2: 1.37e-12'));
      const before = new Set(await segmentFiles());
      const mtimes = async (names: Iterable<string>) =>
        Promise.all([...names].map(async (n) => (await stat(path.join(pdfCache, n))).mtimeMs));
      const beforeTimes = await mtimes(before);
      const again = await run('site');
      const edited = [...again.data.stationCards, ...again.data.insertCards].filter(
        (c) => c.coffeeId === 'coffee-02' && cardsInSets.has(c.paths.pdfFile),
      );
      expect(edited.length).toBeGreaterThan(0);
      const added = (await segmentFiles()).filter((name) => !before.has(name));
      expect(added).toHaveLength(edited.length);
      // The others were read, not made again (nor written).
      expect(await mtimes(before)).toEqual(beforeTimes);

      const clean = path.join(dir, 'clean');
      await buildSite({
        contentDir,
        outDir: clean,
        cacheDir: path.join(dir, 'clean-cache'),
        env: EPOCH,
        workers: 0,
        extraSteps: [pdfBuildStep],
      });
      const setFiles = again.data.sets.map((set) => set.paths.pdfFile);
      const same = async () => {
        for (const set of setFiles) {
          const built = await readFile(path.join(dir, 'site', set));
          expect(built.equals(await readFile(path.join(clean, set))), set).toBe(true);
        }
      };
      await same();

      // Damage: every segment's text rewritten as another format, its check file to match
      // (it passes the check but is not a segment); one more cut short (fails the check);
      // and every set's cached PDF (the files of more than one page) cut short, so each set
      // is assembled again.
      const { checkText } = await import('../../generator/pipeline/file-cache.ts');
      const segments = await segmentFiles();
      for (const name of segments.slice(1)) {
        const target = path.join(pdfCache, name);
        const text = (await readFile(target, 'utf8')).replace('"format":1', '"format":99');
        await writeFile(target, text);
        await writeFile(`${target}.sha256`, checkText(Buffer.from(text)));
      }
      // A shell that passes its check but is no PDF.
      const shell = path.join(pdfCache, (await shellFiles())[0]!);
      await writeFile(shell, 'not a PDF');
      await writeFile(`${shell}.sha256`, checkText(Buffer.from('not a PDF')));
      const cut = path.join(pdfCache, segments[0]!);
      await writeFile(cut, (await readFile(cut)).subarray(0, 100));
      let cutSets = 0;
      for (const name of await readdir(pdfCache)) {
        if (!name.endsWith('.pdf')) continue;
        const bytes = await readFile(path.join(pdfCache, name));
        const pages = Number(/\/Count (\d+)/.exec(bytes.toString('latin1'))?.[1] ?? 0);
        if (pages < 2) continue;
        await writeFile(path.join(pdfCache, name), bytes.subarray(0, bytes.length - 50));
        cutSets += 1;
      }
      expect(cutSets).toBeGreaterThanOrEqual(setFiles.length);
      const repaired = await run('site');
      expect(repaired.stats.pdfs.made).toBe(setFiles.length);
      expect(repaired.damagedCache.pdfs).toBeGreaterThanOrEqual(setFiles.length);
      await same();
      // The damaged segments of the sets' cards were made again and cached in their place
      // (the edited cards' old segments, which no set uses now, stay damaged until swept).
      const texts = await Promise.all(
        (await segmentFiles()).map((name) => readFile(path.join(pdfCache, name), 'utf8')),
      );
      expect(texts).toHaveLength(cardsInSets.size + edited.length);
      expect(texts.filter((text) => text.includes('"format":1,'))).toHaveLength(cardsInSets.size);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
