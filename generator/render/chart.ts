/**
 * The cup chart of a station card: extraction temperature (y) against coffee in the cup
 * (x), for this card's brew and for the same pot, coffee and setting started from cold
 * water, over the coffee's target band (shaded).
 *
 *   ChartInput (SI curves) ─ cupChartSpec ─▶ vega-lite spec ─ chartRuntime (compile and
 *     vega.parse once per shape of spec, chart-runtime.ts) ─▶ vega runtime
 *     ─ View(renderer: 'none').toSVG() ─▶ SVG string (inline on the page, drawn into PDFs)
 *
 * Rendered at build time with no canvas: text widths come from DejaVu Sans through
 * text-measure.ts, so the layout leaves room for every label.
 */
import * as vega from 'vega';
import type { TopLevelSpec } from 'vega-lite';
import type { UnitSystem } from '../content/types.ts';
import { chartRuntime } from './chart-runtime.ts';
import { FONT_FAMILY } from './fonts.ts';
import { chartUnits, temperatureBand } from './format.ts';
import { useFontMetricsInVega } from './text-measure.ts';
import { asVoice, type Voice } from './voice.ts';

/** One point of a cup curve, SI: cumulative cup volume and the temperature it was brewed at. */
export interface CupPoint {
  readonly cupM3: number;
  readonly extractionK: number;
}

export interface ChartInput {
  /** The output's voice (its units, words and decimal mark), or a unit system (English). */
  readonly units: UnitSystem | Voice;
  /** This card's brew, ascending cupM3 (AcceptedPlan.brew.cupCurve). */
  readonly plan: readonly CupPoint[];
  /** The cold start (AcceptedPlan.coldBrew.cupCurve). */
  readonly cold: readonly CupPoint[];
  /** Target band [low, high], K. */
  readonly bandK: readonly [number, number];
}

/** Chart size in CSS px (the SVG carries a viewBox and is scaled to its box on the page). */
export const CHART_WIDTH_PX = 300;
export const CHART_HEIGHT_PX = 95;
/** Points kept per curve (the curves are smooth; more only grows the SVG). */
export const MAX_POINTS = 60;
const INK = '#000000';
const COLD_INK = '#5a5a5a';
const BAND_FILL = '#cde3f7';
const FONT_SIZE = 11;

/** Evenly thinned curve that keeps the first and last points. */
export function thin<T>(points: readonly T[], max = MAX_POINTS): T[] {
  if (points.length <= max) return [...points];
  const out: T[] = [];
  const step = (points.length - 1) / (max - 1);
  for (let i = 0; i < max; i++) out.push(points[Math.round(i * step)]!);
  return out;
}

const r2 = (v: number): number => Math.round(v * 100) / 100;

