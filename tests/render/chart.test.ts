/** The cup chart: a valid vega-lite spec, rendered to SVG at build time with real font metrics. */
import AjvModule from 'ajv';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import * as vega from 'vega';
import { beforeAll, describe, expect, it } from 'vitest';
import type { AcceptedPlan } from '../../generator/planning/types.ts';
import { compile } from 'vega-lite';
import {
  cupChartSpec,
  renderChartSvg,
  thin,
  type ChartInput,
} from '../../generator/render/chart.ts';
import { fontPath } from '../../generator/render/fonts.ts';
import {
  measureText,
  useFontMetricsInVega,
  vegaTextWidth,
} from '../../generator/render/text-measure.ts';
import { cardWords } from '../../generator/words/card.ts';
import { demoCatalogue, firstAcceptedPlan } from './demo.ts';

const require = createRequire(import.meta.url);
const schema = require('vega-lite/vega-lite-schema.json') as object;

let plan: AcceptedPlan;
let input: ChartInput;

beforeAll(async () => {
  plan = firstAcceptedPlan(await demoCatalogue());
  input = {
    units: 'metric',
    plan: plan.brew.cupCurve,
    cold: plan.coldBrew.cupCurve,
    bandK: plan.targetBandK,
  };
});

describe('cupChartSpec', () => {
  it('validates against vega-lite’s JSON schema, in both unit systems', () => {
    // ajv is CommonJS: under NodeNext its class is the default export's `default`.
    const Ajv = AjvModule.default;
    const ajv = new Ajv({ strict: false, allErrors: true });
    const validate = ajv.compile(schema);
    for (const units of ['metric', 'us'] as const) {
      const spec = cupChartSpec({ ...input, units });
      const ok = validate(spec);
      expect(ok, JSON.stringify(validate.errors?.slice(0, 3))).toBe(true);
    }
  });

  it('plots both curves in °C against mL, thinned, and the band from the plan', () => {
    const spec = cupChartSpec(input) as unknown as {
      layer: { data: { values: Record<string, number | string>[] } }[];
    };
    const [band, lines] = spec.layer;
    expect(band!.data.values[0]).toMatchObject({
      lo: Math.round((plan.targetBandK[0] - 273.15) * 100) / 100,
      hi: Math.round((plan.targetBandK[1] - 273.15) * 100) / 100,
    });
    const series = new Set(lines!.data.values.map((v) => v.series));
    expect(series).toEqual(new Set([cardWords.chart.thisCard, cardWords.chart.coldStart]));
    const last = plan.brew.cupCurve[plan.brew.cupCurve.length - 1]!;
    const mine = lines!.data.values.filter((v) => v.series === cardWords.chart.thisCard);
    expect(mine[mine.length - 1]!.cup).toBeCloseTo(last.cupM3 * 1e6, 2);
  });

  it('thin(points) keeps the first and last points and at most MAX_POINTS', () => {
    const points = Array.from({ length: 1000 }, (_, i) => i);
    const kept = thin(points, 60);
    expect(kept).toHaveLength(60);
    expect(kept[0]).toBe(0);
    expect(kept[59]).toBe(999);
  });
});

describe('renderChartSvg', () => {
  it('renders the band and both series, labelled, without scripts or network references', async () => {
    const svg = await renderChartSvg(cupChartSpec(input));
    expect(svg).toMatch(/^<svg /);
    expect(svg).toContain('fill="#cde3f7"'); // the target band
    expect(svg).toContain(cardWords.chart.thisCard);
    expect(svg).toContain(cardWords.chart.coldStart);
    expect(svg).toContain('Target');
    expect(svg).toMatch(/class="mark-line role-mark/);
    expect(svg).toMatch(
      /stroke="#000000"[^>]*stroke-width="2.5"|stroke-width="2.5"[^>]*stroke="#000000"/,
    );
    expect(svg).toContain('#5a5a5a'); // the cold-start curve
    expect(svg).not.toMatch(/<script|href="https?:/);
  });

  it('is deterministic: same input, same bytes', async () => {
    const a = await renderChartSvg(cupChartSpec(input));
    const b = await renderChartSvg(cupChartSpec(input));
    expect(a).toBe(b);
  });
});

describe('text metrics', () => {
  const pdfWidth = (text: string, size: number, bold = false) => {
    const doc = new PDFDocument({ autoFirstPage: false });
    return doc
      .font(fontPath(bold ? 'bold' : 'regular'))
      .fontSize(size)
      .widthOfString(text);
  };

  it('measureText equals pdfkit’s widthOfString with the same DejaVu Sans TTF', () => {
    for (const text of ['90', 'Coffee in the cup (mL)', 'Brewing temperature (°C)']) {
      expect(measureText(text, { fontSize: 11 })).toBeCloseTo(pdfWidth(text, 11), 6);
      expect(measureText(text, { fontSize: 11, bold: true })).toBeCloseTo(
        pdfWidth(text, 11, true),
        6,
      );
    }
  });

  it('a long label is measured wider than a short one, and not by vega’s 0.8 em guess', () => {
    const short = measureText('iii', { fontSize: 11 });
    const long = measureText('WWW', { fontSize: 11 });
    expect(long).toBeGreaterThan(short * 2);
    expect(short).toBeLessThan(0.8 * 3 * 11 * 0.5);
  });

  it('vega’s textMetrics.width hook is routed to the font metrics', () => {
    useFontMetricsInVega();
    const metrics = (
      vega as unknown as { textMetrics: { width: (item: object, text: string) => number } }
    ).textMetrics;
    const item = { fontSize: 11, fontWeight: 'bold' };
    expect(metrics.width(item, 'Cold start')).toBeCloseTo(pdfWidth('Cold start', 11, true), 6);
    expect(vegaTextWidth({ fontSize: 11 }, 'Cold start')).toBeCloseTo(
      pdfWidth('Cold start', 11),
      6,
    );
  });

  it('the chart is laid out with the real widths, not vega’s guess (the plot starts where the labels end)', async () => {
    const spec = cupChartSpec(input);
    const offset = (svg: string) => Number(/translate\((\d+(?:\.\d+)?),/.exec(svg)![1]);
    const real = await renderChartSvg(spec);
    // The same spec laid out with vega's own estimate (0.8 × font size per character).
    const metrics = (vega as unknown as { textMetrics: { width: unknown; estimateWidth: unknown } })
      .textMetrics;
    metrics.width = metrics.estimateWidth;
    const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
    const guessed = await view.toSVG();
    view.finalize();
    useFontMetricsInVega();
    // The widest y label is the top of the domain; the left margin moves by its two widths' difference.
    const layers = (
      spec as unknown as { layer: { encoding: { y: { scale?: { domain?: number[] } } } }[] }
    ).layer;
    const top = String(layers[1]!.encoding.y.scale!.domain![1]);
    const guess = Math.floor(0.8 * top.length * 11);
    expect(offset(guessed) - offset(real)).toBeCloseTo(
      guess - measureText(top, { fontSize: 11 }),
      -0.5,
    );
    expect(offset(real)).toBeLessThan(offset(guessed));
  });
});
