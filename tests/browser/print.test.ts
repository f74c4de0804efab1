/**
 * Every card prints on one page at every paper size the site offers, in a real Chromium:
 * the demo is built at A4, A5, A6, letter and half-letter (one shared plan cache), and each
 * station card and bag insert is opened from disk in print mode and checked:
 *
 *   - printing it with page.pdf({ preferCSSPageSize: true }) gives exactly one page, of the
 *     paper's size (pages counted and measured by pdfjs-dist);
 *   - nothing ends below the card's bottom margin or outside its side margins, and no line
 *     of text is wider than its own box;
 *   - a card with a recipe shows its chart and cross-section SVGs, with non-zero size,
 *     visible, inside the card;
 *   - the page logs no console error, throws nothing, fails no request, and asks for
 *     nothing but local files (anything else is aborted and fails the test).
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { PaperSize } from '../../generator/content/types.ts';
import { describeWithBrowser, openFile, openGuardedPage, type GuardedPage } from './chromium.ts';
import { buildDemoAt, PAPERS, type DemoBuild } from './demo-builds.ts';
import { readPdfPages } from './pdf-pages.ts';

/** Sub-pixel rounding of layout boxes, CSS px. */
const SLACK_PX = 0.5;
/** Chromium rounds the page to whole points: within 0.5 mm of the paper. */
const PAGE_SIZE_TOLERANCE_MM = 0.5;

/** What one card's layout looks like to the browser (computed in the page). */
interface Layout {
  /** Worst overshoot past the card's bottom, left and right content edges, px, with the element. */
  readonly bottom: { px: number; what: string };
  readonly sides: { px: number; what: string };
  /** Text boxes whose content is wider than the box. */
  readonly widerThanBox: string[];
  /** Per figure selector: null when absent, else its box and whether it is shown and inside. */
  readonly figures: Record<
    string,
    { width: number; height: number; visible: boolean; inside: boolean } | null
  >;
}

const FIGURES = ['figure.chart svg', 'figure.xsec svg'] as const;

/** Runs in the page: the layout facts above for the page's `.card`. */
function measure(figures: readonly string[]): Layout {
  const card = document.querySelector('.card');
  if (!card) throw new Error('no .card on the page');
  const style = getComputedStyle(card);
  const box = card.getBoundingClientRect();
  const edge = {
    left: box.left + parseFloat(style.paddingLeft),
    right: box.right - parseFloat(style.paddingRight),
    bottom: box.bottom - parseFloat(style.paddingBottom),
  };
  const describeEl = (el: Element): string => {
    const cls = el.getAttribute('class');
    return `<${el.tagName.toLowerCase()}${cls ? ` class="${cls}"` : ''}> "${(el.textContent ?? '').trim().slice(0, 40)}"`;
  };
  let bottom = { px: -Infinity, what: '' };
  let sides = { px: -Infinity, what: '' };
  const widerThanBox: string[] = [];
  for (const el of card.querySelectorAll('*')) {
    const r = el.getBoundingClientRect();
    if (r.height <= 0 || r.width <= 0) continue;
    if (r.bottom - edge.bottom > bottom.px)
      bottom = { px: r.bottom - edge.bottom, what: describeEl(el) };
    const side = Math.max(edge.left - r.left, r.right - edge.right);
    if (side > sides.px) sides = { px: side, what: describeEl(el) };
    const display = getComputedStyle(el).display;
    if (el instanceof HTMLElement && display !== 'inline' && el.scrollWidth > el.clientWidth + 1)
      widerThanBox.push(
        `${describeEl(el)}: ${el.scrollWidth} px of content in ${el.clientWidth} px`,
      );
  }
  const shown: Layout['figures'] = {};
  for (const selector of figures) {
    const svg = card.querySelector(selector);
    if (!svg) {
      shown[selector] = null;
      continue;
    }
    const r = svg.getBoundingClientRect();
    let visible = true;
    for (let el: Element | null = svg; el; el = el.parentElement) {
      const s = getComputedStyle(el);
      if (s.display === 'none' || s.visibility === 'hidden' || parseFloat(s.opacity) === 0)
        visible = false;
    }
    const inside =
      r.left >= box.left - 0.5 &&
      r.right <= box.right + 0.5 &&
      r.top >= box.top - 0.5 &&
      r.bottom <= box.bottom + 0.5;
    shown[selector] = { width: r.width, height: r.height, visible, inside };
  }
  return { bottom, sides, widerThanBox, figures: shown };
}

