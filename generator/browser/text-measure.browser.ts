/// <reference lib="dom" />
/**
 * render/text-measure.ts for the browser bundle: widths from the page's own DejaVu Sans
 * (loaded by @font-face before the first card is drawn, planner.ts) through a canvas, in
 * place of pdfkit's font engine. Same font, so the drawings' labels get the same room.
 */
import { FONT_FAMILY } from './fonts.browser.ts';

export interface TextStyle {
  readonly fontSize: number;
  readonly bold?: boolean;
  readonly italic?: boolean;
}

let context: CanvasRenderingContext2D | null = null;
const cache = new Map<string, number>();

export function measureText(text: string, style: TextStyle): number {
  if (text === '' || style.fontSize <= 0) return 0;
  const font = `${style.italic ? 'italic ' : ''}${style.bold ? 'bold ' : ''}${style.fontSize}px "${FONT_FAMILY}"`;
  const key = `${font}|${text}`;
  let width = cache.get(key);
  if (width === undefined) {
    context ??= document.createElement('canvas').getContext('2d');
    if (!context) return text.length * style.fontSize * 0.6;
    context.font = font;
    width = context.measureText(text).width;
    if (cache.size > 4096) cache.clear();
    cache.set(key, width);
  }
  return width;
}

/** The chart in the browser is drawn by chart-svg.ts, not vega: nothing to route. */
export function useFontMetricsInVega(): void {}
