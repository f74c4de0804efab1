/**
 * The Pen's measurements against DejaVu Sans's published metrics, and the SVG helpers.
 * DejaVu Sans 2.37 (hhea): unitsPerEm 2048, ascender 1901, descender −483, line gap 0.
 */
import PDFDocument from 'pdfkit';
import { describe, expect, it } from 'vitest';
import { registerPdfFonts } from '../../generator/render/pdf/fonts.ts';
import { Pen, pdfSafeSvg, svgSize } from '../../generator/render/pdf/pen.ts';
import { expectRelative } from '../helpers/close.ts';

const doc = new PDFDocument({ autoFirstPage: false });
registerPdfFonts(doc);
const pen = new Pen(doc, false);
const font = { size: 10, bold: false, color: '#000000' };
/** Line height of DejaVu Sans in em, (1901 + 483) / 2048, plus the pen's 0.116 em gap. */
const LINE_EM = (1901 + 483) / 2048 + 0.116;

describe('Pen measurements', () => {
  it('lineHeight(10 pt) is 10 × ((1901 + 483) / 2048 + 0.116) pt', () => {
    expectRelative(pen.lineHeight(font), 10 * LINE_EM, 1e-3, 'lineHeight(10 pt)');
  });
  it('ascent(10 pt) is 10 × 1901 / 2048 pt', () => {
    expectRelative(pen.ascent(font), (10 * 1901) / 2048, 1e-3, 'ascent(10 pt)');
  });
  it('height(text wrapped to three lines) is three line heights', () => {
    const word = 'brew';
    // pdfkit measures each word with the space after it.
    const w = pen.width(`${word} ${word} `, font) + 0.5;
    expectRelative(
      pen.height(`${word} ${word} ${word} ${word} ${word}`, w, font),
      3 * pen.lineHeight(font),
      1e-6,
      'three lines',
    );
  });
  it('inline(runs) wraps between runs and is Infinity when one run is wider than the box', () => {
    const big = { size: 20, bold: true, color: '#000000' };
    const one = pen.inline(
      [
        { text: '151', font: big },
        { text: ' mL', font },
      ],
      0,
      0,
      200,
    );
    expectRelative(one, pen.lineHeight(big), 1e-9, 'one line');
    const aside = '(151 g on a scale)';
    const box = Math.max(pen.width('151', big), pen.width(aside, font)) + 1;
    const two = pen.inline(
      [
        { text: '151', font: big },
        { text: ` ${aside}`, font },
      ],
      0,
      0,
      box,
    );
    expectRelative(two, pen.lineHeight(big) + pen.lineHeight(font), 1e-9, 'two lines');
    expect(pen.inline([{ text: '151', font: big }], 0, 0, 5)).toBe(Number.POSITIVE_INFINITY);
  });
});

describe('svgSize(svg)', () => {
  it('reads width and height, else the viewBox', () => {
    expect(svgSize('<svg width="402" height="202" viewBox="0 0 402 202">')).toEqual({
      width: 402,
      height: 202,
    });
    expect(svgSize('<svg class="qr" viewBox="0 0 37 37">')).toEqual({ width: 37, height: 37 });
    expect(() => svgSize('<svg>')).toThrow(/viewBox/);
  });
});

describe('pdfSafeSvg(svg)', () => {
  it('turns a dash pattern without gaps ("1,0", vega’s solid line) into none, and keeps real dashes', () => {
    expect(pdfSafeSvg('<path stroke-dasharray="1,0"/>')).toBe('<path stroke-dasharray="none"/>');
    expect(pdfSafeSvg('<path stroke-dasharray="6,4"/>')).toBe('<path stroke-dasharray="6,4"/>');
    expect(pdfSafeSvg('<path stroke-dasharray="4 3"/>')).toBe('<path stroke-dasharray="4 3"/>');
  });
});
