/**
 * render/chart.ts for the browser bundle. The spec is the card's own (cupChartSpec, the
 * same code as the build); only the drawing differs: vega with vega-lite is ~280 kB
 * gzipped, more than the page's whole budget, so the page draws the spec's two layers
 * (the target band, the two cup curves) itself, as plain SVG with the same size, colours,
 * dashes, axis titles and legend words. The numbers the chart shows are the spec's data.
 */
import type { TopLevelSpec } from 'vega-lite';
import { FONT_FAMILY } from './fonts.browser.ts';
import { measureText } from './text-measure.browser.ts';

import { cupChartSpec, type ChartInput } from '../render/chart.ts';

export {
  cupChartSpec,
  thin,
  CHART_WIDTH_PX,
  CHART_HEIGHT_PX,
  MAX_POINTS,
} from '../render/chart.ts';
export type { ChartInput, CupPoint } from '../render/chart.ts';

interface BandRow {
  readonly lo: number;
  readonly hi: number;
  readonly band: string;
}
interface CurveRow {
  readonly series: string;
  readonly cup: number;
  readonly temp: number;
}
interface Channel {
  readonly title?: string;
  readonly scale?: { readonly domain?: readonly unknown[]; readonly range?: readonly unknown[] };
}
interface Layer {
  readonly data: { readonly values: readonly unknown[] };
  readonly encoding: Record<string, Channel | undefined>;
}
interface ChartSpec {
  readonly width: number;
  readonly height: number;
  readonly config?: { readonly axis?: { readonly labelFontSize?: number } };
  readonly layer: readonly [Layer, Layer];
}

const FONT_SIZE = 11;
const INK = '#000000';
const GRID = '#d0d0d0';

/** A step of 1, 2 or 5 × 10^k near span / count (what a chart library calls nice ticks). */
function niceStep(span: number, count: number): number {
  const raw = span / Math.max(1, count);
  const power = 10 ** Math.floor(Math.log10(raw));
  const m = raw / power;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * power;
}

const fmt = (v: number): string => String(Math.round(v * 1000) / 1000);
const esc = (text: string): string =>
  text.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);
const n = (v: number): string => (Math.round(v * 100) / 100).toString();

function ticks(lo: number, hi: number, step: number): number[] {
  const out: number[] = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + 1e-9; v += step) out.push(v);
  return out;
}

