/**
 * HTML and PDF of one card show the same card: for station cards and inserts of a small
 * invented site built in English and Spanish (metric) and a US one, the visible text of the
 * HTML card (document order, drawings left out) and the PDF's text (pdfjs, in drawing order,
 * the tagged Figures left out) are cut into the card's blocks at the headings the view
 * holds; the blocks must come in the same order, and each block must hold the same
 * sequence of numbers with their units.
 *
 * Documented differences, allowed and no others (DEVELOPERS.md "HTML and PDF of a card"):
 *  - blocks the PDF left out to keep its text at 7 pt (the build's `stats.dropped`, the
 *    build log lists them): the chart; the long cautions (the short form is printed);
 *  - list markers: the PDF draws "1." … as text (tagged Lbl), the HTML's come from <ol>;
 *  - a step's number is cut with its heading, not counted in the block before it.
 */
import { cp, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite, type BuildResult } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import type { InsertCardView, StationCardView } from '../../generator/render/card-view.ts';
import { openPdf } from '../pdf/read-pdf.ts';

const SETS = `sets:
  - id: bar
    title: Bar
    layout: station
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
      - { pot: six-cup, coffee: slow-river-decaf, stove: bar-induction }
      - { pot: three-cup, coffee: ember-blend, stove: bar-induction }
  - id: bags
    title: Bags
    layout: insert
    coffees: [house-blend]
  - id: barra
    title: Barra
    layout: station
    language: es
    cards:
      - { pot: three-cup, coffee: house-blend, stove: bar-gas }
  - id: bolsa
    title: Bolsa
    layout: insert
    language: es
    coffees: [morning-lantern]
`;

interface Built {
  readonly root: string;
  readonly out: string;
  readonly result: BuildResult;
}

async function build(units: 'metric' | 'us'): Promise<Built> {
  const root = await mkdtemp(path.join(tmpdir(), `stovecard-same-${units}-`));
  const content = path.join(root, 'content');
  await cp('content', content, { recursive: true });
  await rm(path.join(content, 'logs'), { recursive: true, force: true });
  const presets =
    units === 'us' ? 'kettle_presets_f: [160, 175, 195]' : 'kettle_presets_c: [70, 80, 90]';
  await writeFile(
    path.join(content, 'site.yaml'),
    `business: { name: Test Roasters, contact: t@test.example }
units: ${units}
paper: ${units === 'us' ? 'letter' : 'A5'}
${presets}
room: { ambient_c: 20, altitude_m: 600 }
base_url: https://cards.test.example/
brand: { logo: brand/logo.svg, colour: '#2E5E4E' }
${SETS}`,
  );
  const out = path.join(root, 'site');
  const result = await buildSite({
    contentDir: content,
    outDir: out,
    cacheDir: path.join(root, 'cache'),
    env: { SOURCE_DATE_EPOCH: '1767225600' },
    extraSteps: [sitePdfStep],
  });
  return { root, out, result };
}

let metric: Built;
let us: Built;
beforeAll(async () => {
  [metric, us] = [await build('metric'), await build('us')];
}, 600_000);
afterAll(async () => {
  for (const b of [metric, us]) if (b) await rm(b.root, { recursive: true, force: true });
});

const ENTITIES: Record<string, string> = {
  '&amp;': '&',
  '&lt;': '<',
  '&gt;': '>',
  '&quot;': '"',
  '&#39;': "'",
  '&nbsp;': ' ',
};

