/**
 * The roaster's brand through a real build: a small invented site with a PNG logo and a
 * colour too light for text (#8fb996, below WCAG 2.x's 4.5:1 on white) and the demo's SVG
 * logo with its dark colour. The logo is on every page of the card, insert and set PDFs
 * (an image XObject for a PNG; a tagged Figure with the logo's text alternative for both)
 * and the binder's cover; the HTML cards and inserts carry an <img> of it, the site's pages
 * the copied file; the colour is in the pages' CSS, for text only when it reads as text;
 * the build log says once that a light colour colours only the rules.
 */
import { cp, mkdtemp, readFile, rm, writeFile, mkdir } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { brandLines } from '../../generator/cli/build.ts';
import { contrastRatio } from '../../generator/content/colour.ts';
import { wordsFor } from '../../generator/words/catalogue.ts';
import { encodePng } from '../browser/png.ts';
import { openPdf, readPdf, type StructNode } from '../pdf/read-pdf.ts';

const LIGHT = '#8fb996';
const ALT = wordsFor('en').card.footer.logoAlt('Test Roasters');

let root: string;
let outDir: string;
let result: BuildResult;
let logo: Buffer;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-brand-'));
  const content = path.join(root, 'content');
  await cp('content', content, { recursive: true });
  await rm(path.join(content, 'logs'), { recursive: true, force: true });
  const data = new Uint8Array(60 * 20 * 4);
  for (let i = 0; i < data.length; i += 4) data.set([46, 94, 78, 255], i);
  logo = encodePng({ width: 60, height: 20, data });
  await mkdir(path.join(content, 'art'), { recursive: true });
  await writeFile(path.join(content, 'art', 'mark.png'), logo);
  await writeFile(
    path.join(content, 'site.yaml'),
    `business: { name: Test Roasters, contact: t@test.example }
units: metric
paper: A5
room: { ambient_c: 20 }
brand: { logo: art/mark.png, colour: '${LIGHT}' }
sets:
  - id: bar
    title: Bar
    layout: station
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
      - { pot: three-cup, coffee: house-blend, stove: bar-induction }
  - id: training
    title: Training
    layout: binder
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
  - id: bags
    title: Bags
    layout: insert
    coffees: [house-blend]
    pots: [three-cup]
`,
  );
  outDir = path.join(root, 'site');
  result = await buildSite({
    contentDir: content,
    outDir,
    cacheDir: path.join(root, 'cache'),
    env: { SOURCE_DATE_EPOCH: '1767225600' },
    extraSteps: [sitePdfStep],
  });
}, 600_000);

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

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

/** Image XObjects painted on each page (pdfjs operator lists). */
async function imagesPerPage(bytes: Uint8Array): Promise<number[]> {
  const doc = await openPdf(bytes);
  try {
    const counts: number[] = [];
    for (let i = 1; i <= doc.numPages; i++) {
      const ops = await (await doc.getPage(i)).getOperatorList();
      counts.push(ops.fnArray.filter((fn) => fn === OPS.paintImageXObject).length);
    }
    return counts;
  } finally {
    await doc.destroy();
  }
}

const site = (file: string) => path.join(outDir, file);

describe('a branded build (PNG logo, light colour)', () => {
  it('the PNG logo is an image on every page of each card, insert and set PDF, and tagged as a Figure', async () => {
    const pdfs = [
      'cards/three-cup--house-blend--bar-gas.pdf',
      'inserts/house-blend.pdf',
      'sets/bar.pdf',
      'sets/bags.pdf',
    ];
    for (const file of pdfs) {
      const bytes = await readFile(site(file));
      const images = await imagesPerPage(bytes);
      expect(images.length, file).toBeGreaterThan(0);
      expect(
        images.every((n) => n >= 1),
        `${file}: images per page ${images}`,
      ).toBe(true);
      const read = await readPdf(bytes);
      expect(
        read.structure.map((s) => figuresWithAlt(s, ALT)),
        file,
      ).toEqual(read.structure.map(() => 1));
    }
  });

  it('the binder has the logo on its cover (page 1) and on its card pages, not on the text pages', async () => {
    const read = await readPdf(await readFile(site('sets/training.pdf')));
    const perPage = read.structure.map((s) => figuresWithAlt(s, ALT));
    expect(perPage[0], 'cover').toBe(1);
    expect(perPage[perPage.length - 1], 'the card').toBe(1);
    expect(
      perPage.slice(1, -1).every((n) => n === 0),
      `text pages: ${perPage}`,
    ).toBe(true);
  });

  it('the HTML card and insert carry the logo as an <img> of the same PNG bytes, with its text alternative', async () => {
    for (const page of [
      'cards/three-cup--house-blend--bar-gas/index.html',
      'inserts/house-blend/index.html',
    ]) {
      const html = await readFile(site(page), 'utf8');
      const img = /<img class="brand-logo" src="data:image\/png;base64,([^"]+)" alt="([^"]*)"/.exec(
        html,
      );
      expect(img, page).not.toBeNull();
      expect(Buffer.from(img![1]!, 'base64').equals(logo), page).toBe(true);
      expect(img![2]).toBe(ALT);
    }
  });

  it('the site pages show the logo copied into the site, byte for byte', async () => {
    expect((await readFile(site('assets/brand/logo.png'))).equals(logo)).toBe(true);
    for (const page of ['index.html', 'sets/bar/index.html', 'method/index.html']) {
      const html = await readFile(site(page), 'utf8');
      const src = /<img class="site-logo" src="([^"]+)"/.exec(html)?.[1];
      expect(src, page).toBeDefined();
      expect(path.resolve(path.dirname(site(page)), src!)).toBe(site('assets/brand/logo.png'));
    }
  });

  it('a colour below 4.5:1 on white colours the rules only: --brand-accent, no --brand-text, and one build-log note', async () => {
    // source: WCAG 2.x success criterion 1.4.3 (4.5:1 for normal text)
    expect(contrastRatio(LIGHT, '#ffffff')).toBeLessThan(4.5);
    const html = await readFile(site('index.html'), 'utf8');
    expect(html).toContain(`--brand-accent: ${LIGHT}`);
    expect(html).not.toContain('--brand-text');
    const note = brandLines(result);
    expect(note.split('\n').filter(Boolean)).toHaveLength(1);
    expect(note).toContain(LIGHT);
    // The card says nothing about it.
    expect(
      await readFile(site('cards/three-cup--house-blend--bar-gas/index.html'), 'utf8'),
    ).not.toContain('contrast');
  });

  it('the card CSS takes the brand variables for the header rule, headings and step discs', async () => {
    const css = await readFile(site('assets/card.css'), 'utf8');
    for (const rule of [
      'solid var(--brand-accent, var(--ink))',
      'color: var(--brand-text, var(--ink))',
      'background: var(--brand-text, var(--ink))',
    ])
      expect(css).toContain(rule);
  });
});
