/**
 * A US site speaks US units on every line a customer reads: the demo built with
 * `units: us` (and two invented entries that make the planner refuse for pressure and warn
 * about the altitude and an open bed) prints no °C, no millimetres, no bar and no volume in
 * millilitres in any page's text or attributes, nor in any PDF's text (pdftotext). US
 * customary units are the customer's own (common practice, no source).
 */
import { readFile, readdir, rm, writeFile, mkdtemp, cp } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite } from '../../generator/pipeline/build-site.ts';
import { sitePdfStep } from '../../generator/pipeline/pdf-step.ts';
import { planNotices } from '../../generator/planning/notices.ts';
import { CHECKED } from '../../generator/planning/model-range.ts';
import { refusalText, warningText } from '../../generator/render/plan-text.ts';
import { describeWithTools, runTool } from '../pdf/poppler.ts';

/** Metric units as printed; `mL` anywhere (a US card gives fl oz), the rest after a number or as the unit word. */
const METRIC = /°C|\bmL\b|\d\s?mm\b|\(mm\)|\bmillimet|\bCelsius\b|\d\s?bar\b|\(bar\)/;

function metricHits(text: string): string[] {
  const hits: string[] = [];
  const flat = text.replace(/\s+/g, ' ');
  const global = new RegExp(METRIC.source, 'g');
  for (const m of flat.matchAll(global))
    hits.push(flat.slice(Math.max(0, m.index! - 40), m.index! + 20));
  return hits;
}