async function checkCard(
  guarded: GuardedPage,
  file: string,
  label: string,
  paper: { widthMm: number; heightMm: number },
  hasRecipe: boolean,
): Promise<void> {
  await openFile(guarded, file);
  const layout = await guarded.page.evaluate(measure, [...FIGURES]);
  expect(
    layout.bottom.px,
    `${label}: ${layout.bottom.what} ends ${layout.bottom.px.toFixed(1)} px below the margin`,
  ).toBeLessThanOrEqual(SLACK_PX);
  expect(
    layout.sides.px,
    `${label}: ${layout.sides.what} sticks out ${layout.sides.px.toFixed(1)} px past a side margin`,
  ).toBeLessThanOrEqual(SLACK_PX);
  expect(layout.widerThanBox, `${label}: text wider than its box`).toEqual([]);
  if (hasRecipe) {
    for (const selector of FIGURES) {
      const figure = layout.figures[selector];
      expect(figure, `${label}: no ${selector}`).not.toBeNull();
      expect(figure!.width * figure!.height, `${label}: ${selector} has no area`).toBeGreaterThan(
        0,
      );
      expect(figure!.visible, `${label}: ${selector} is hidden`).toBe(true);
      expect(figure!.inside, `${label}: ${selector} is outside the card`).toBe(true);
    }
  }

  const pdf = await readPdfPages(
    await guarded.page.pdf({ preferCSSPageSize: true, printBackground: true }),
  );
  expect(pdf.pages, `${label}: printed pages`).toBe(1);
  const [widthMm, heightMm] = pdf.sizesMm[0]!;
  expect(
    Math.abs(widthMm - paper.widthMm),
    `${label}: page width ${widthMm.toFixed(1)} mm, paper ${paper.widthMm} mm`,
  ).toBeLessThan(PAGE_SIZE_TOLERANCE_MM);
  expect(
    Math.abs(heightMm - paper.heightMm),
    `${label}: page height ${heightMm.toFixed(1)} mm, paper ${paper.heightMm} mm`,
  ).toBeLessThan(PAGE_SIZE_TOLERANCE_MM);
  guarded.expectNoTrouble(label);
}

describeWithBrowser('printing every card in Chromium', () => {
  let root: string;
  let guarded: GuardedPage;
  /**
   * One build per paper, one after the other (the first plans, the rest reuse its cache),
   * started up front so each builds while the browser checks the paper before it.
   */
  const builds = new Map<PaperSize, Promise<DemoBuild>>();

  beforeAll(async () => {
    root = await mkdtemp(path.join(tmpdir(), 'stovecard-print-'));
    const cacheDir = path.join(root, 'cache');
    let previous: Promise<unknown> = Promise.resolve();
    for (const paper of PAPERS) {
      const build = previous.then(() => buildDemoAt(root, paper, cacheDir));
      build.catch(() => {}); // reported by the paper's own test, which awaits it
      builds.set(paper, build);
      previous = build.catch(() => {});
    }
    guarded = await openGuardedPage();
  });

  afterAll(async () => {
    await guarded?.close();
    await Promise.allSettled(builds.values());
    if (root) await rm(root, { recursive: true, force: true });
  });

  it('the checks themselves catch an overflow, a hidden chart, a network request and a console error', async () => {
    const file = path.join(root, 'broken.html');
    await writeFile(
      file,
      `<!doctype html><html><head><style>@page { size: 148mm 210mm; } .card { padding: 10mm; height: 190mm; box-sizing: border-box; }</style></head>
<body><article class="card"><figure class="chart"><svg width="100" height="50" style="visibility:hidden"></svg></figure>
<figure class="xsec"><svg width="100" height="50"></svg></figure><p style="white-space:nowrap;width:20px">a line far too long for its box</p>
<div style="height:250mm">tall</div><img src="https://example.invalid/pixel.png"></article>
<script>console.error('boom')</script></body></html>`,
    );
    await openFile(guarded, file);
    const layout = await guarded.page.evaluate(measure, [...FIGURES]);
    expect(layout.bottom.px).toBeGreaterThan(100);
    expect(layout.widerThanBox.length).toBeGreaterThan(0);
    expect(layout.figures['figure.chart svg']?.visible).toBe(false);
    expect(layout.figures['figure.xsec svg']?.visible).toBe(true);
    expect(guarded.trouble.network).toEqual(['https://example.invalid/pixel.png']);
    expect(guarded.trouble.consoleErrors).toContain('boom');
    const pdf = await readPdfPages(await guarded.page.pdf({ preferCSSPageSize: true }));
    expect(pdf.pages).toBeGreaterThan(1);
  });

  for (const paper of PAPERS) {
    it(`every station card and insert prints on one ${paper} page, whole and offline`, async () => {
      const { result, outDir } = await builds.get(paper)!;
      const cards = [...result.data.stationCards, ...result.data.insertCards];
      expect(cards.length).toBeGreaterThan(0);
      for (const card of cards) {
        const label = `${card.paths.pageFile} at ${paper}`;
        const hasRecipe = card.kind === 'station' && card.recipe !== null;
        await checkCard(
          guarded,
          path.join(outDir, card.paths.pageFile),
          label,
          card.page,
          hasRecipe,
        );
      }
    }, 120_000);
  }
});