/** The vega-lite spec of the cup chart (valid against vega-lite's JSON schema). */
export function cupChartSpec(input: ChartInput): TopLevelSpec {
  const voice = asVoice(input.units);
  const u = chartUnits(voice.units);
  const words = voice.words.card.chart;
  const rows = (series: string, curve: readonly CupPoint[]) =>
    thin(curve).map((p) => ({
      series,
      cup: r2(u.volume(p.cupM3)),
      temp: r2(u.temperature(p.extractionK)),
    }));
  const values = [...rows(words.thisCard, input.plan), ...rows(words.coldStart, input.cold)];
  const bandLo = r2(u.temperature(input.bandK[0]));
  const bandHi = r2(u.temperature(input.bandK[1]));
  const temps = [...values.map((v) => v.temp), bandLo, bandHi];
  const step = 5;
  const yMin = Math.floor(Math.min(...temps) / step) * step;
  const yMax = Math.ceil(Math.max(...temps) / step) * step;
  const xMax = Math.max(0, ...values.map((v) => v.cup));
  const bandLabel = words.band(temperatureBand(input.bandK, voice));
  // Tick labels in the voice's decimal mark (vega writes a point; no thousands separator).
  const decimalAxis =
    voice.decimal === '.'
      ? {}
      : { labelExpr: `replace(format(datum.value, '~g'), '.', '${voice.decimal}')` };

  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: CHART_WIDTH_PX,
    height: CHART_HEIGHT_PX,
    background: '#ffffff',
    padding: 4,
    config: {
      // No vega-made ARIA text ("Y-axis titled … for a linear scale", English whatever the
      // card's language): the figure's own text alternative (chart.alt) names the chart.
      aria: false,
      font: FONT_FAMILY,
      view: { stroke: null },
      axis: {
        labelFontSize: FONT_SIZE,
        titleFontSize: FONT_SIZE,
        titleFontWeight: 'normal',
        labelColor: INK,
        titleColor: INK,
        domainColor: INK,
        tickColor: INK,
        gridColor: '#d0d0d0',
      },
      legend: {
        labelFontSize: FONT_SIZE,
        labelColor: INK,
        symbolStrokeWidth: 2.5,
        symbolSize: 300,
      },
    },
    layer: [
      {
        description:
          'target band, keyed in the legend (a label inside the band would sit under the curves)',
        data: { values: [{ lo: bandLo, hi: bandHi, band: bandLabel }] },
        mark: { type: 'rect', opacity: 1 },
        encoding: {
          y: { field: 'lo', type: 'quantitative' },
          y2: { field: 'hi' },
          fill: {
            field: 'band',
            type: 'nominal',
            scale: { domain: [bandLabel], range: [BAND_FILL] },
            legend: { title: null, orient: 'top', direction: 'horizontal', symbolType: 'square' },
          },
        },
      },
      {
        description: 'extraction temperature against the cup',
        data: { values },
        mark: { type: 'line', strokeWidth: 2.5, interpolate: 'monotone' },
        encoding: {
          x: {
            field: 'cup',
            type: 'quantitative',
            title: words.xTitle(u.volumeUnit),
            scale: { domain: [0, xMax], nice: true },
            axis: { tickCount: 6, grid: false, ...decimalAxis },
          },
          y: {
            field: 'temp',
            type: 'quantitative',
            title: words.yTitle(u.temperatureUnit),
            scale: { domain: [yMin, yMax], nice: false, zero: false },
            axis: { tickCount: 5, grid: true, ...decimalAxis },
          },
          color: {
            field: 'series',
            type: 'nominal',
            scale: { domain: [words.thisCard, words.coldStart], range: [INK, COLD_INK] },
            legend: { title: null, orient: 'top', direction: 'horizontal' },
          },
          strokeDash: {
            field: 'series',
            type: 'nominal',
            scale: {
              domain: [words.thisCard, words.coldStart],
              range: [
                [1, 0],
                [6, 4],
              ],
            },
            // Same legend as colour, so the two merge into one key with dashed symbols.
            legend: { title: null, orient: 'top', direction: 'horizontal' },
          },
        },
      },
    ],
  };
}

/**
 * Render a vega-lite spec to an SVG string, without a browser or canvas: the same SVG as
 * compiling it afresh, with the compile done once per shape of spec (chart-runtime.ts).
 */
export async function renderChartSvg(spec: TopLevelSpec): Promise<string> {
  useFontMetricsInVega();
  const view = new vega.View(chartRuntime(spec), { renderer: 'none' });
  try {
    // Same input, same bytes: vega numbers clip paths and gradients from a global counter.
    vega.resetSVGDefIds();
    const svg = await view.toSVG();
    // Anchored top-left when its box is taller or wider than the chart (print layouts).
    return svg.replace('<svg ', '<svg preserveAspectRatio="xMinYMin meet" ');
  } finally {
    view.finalize();
  }
}

/** The cup chart as inline SVG. */
export async function cupChartSvg(input: ChartInput): Promise<string> {
  return renderChartSvg(cupChartSpec(input));
}