/** Visible text and the attributes read aloud or shown (alt, aria-label, title) of an HTML page. */
function pageText(html: string): string {
  const body = html.replace(/<(script|style)\b[^>]*>[\s\S]*?<\/\1>/g, ' ');
  const attrs = [...body.matchAll(/\b(?:alt|aria-label|title)="([^"]*)"/g)].map((m) => m[1]);
  const text = body.replace(/<[^>]+>/g, ' ');
  return [text, ...attrs]
    .join(' ')
    .replace(/&nbsp;|&#160;/g, ' ')
    .replace(/&amp;/g, '&')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&quot;|&#34;/g, '"')
    .replace(/&#39;/g, "'");
}

async function filesUnder(dir: string, ext: string): Promise<string[]> {
  const entries = await readdir(dir, { withFileTypes: true, recursive: true });
  return entries
    .filter((e) => e.isFile() && e.name.endsWith(ext))
    .map((e) => path.join(e.parentPath, e.name))
    .sort();
}

describe('the metric-unit scanner (a check that it can fail)', () => {
  it('finds each metric unit as cards print them, and passes US text and the word "bar" in a name', () => {
    for (const metric of [
      '62\u00a0°C',
      '150\u00a0mL',
      '32\u00a0mm',
      '1.50\u00a0bar',
      'Coffee in the cup (mL)',
    ])
      expect(metricHits(`x ${metric} y`), metric).toHaveLength(1);
    for (const us of [
      '144\u00a0°F',
      '5.1\u00a0fl oz',
      '1.26\u00a0in',
      '21.8\u00a0psi',
      'Café Quorvel — bar station',
    ])
      expect(metricHits(us), us).toEqual([]);
  });
});

describe('refusals and warnings in US units', () => {
  it('every refusal with a quantity says it in fl oz, in, psi', () => {
    const fill = refusalText(planNotices.fillAboveValve(160e-6, 148.3e-6, 0.003), 'us');
    // 160 mL = 5.41 fl oz; 148.3 mL = 5.014 fl oz, printed rounded down; 3 mm = 0.118 in, down
    expect(fill.reason).toContain('5.4\u00a0fl oz');
    expect(fill.suggestion).toContain('5.0\u00a0fl oz');
    expect(fill.suggestion).toContain('0.11\u00a0in');
    const pressure = refusalText(planNotices.pressureNearValve(1.0e5, 1.5e5, 'fine'), 'us');
    // 1 bar = 14.5038 psi (NIST SP 811, B.8)
    expect(pressure.reason).toContain('14.5\u00a0psi');
    expect(pressure.reason).toContain('21.8\u00a0psi');
    for (const text of [fill, pressure])
      expect(metricHits(text.reason + text.suggestion)).toEqual([]);
  });

  it('a model-range warning gives the altitude in feet and the room in °F', () => {
    const altitude = warningText(
      planNotices.outsideCheckedRange('altitudeM', 3200, ...CHECKED.altitudeM),
      'us',
    );
    // 3200 m = 10,499 ft; 3000 m = 9,843 ft (1 ft = 0.3048 m exactly)
    expect(altitude).toContain('10499\u00a0ft');
    expect(altitude).toContain('9843\u00a0ft');
    const room = warningText(
      planNotices.outsideCheckedRange('ambientK', 310, ...CHECKED.ambientK),
      'us',
    );
    // 310 K = 98.3 °F; 283.15 K = 50 °F; 308.15 K = 95 °F
    expect(room).toContain('98\u00a0°F');
    expect(room).toContain('50\u00a0°F');
    expect(room).toContain('95\u00a0°F');
    const volume = warningText(
      planNotices.outsideCheckedRange('sealedVolumeM3', 40e-6, ...CHECKED.sealedVolumeM3),
      'us',
    );
    for (const w of [altitude, room, volume]) expect(metricHits(w), w).toEqual([]);
  });
});

describe('a US build of the demo', () => {
  let root: string;
  let outDir: string;

  beforeAll(async () => {
    root = await mkdtemp(path.join(tmpdir(), 'stovecard-us-'));
    const content = path.join(root, 'content');
    await cp('content', content, { recursive: true });
    const house = await readFile(path.join(content, 'coffees', 'house-blend.yaml'), 'utf8');
    // Invented: a bed so tight the pressure nears the valve (refused), and a very open one.
    await writeFile(
      path.join(content, 'coffees', 'powder-fine.yaml'),
      house
        .replace(/^permeability_m2: .*$/m, 'permeability_m2: 1.5e-14')
        .replace(/^grind: .*$/m, 'grind: fine'),
    );
    await writeFile(
      path.join(content, 'coffees', 'open-bed.yaml'),
      house.replace(/^permeability_m2: .*$/m, 'permeability_m2: 6e-12'),
    );
    const site = (await readFile(path.join(content, 'site.yaml'), 'utf8'))
      .replace(/^units: .*$/m, 'units: us')
      .replace(/^paper: .*$/m, 'paper: letter')
      .replace(/altitude_m: 0/, 'altitude_m: 3200')
      // The counter inserts fit 4 up on A4 at sea level (in either units), not with this
      // altitude's notes: the build would stop there, naming the sheet (tests/pdf/sheets.test.ts).
      .replace('sheet: { paper: A4, up: 4 }', 'sheet: { paper: letter, up: 2 }');
    await writeFile(
      path.join(content, 'site.yaml'),
      `${site}
  - id: us-extremes
    title: Extremes
    layout: station
    cards:
      - { pot: three-cup, coffee: powder-fine, stove: bar-gas }
      - { pot: three-cup, coffee: open-bed, stove: bar-gas }
`,
    );
    outDir = path.join(root, 'site');
    await buildSite({
      contentDir: content,
      outDir,
      cacheDir: path.join(root, 'cache'),
      extraSteps: [sitePdfStep],
      env: { SOURCE_DATE_EPOCH: '1714521600' },
    });
  }, 600_000);

  afterAll(async () => {
    if (root) await rm(root, { recursive: true, force: true });
  });

  it('prints no metric unit on any page', async () => {
    const pages = await filesUnder(outDir, '.html');
    expect(pages.length).toBeGreaterThan(50);
    const hits: string[] = [];
    let all = '';
    for (const page of pages) {
      const text = pageText(await readFile(page, 'utf8'));
      all += text;
      for (const hit of metricHits(text)) hits.push(`${path.relative(outDir, page)}: …${hit}…`);
    }
    expect(hits).toEqual([]);
    // The pages do speak in units: each US unit appears.
    for (const unit of ['°F', 'fl oz', 'in', 'psi', 'ft']) expect(all).toContain(`\u00a0${unit}`);
    expect(all).toContain('No recipe'); // the tight bed is refused, in US units
  });

  describeWithTools(['pdftotext'], 'its PDFs', () => {
    it('prints no metric unit in any PDF', async () => {
      const pdfs = await filesUnder(outDir, '.pdf');
      expect(pdfs.length).toBeGreaterThan(50);
      const hits: string[] = [];
      let all = '';
      for (const pdf of pdfs) {
        const text = runTool('pdftotext', ['-q', pdf, '-']).stdout;
        all += text;
        for (const hit of metricHits(text)) hits.push(`${path.relative(outDir, pdf)}: …${hit}…`);
      }
      expect(hits).toEqual([]);
      for (const unit of ['°F', 'fl oz', 'psi']) expect(all).toContain(unit);
    });
  });
});