/** The cup chart of a card as SVG, from its vega-lite spec (cupChartSpec). */
export async function renderChartSvg(topLevel: TopLevelSpec): Promise<string> {
  const spec = topLevel as unknown as ChartSpec;
  const [bandLayer, curveLayer] = spec.layer;
  const band = bandLayer.data.values[0] as BandRow;
  const rows = curveLayer.data.values as readonly CurveRow[];
  const x = curveLayer.encoding['x']!;
  const y = curveLayer.encoding['y']!;
  const colour = curveLayer.encoding['color']!.scale!;
  const dash = curveLayer.encoding['strokeDash']!.scale!;
  const series = colour.domain as readonly string[];
  const fontSize = spec.config?.axis?.labelFontSize ?? FONT_SIZE;

  const xDomain = x.scale!.domain as readonly number[];
  const xStep = niceStep(Math.max(1e-9, xDomain[1]! - xDomain[0]!), 6);
  const xMax = Math.ceil(xDomain[1]! / xStep - 1e-9) * xStep || xStep;
  const [yMin, yMax] = y.scale!.domain as readonly [number, number];
  const yStep = niceStep(Math.max(1e-9, yMax - yMin), 5);

  const yTicks = ticks(yMin, yMax, yStep);
  const labelW = Math.max(...yTicks.map((v) => measureText(fmt(v), { fontSize })));
  const left = 4 + fontSize + 6 + labelW + 6;
  const top = 4 + fontSize + 10;
  const w = spec.width;
  const h = spec.height;
  const width = left + w + 10;
  const height = top + h + 6 + fontSize + 6 + fontSize + 4;
  const px = (v: number) => left + (v / xMax) * w;
  const py = (v: number) => top + h - ((v - yMin) / (yMax - yMin)) * h;
  const text = (tx: number, ty: number, label: string, anchor: string, extra = '') =>
    `<text x="${n(tx)}" y="${n(ty)}" text-anchor="${anchor}" font-size="${fontSize}" fill="${INK}"${extra}>${esc(label)}</text>`;

  const parts: string[] = [];
  parts.push(`<rect width="${n(width)}" height="${n(height)}" fill="#ffffff"/>`);
  // Legend, one row on top: the band's square, then each series' line.
  let lx = left;
  const ly = 4 + fontSize / 2 + 1;
  const bandFill = String(
    (bandLayer.encoding['fill']?.scale?.range as readonly string[] | undefined)?.[0] ?? '#cde3f7',
  );
  parts.push(`<rect x="${n(lx)}" y="${n(ly - 5)}" width="10" height="10" fill="${bandFill}"/>`);
  lx += 14;
  parts.push(text(lx, ly + fontSize / 2 - 1, band.band, 'start'));
  lx += measureText(band.band, { fontSize }) + 14;
  series.forEach((name, i) => {
    const stroke = String(colour.range?.[i] ?? INK);
    const dashes = (dash.range?.[i] as readonly number[] | undefined) ?? [1, 0];
    parts.push(
      `<line x1="${n(lx)}" y1="${n(ly)}" x2="${n(lx + 18)}" y2="${n(ly)}" stroke="${stroke}" stroke-width="2.5" stroke-dasharray="${dashes.join(',')}"/>`,
    );
    lx += 22;
    parts.push(text(lx, ly + fontSize / 2 - 1, name, 'start'));
    lx += measureText(name, { fontSize }) + 14;
  });
  // Band, grid, axes.
  const bandTop = py(Math.min(yMax, band.hi));
  const bandBottom = py(Math.max(yMin, band.lo));
  parts.push(
    `<rect x="${n(left)}" y="${n(bandTop)}" width="${n(w)}" height="${n(Math.max(0, bandBottom - bandTop))}" fill="${bandFill}"/>`,
  );
  for (const v of yTicks) {
    parts.push(
      `<line x1="${n(left)}" y1="${n(py(v))}" x2="${n(left + w)}" y2="${n(py(v))}" stroke="${GRID}"/>`,
    );
    parts.push(text(left - 6, py(v) + fontSize / 3, fmt(v), 'end'));
  }
  for (const v of ticks(0, xMax, xStep)) {
    parts.push(
      `<line x1="${n(px(v))}" y1="${n(top + h)}" x2="${n(px(v))}" y2="${n(top + h + 5)}" stroke="${INK}"/>`,
    );
    parts.push(text(px(v), top + h + 6 + fontSize, fmt(v), 'middle'));
  }
  parts.push(
    `<line x1="${n(left)}" y1="${n(top + h)}" x2="${n(left + w)}" y2="${n(top + h)}" stroke="${INK}"/>`,
    `<line x1="${n(left)}" y1="${n(top)}" x2="${n(left)}" y2="${n(top + h)}" stroke="${INK}"/>`,
  );
  parts.push(text(left + w / 2, height - 4, String(x.title ?? ''), 'middle'));
  const yTitleX = 4 + fontSize;
  parts.push(
    text(
      yTitleX,
      top + h / 2,
      String(y.title ?? ''),
      'middle',
      ` transform="rotate(-90 ${n(yTitleX)} ${n(top + h / 2)})"`,
    ),
  );
  // The curves, cold start first so this card's line is drawn over it.
  [...series].reverse().forEach((name) => {
    const i = series.indexOf(name);
    const points = rows
      .filter((r) => r.series === name)
      .map((r) => `${n(px(r.cup))},${n(py(Math.min(yMax, Math.max(yMin, r.temp))))}`)
      .join(' ');
    if (points === '') return;
    const stroke = String(colour.range?.[i] ?? INK);
    const dashes = (dash.range?.[i] as readonly number[] | undefined) ?? [1, 0];
    parts.push(
      `<polyline points="${points}" fill="none" stroke="${stroke}" stroke-width="2.5" stroke-dasharray="${dashes.join(',')}"/>`,
    );
  });
  return `<svg preserveAspectRatio="xMinYMin meet" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${n(width)} ${n(height)}" width="${n(width)}" height="${n(height)}" font-family="${FONT_FAMILY}">${parts.join('')}</svg>`;
}

/** The cup chart as inline SVG (chart.ts's signature). */
export async function cupChartSvg(input: ChartInput): Promise<string> {
  return renderChartSvg(cupChartSpec(input));
}
