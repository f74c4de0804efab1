/**
 * Text widths from the real font. Without a canvas, vega guesses a label's width as
 * 0.8 × font size per character, which clips long labels and pads short ones. We measure
 * with pdfkit's font engine (fontkit underneath) and the same DejaVu Sans TTF the pages
 * and PDFs use, and plug that into vega's `textMetrics.width` hook (vega-scenegraph), so
 * the chart's layout matches what is drawn.
 */
import PDFDocument from 'pdfkit';
import * as vega from 'vega';
import { BoundedCache } from './bounded-cache.ts';
import { fontPath, type FontFace } from './fonts.ts';

export interface TextStyle {
  /** px (SVG) or pt (PDF): the width comes out in the same unit. */
  readonly fontSize: number;
  readonly bold?: boolean;
  readonly italic?: boolean;
}

let doc: PDFKit.PDFDocument | null = null;
/** Widths of the labels seen (chart ticks, titles, legends, drawing labels: a few hundred). */
const cache = new BoundedCache<string, number>(8192);

function measurer(): PDFKit.PDFDocument {
  doc ??= new PDFDocument({ autoFirstPage: false });
  return doc;
}

function faceOf(style: TextStyle): FontFace {
  if (style.bold) return style.italic ? 'bold-oblique' : 'bold';
  return style.italic ? 'oblique' : 'regular';
}

/** Advance width of `text` set in DejaVu Sans, same unit as `style.fontSize`. */
export function measureText(text: string, style: TextStyle): number {
  if (text === '' || style.fontSize <= 0) return 0;
  const face = faceOf(style);
  const key = `${face}|${style.fontSize}|${text}`;
  let width = cache.get(key);
  if (width === undefined) {
    width = measurer().font(fontPath(face)).fontSize(style.fontSize).widthOfString(text);
    cache.set(key, width);
  }
  return width;
}

/** The subset of a vega text item the measurement reads. */
interface VegaTextItem {
  fontSize?: number | string;
  fontWeight?: string | number;
  fontStyle?: string;
  limit?: number;
}

function isBold(weight: string | number | undefined): boolean {
  if (weight === undefined) return false;
  if (typeof weight === 'number') return weight >= 600;
  return weight === 'bold' || weight === 'bolder' || Number(weight) >= 600;
}

/** vega's textMetrics.width signature: (item, text) → px. */
export function vegaTextWidth(item: VegaTextItem, text: unknown): number {
  const raw = text == null ? '' : String(text).trim();
  const fontSize = item.fontSize != null ? Number(item.fontSize) || 0 : 11;
  return measureText(raw, {
    fontSize,
    bold: isBold(item.fontWeight),
    italic: item.fontStyle === 'italic' || item.fontStyle === 'oblique',
  });
}

/** Route vega's text layout through the real font metrics (idempotent). */
export function useFontMetricsInVega(): void {
  // vega-scenegraph's `textMetrics` (re-exported by vega) is not in vega's typings.
  const { textMetrics } = vega as unknown as {
    textMetrics: { width: (item: VegaTextItem, text: unknown) => number };
  };
  textMetrics.width = vegaTextWidth;
}
