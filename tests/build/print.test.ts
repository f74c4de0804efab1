/**
 * Every card prints on one page at every paper size the site offers, with nothing cut off:
 * the demo is built at A4, A5, A6, letter and half-letter, each card is laid out by a
 * headless Chromium in print mode, and no element may end below the card's bottom margin.
 * Skipped when no Chromium is installed (CI installs it; see .ci/run).
 */
import { existsSync } from 'node:fs';
import { cp, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/build/build-site.ts';
import type { PaperSize } from '../../generator/content/types.ts';

const CHROMIUM = ['/usr/bin/chromium', '/usr/bin/chromium-browser', '/usr/bin/google-chrome'].find(
  (p) => existsSync(p),
);
const PAPERS: readonly PaperSize[] = ['A4', 'A5', 'A6', 'letter', 'half-letter'];
/** Sub-pixel rounding of layout boxes, CSS px. */
const SLACK_PX = 0.5;

let root: string;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  if (!CHROMIUM) return;
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-print-'));
  browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--no-sandbox'] });
  page = await browser.newPage();
  await page.emulateMedia({ media: 'print' });
});

afterAll(async () => {
  await browser?.close();
  if (root) await rm(root, { recursive: true, force: true });
});

async function buildAt(paper: PaperSize): Promise<{ result: BuildResult; outDir: string }> {
  const content = path.join(root, `content-${paper}`);
  await cp('content', content, { recursive: true });
  const site = path.join(content, 'site.yaml');
  let yaml = (await readFile(site, 'utf8')).replace(/^paper: .*$/m, `paper: ${paper}`);
  if (paper === 'letter' || paper === 'half-letter')
    yaml = yaml.replace(/^units: .*$/m, 'units: us');
  await writeFile(site, yaml);
  const outDir = path.join(root, `site-${paper}`);
  const result = await buildSite({
    contentDir: content,
    outDir,
    cacheDir: path.join(root, 'cache'),
  });
  return { result, outDir };
}

/** How far (px) the lowest element of the card ends below the card's bottom margin. */
async function overflow(file: string): Promise<number> {
  await page.goto(`file://${file}`);
  return page.evaluate(() => {
    const card = document.querySelector('.card')!;
    const limit =
      card.getBoundingClientRect().bottom - parseFloat(getComputedStyle(card).paddingBottom);
    let worst = -Infinity;
    for (const el of card.querySelectorAll('*')) {
      const box = el.getBoundingClientRect();
      if (box.height > 0) worst = Math.max(worst, box.bottom - limit);
    }
    return worst;
  });
}

/** Pages of the printed PDF, and the first page's size in mm (from its MediaBox, in pt). */
async function printed(
  file: string,
): Promise<{ pages: number; widthMm: number; heightMm: number }> {
  await page.goto(`file://${file}`);
  const pdf = (await page.pdf({ preferCSSPageSize: true, printBackground: true })).toString(
    'latin1',
  );
  const box = /\/MediaBox\s*\[\s*0 0 ([\d.]+) ([\d.]+)\s*\]/.exec(pdf);
  const mm = (pt: string | undefined) => (Number(pt) / 72) * 25.4;
  return {
    pages: (pdf.match(/\/Type\s*\/Page\b(?!s)/g) ?? []).length,
    widthMm: mm(box?.[1]),
    heightMm: mm(box?.[2]),
  };
}

describe.skipIf(!CHROMIUM)('printing', () => {
  for (const paper of PAPERS) {
    it(`every card fits one ${paper} page`, async () => {
      const { result, outDir } = await buildAt(paper);
      const cards = [...result.data.stationCards, ...result.data.insertCards];
      for (const card of cards) {
        const over = await overflow(path.join(outDir, card.paths.pageFile));
        expect(
          over,
          `${card.paths.pageFile} at ${paper}: ends ${over.toFixed(1)} px below the margin`,
        ).toBeLessThanOrEqual(SLACK_PX);
      }
      const samples = [
        result.data.stationCards.find((c) => c.recipe && c.warnings),
        result.data.stationCards.find((c) => c.recipe && !c.warnings),
        result.data.stationCards.find((c) => c.refusal),
        result.data.insertCards[0],
      ].filter((c) => c !== undefined);
      for (const card of samples) {
        const pdf = await printed(path.join(outDir, card.paths.pageFile));
        expect(pdf.pages, `${card.paths.pageFile} at ${paper}`).toBe(1);
        // Chromium rounds the page to whole points: within 0.5 mm of the paper.
        expect(Math.abs(pdf.widthMm - card.page.widthMm), `${paper} width`).toBeLessThan(0.5);
        expect(Math.abs(pdf.heightMm - card.page.heightMm), `${paper} height`).toBeLessThan(0.5);
      }
    });
  }
});