/** The card's visible text in document order: the <article>, without its drawings. */
function htmlText(html: string): string {
  const article = /<article class="card[\s\S]*<\/article>/.exec(html)?.[0] ?? '';
  return article
    .replace(/<svg\b[\s\S]*?<\/svg>/g, ' ')
    .replace(/<[^>]+>/g, ' ')
    .replace(/&[a-z]+;|&#\d+;/g, (e) => ENTITIES[e] ?? ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

/** The PDF page's text in drawing order, without what is inside a Figure (drawings, logo, QR). */
async function pdfText(bytes: Uint8Array): Promise<string> {
  const doc = await openPdf(bytes);
  try {
    const content = await (await doc.getPage(1)).getTextContent({ includeMarkedContent: true });
    const parts: string[] = [];
    const stack: string[] = [];
    for (const item of content.items as { type?: string; tag?: string; str?: string }[]) {
      if (item.type === 'beginMarkedContent' || item.type === 'beginMarkedContentProps') {
        stack.push(item.tag ?? '');
      } else if (item.type === 'endMarkedContent') {
        stack.pop();
      } else if (
        item.str !== undefined &&
        !['Figure', 'Artifact'].some((tag) => stack.includes(tag)) &&
        // List markers (a Lbl "1.", "2" …) are the PDF's drawing of what <ol> numbers itself.
        !(stack.includes('Lbl') && /^\d+\.?$/.test(item.str.trim()))
      ) {
        parts.push(item.str);
      }
    }
    return parts
      .join(' ')
      .replace(/\u00a0/g, ' ')
      .replace(/\s+/g, ' ')
      .trim();
  } finally {
    await doc.destroy();
  }
}

/** Every number with the unit after it (spaces removed), in order: "85°C", "0:15", "14,0g". */
function numbers(text: string): string[] {
  const unit = String.raw`(?:\s*(?:°C|°F|mL|fl\s?oz|oz|g|mm|in|bar|psi|%|m|ft))?`;
  const re = new RegExp(String.raw`\d+(?:[.,:]\d+)*${unit}(?![\p{L}])`, 'gu');
  return [...text.matchAll(re)].map((m) => m[0].replace(/\s+/g, ''));
}

/**
 * The text cut at each heading, in order: [header, block 1, …]. A heading not found after
 * the previous one is a missing block (its name is returned in `missing`).
 */
function cut(text: string, headings: readonly (readonly [string, string])[]) {
  const blocks = new Map<string, string>();
  const missing: string[] = [];
  let at = 0;
  let name = 'header';
  for (const [next, heading] of headings) {
    // A heading with its step number before it ("5 Temperature of each sip").
    const escaped = heading.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
    const re = new RegExp(String.raw`(?:\d+ )?` + escaped, 'g');
    re.lastIndex = at;
    const found = re.exec(text);
    if (!found) {
      missing.push(next);
      continue;
    }
    blocks.set(name, text.slice(at, found.index));
    name = next;
    at = found.index + found[0].length;
  }
  blocks.set(name, text.slice(at));
  return { blocks, missing };
}

function stationHeadings(view: StationCardView): [string, string][] {
  const r = view.recipe;
  const steps: [string, string][] = r
    ? [
        ['water', r.water.heading],
        ['coffee', r.coffee.heading],
        ['heat', r.heat.heading],
        ['times', r.timings.heading],
        ['chart', r.chart.heading],
        ['expect', r.expect.heading],
      ]
    : [['refusal', view.refusal!.heading]];
  return [
    ...steps,
    ...(view.warnings ? ([['warnings', view.warnings.heading]] as [string, string][]) : []),
    ['cautions', view.cautions.heading],
    ['footer', view.footer.printedBy],
  ];
}

function insertHeadings(view: InsertCardView): [string, string][] {
  return [
    ['body', view.heading],
    ...(view.steps.length > 0 ? ([['steps', view.stepsHeading]] as [string, string][]) : []),
    ...(view.warnings ? ([['warnings', view.warnings.heading]] as [string, string][]) : []),
    ['cautions', view.cautions.heading],
    ['footer', view.footer.printedBy],
  ];
}

/** What the floor dropped from this card's PDF (the build's stats), as block names here. */
function droppedBlocks(built: Built, pdfFile: string): Set<string> {
  const dropped = built.result.stats?.dropped?.find((d) => d.pdf === pdfFile)?.blocks ?? [];
  const names = new Set<string>();
  for (const block of dropped) {
    if (block === 'chart') names.add('chart');
    if (block === 'long-cautions') names.add('cautions');
  }
  return names;
}

async function compare(
  built: Built,
  view: StationCardView | InsertCardView,
): Promise<{ problems: string[]; blocks: number }> {
  const html = htmlText(await readFile(path.join(built.out, view.paths.pageFile), 'utf8'));
  const pdf = await pdfText(await readFile(path.join(built.out, view.paths.pdfFile)));
  const headings = view.kind === 'station' ? stationHeadings(view) : insertHeadings(view);
  const allowed = droppedBlocks(built, view.paths.pdfFile);
  const h = cut(html, headings);
  const p = cut(pdf, headings);
  const problems: string[] = [];
  if (h.missing.length > 0) problems.push(`HTML lacks ${h.missing.join(', ')}`);
  for (const name of p.missing)
    if (!allowed.has(name)) problems.push(`PDF lacks ${name} (not a block the floor dropped)`);
  for (const [name, text] of h.blocks) {
    const other = p.blocks.get(name);
    if (other === undefined || allowed.has(name)) continue;
    const [a, b] = [numbers(text), numbers(other)];
    if (a.join(' ') !== b.join(' '))
      problems.push(`${name}: HTML ${JSON.stringify(a)} ≠ PDF ${JSON.stringify(b)}`);
  }
  return { problems, blocks: h.blocks.size };
}

describe('HTML and PDF of a card: the same blocks in the same order with the same numbers', () => {
  it('station cards and inserts, English and Spanish, metric', async () => {
    const views = [...metric.result.data.stationCards, ...metric.result.data.insertCards];
    expect(new Set(views.map((v) => v.language))).toEqual(new Set(['en', 'es']));
    const problems: string[] = [];
    for (const view of views) {
      const { problems: found, blocks } = await compare(metric, view);
      expect(blocks, view.paths.pageFile).toBeGreaterThan(3);
      problems.push(...found.map((f) => `${view.paths.pageFile}: ${f}`));
    }
    expect(problems).toEqual([]);
  });

  it('station cards and inserts of a US site (°F, fl oz, oz, letter)', async () => {
    const views = [...us.result.data.stationCards, ...us.result.data.insertCards];
    const problems: string[] = [];
    for (const view of views)
      problems.push(
        ...(await compare(us, view)).problems.map((f) => `${view.paths.pageFile}: ${f}`),
      );
    expect(problems).toEqual([]);
  });

  it('the comparison sees a difference: a number changed in the HTML only is reported', async () => {
    const view = metric.result.data.stationCards.find((v) => v.recipe !== null)!;
    const file = path.join(metric.out, view.paths.pageFile);
    const original = await readFile(file, 'utf8');
    const fill = view.recipe!.water.fillVolume.value;
    await writeFile(file, original.replace(`>${fill}<`, `>${Number.parseInt(fill, 10) + 1}<`));
    try {
      const { problems } = await compare(metric, view);
      expect(problems.some((p) => p.includes('water'))).toBe(true);
    } finally {
      await writeFile(file, original);
    }
  });
});
