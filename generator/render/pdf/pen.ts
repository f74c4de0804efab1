/**
 * One code path for measuring and drawing. Every block of a card is a function of a Pen:
 * with a measuring pen it only returns heights (pdfkit's heightOfString, the same font
 * engine and TTF that draw the text), with a drawing pen it also draws and tags. So the
 * layout that was measured is exactly the layout that is drawn.
 *
 * Tagging: `group` opens a structure element (Sect, L, LI, Table, TR, …) whose children
 * are added while `fn` runs; `leaf` makes an element whose marked content is what its
 * closure draws (H1, P, Lbl, LBody, TD, Figure …); `artifact` marks decoration (rules,
 * discs, shading) so a screen reader skips it. Leaves never nest (pdfkit closes an open
 * marked-content sequence when the next one starts).
 */
import SVGtoPDF from 'svg-to-pdfkit';
import { PDF_FONT, faceOf, svgFontCallback } from './fonts.ts';
import type { TextFont } from './style.ts';
import type { LogoView } from '../brand.ts';

export type StructTag =
  | 'Art'
  | 'Sect'
  | 'Div'
  | 'H1'
  | 'H2'
  | 'H3'
  | 'P'
  | 'L'
  | 'LI'
  | 'Lbl'
  | 'LBody'
  | 'Figure'
  | 'Caption'
  | 'Note'
  | 'Table'
  | 'THead'
  | 'TBody'
  | 'TR'
  | 'TH'
  | 'TD'
  | 'TOC'
  | 'TOCI'
  | 'Reference';

export interface StructOptions {
  readonly alt?: string;
  readonly title?: string;
  /** Table header cells: 'Column' or 'Row'. */
  readonly scope?: 'Column' | 'Row';
  /** Figures: their box on the page, [left, top, right, bottom] in pt from the top left. */
  readonly bbox?: readonly [number, number, number, number];
  /** Table cells spanning several columns. */
  readonly colSpan?: number;
}

export interface WriteOptions {
  readonly align?: 'left' | 'right' | 'center';
  /** One line, never wrapped (numbers with their units). */
  readonly noWrap?: boolean;
}

export interface Run {
  readonly text: string;
  readonly font: TextFont;
}

export interface SvgSize {
  readonly width: number;
  readonly height: number;
}

/** Width and height of an SVG string: its width/height attributes, else its viewBox. */
export function svgSize(svg: string): SvgSize {
  const open = /<svg\b[^>]*>/.exec(svg)?.[0] ?? '';
  const attr = (name: string) => new RegExp(`\\s${name}="([^"]*)"`).exec(open)?.[1];
  const width = Number.parseFloat(attr('width') ?? '');
  const height = Number.parseFloat(attr('height') ?? '');
  if (width > 0 && height > 0) return { width, height };
  const box = (attr('viewBox') ?? '')
    .trim()
    .split(/[\s,]+/)
    .map(Number);
  if (box.length === 4 && box[2]! > 0 && box[3]! > 0) return { width: box[2]!, height: box[3]! };
  throw new Error('PDF: an SVG drawing has neither width and height nor a viewBox');
}

/**
 * SVG as svg-to-pdfkit draws it. vega writes a solid line as stroke-dasharray="1,0",
 * which pdfkit's dash() rejects (zero lengths); a dash pattern without gaps is a solid
 * line (SVG 2 §13.5.5), so it becomes "none".
 */
export function pdfSafeSvg(svg: string): string {
  return svg.replace(/stroke-dasharray="([^"]*)"/g, (whole, list: string) => {
    const parts = list
      .split(/[\s,]+/)
      .filter((p) => p !== '')
      .map(Number);
    const gaps = parts.length % 2 === 0 ? parts.filter((_, i) => i % 2 === 1) : parts;
    return gaps.every((g) => g === 0) ? 'stroke-dasharray="none"' : whole;
  });
}

type StructElement = PDFKit.PDFStructureElement;

/**
 * Measurements by face, size, width and text. Every pen sets text in the same two
 * DejaVu Sans faces, so a measurement holds for every document; the fit search measures
 * the same strings at each font step and each card repeats the cautions and the footer.
 */
const measured = new Map<string, number>();
const MEASURED_MAX = 200_000;

function remember(key: string, value: number): void {
  if (measured.size >= MEASURED_MAX) measured.clear();
  measured.set(key, value);
}

export class Pen {
  readonly doc: PDFKit.PDFDocument;
  readonly drawing: boolean;
  /** Messages from svg-to-pdfkit (unsupported SVG features); empty for our drawings. */
  readonly warnings: string[] = [];
  private readonly parents: StructElement[];

  constructor(doc: PDFKit.PDFDocument, drawing: boolean, parent?: StructElement) {
    this.doc = doc;
    this.drawing = drawing;
    if (drawing && !parent) throw new Error('PDF: a drawing pen needs a structure parent');
    this.parents = parent ? [parent] : [];
  }

  /** A measuring pen on the same document (same fonts). */
  measuring(): Pen {
    return new Pen(this.doc, false);
  }

  private use(font: TextFont): PDFKit.PDFDocument {
    return this.doc.font(PDF_FONT[faceOf(font.bold, false)]).fontSize(font.size);
  }

  /** Extra space between lines: DejaVu Sans is 1.164 em tall, the stylesheet sets 1.28. */
  lineGap(font: TextFont): number {
    return font.size * 0.116;
  }

  /** Unwrapped width of `text`. */
  width(text: string, font: TextFont): number {
    const key = `w|${font.bold ? 1 : 0}|${font.size}|${text}`;
    let width = measured.get(key);
    if (width === undefined) {
      width = this.use(font).widthOfString(text);
      remember(key, width);
    }
    return width;
  }

  /** Height of one line. */
  lineHeight(font: TextFont): number {
    const key = `l|${font.bold ? 1 : 0}|${font.size}`;
    let height = measured.get(key);
    if (height === undefined) {
      height = this.use(font).currentLineHeight(true) + this.lineGap(font);
      remember(key, height);
    }
    return height;
  }

  /** Height of `text` wrapped at `width`. */
  height(text: string, width: number, font: TextFont, options: WriteOptions = {}): number {
    if (text === '') return 0;
    if (options.noWrap) return this.lineHeight(font);
    const key = `h|${font.bold ? 1 : 0}|${font.size}|${width}|${text}`;
    let height = measured.get(key);
    if (height === undefined) {
      height = this.use(font).heightOfString(text, { width, lineGap: this.lineGap(font) });
      remember(key, height);
    }
    return height;
  }

  /** Height of the font's ascender above the baseline, pt (where a line's baseline sits). */
  ascent(font: TextFont): number {
    const key = `a|${font.bold ? 1 : 0}|${font.size}`;
    let ascent = measured.get(key);
    if (ascent === undefined) {
      const metrics = (this.use(font) as unknown as { _font: { ascender: number } })._font;
      ascent = (metrics.ascender / 1000) * font.size;
      remember(key, ascent);
    }
    return ascent;
  }

  /**
   * Runs of text in different sizes on one baseline ("151" big, " mL" smaller), wrapped
   * between runs when they do not fit (a wrapped run loses its leading space). Returns the
   * height; Infinity when one run alone is wider than `width`. Untagged.
   */
  inline(runs: readonly Run[], x: number, y: number, width: number): number {
    const lines: Run[][] = [];
    let line: Run[] = [];
    let used = 0;
    for (const run of runs) {
      let text = run.text;
      let w = this.width(text, run.font);
      if (line.length > 0 && used + w > width) {
        lines.push(line);
        line = [];
        used = 0;
        text = text.trimStart();
        w = this.width(text, run.font);
      }
      if (w > width + 1e-6) return Number.POSITIVE_INFINITY;
      line.push({ text, font: run.font });
      used += w;
    }
    if (line.length > 0) lines.push(line);
    let h = 0;
    for (const each of lines) {
      const ascent = Math.max(...each.map((run) => this.ascent(run.font)));
      const height = Math.max(...each.map((run) => this.lineHeight(run.font)));
      let dx = 0;
      for (const run of each) {
        const top = y + h + ascent - this.ascent(run.font);
        this.write(run.text, x + dx, top, width - dx, run.font, { noWrap: true });
        dx += this.width(run.text, run.font);
      }
      h += height;
    }
    return h;
  }

  /** Longest word of `text` (the narrowest width it can wrap to). */
  minWidth(text: string, font: TextFont): number {
    return Math.max(0, ...text.split(/\s+/).map((word) => this.width(word, font)));
  }

  /** Draws `text` (when drawing) in a box `width` wide at (x, y); returns its height. Untagged. */
  write(
    text: string,
    x: number,
    y: number,
    width: number,
    font: TextFont,
    options: WriteOptions = {},
  ): number {
    const height = this.height(text, width, font, options);
    if (this.drawing && text !== '') {
      this.use(font).fillColor(font.color);
      if (options.noWrap) {
        const w = this.width(text, font);
        const dx =
          options.align === 'right' ? width - w : options.align === 'center' ? (width - w) / 2 : 0;
        this.doc.text(text, x + dx, y, { lineBreak: false });
      } else {
        this.doc.text(text, x, y, {
          width,
          lineGap: this.lineGap(font),
          align: options.align ?? 'left',
        });
      }
    }
    return height;
  }

  /** A leaf element holding one piece of text; returns its height. */
  para(
    tag: StructTag,
    text: string,
    x: number,
    y: number,
    width: number,
    font: TextFont,
    options: WriteOptions = {},
  ): number {
    let height = 0;
    this.leaf(tag, () => {
      height = this.write(text, x, y, width, font, options);
    });
    return this.drawing ? height : this.height(text, width, font, options);
  }

  /** A structure element whose marked content is what `draw` draws (`draw` also runs when measuring). */
  leaf(tag: StructTag, draw: () => void, options: StructOptions = {}): void {
    if (!this.drawing) {
      draw();
      return;
    }
    const element = this.doc.struct(tag, structOptions(options), draw);
    if (options.colSpan !== undefined) {
      // pdfkit sets table attributes for Scope only; ColSpan goes in the same /A dictionary.
      const data = (element as unknown as { dictionary: { data: { A?: Record<string, unknown> } } })
        .dictionary.data;
      data.A = { ...(data.A ?? {}), O: 'Table', ColSpan: options.colSpan };
    }
    this.parent().add(element);
  }

  /** A structure element whose children are added while `fn` runs. */
  group<T>(tag: StructTag, fn: () => T, options: StructOptions = {}): T {
    if (!this.drawing) return fn();
    const element = this.doc.struct(tag, structOptions(options));
    this.parent().add(element);
    this.parents.push(element);
    try {
      return fn();
    } finally {
      this.parents.pop();
      element.end();
    }
  }

  /**
   * Opens a structure element that spans several flow items (a TOC over pages); children
   * go into it until `close`. No-op when measuring.
   */
  open(tag: StructTag, options: StructOptions = {}): void {
    if (!this.drawing) return;
    const element = this.doc.struct(tag, structOptions(options));
    this.parent().add(element);
    this.parents.push(element);
  }

  close(): void {
    if (!this.drawing) return;
    const element = this.parents.pop();
    if (!element || this.parents.length === 0) throw new Error('PDF: close() without open()');
    element.end();
  }

  /** Decoration that is not content: rules, discs, shading, page numbers. Drawn only when drawing. */
  artifact(draw: () => void, type: 'Layout' | 'Pagination' = 'Layout'): void {
    if (!this.drawing) return;
    this.doc.markContent('Artifact', { type });
    this.doc.save();
    draw();
    this.doc.restore();
    this.doc.endMarkedContent();
  }

  /** A horizontal rule (artifact). */
  rule(x: number, y: number, width: number, thickness: number, color: string): void {
    this.artifact(() => {
      this.doc.rect(x, y, width, thickness).fill(color);
    });
  }

  /**
   * An SVG drawing scaled to `width`, tagged as a Figure with its text alternative.
   * Returns its height. Fonts inside the SVG map to the embedded DejaVu Sans.
   */
  figure(svg: string, x: number, y: number, width: number, alt: string): number {
    const size = svgSize(svg);
    const scale = width / size.width;
    const height = size.height * scale;
    if (!this.drawing) return height;
    this.leaf(
      'Figure',
      () => {
        this.doc.save();
        this.doc.translate(x, y).scale(scale);
        this.svgAt(svg, size);
        this.doc.restore();
      },
      { alt, bbox: [x, y, x + width, y + height] },
    );
    return height;
  }

  /** Draws `svg` at the current origin in its own size (the caller translates and scales). */
  private svgAt(svg: string, size: SvgSize): void {
    SVGtoPDF(this.doc, pdfSafeSvg(svg), 0, 0, {
      assumePt: true,
      width: size.width,
      height: size.height,
      fontCallback: svgFontCallback,
      warningCallback: (message) => this.warnings.push(message),
    });
  }

  /**
   * The roaster's logo in a box `width` × `height` pt (logoBox: its aspect kept), tagged as a
   * Figure with its text alternative. A PNG is an image XObject (pdfkit `image`); an SVG is
   * drawn from its shapes by svg-to-pdfkit, like the drawings.
   */
  logo(logo: LogoView, x: number, y: number, width: number, height: number): void {
    if (!this.drawing) return;
    this.leaf(
      'Figure',
      () => {
        this.doc.save();
        if (logo.format === 'png') {
          this.doc.image(Buffer.from(logo.data, 'base64'), x, y, { width, height });
        } else {
          this.doc.translate(x, y).scale(width / logo.width);
          this.svgAt(logo.data, { width: logo.width, height: logo.height });
        }
        this.doc.restore();
      },
      { alt: logo.alt, bbox: [x, y, x + width, y + height] },
    );
  }

  /** An SVG drawing scaled to `width`, as decoration (an artifact: the text beside it says it all). */
  decoration(svg: string, x: number, y: number, width: number): number {
    const size = svgSize(svg);
    const scale = width / size.width;
    if (this.drawing) {
      this.artifact(() => {
        this.doc.translate(x, y).scale(scale);
        this.svgAt(svg, size);
      });
    }
    return size.height * scale;
  }

  private parent(): StructElement {
    const parent = this.parents[this.parents.length - 1];
    if (!parent) throw new Error('PDF: no structure parent');
    return parent;
  }
}

function structOptions(options: StructOptions): PDFKit.Mixins.StructureElementOptions {
  const out: Record<string, unknown> = {};
  if (options.alt !== undefined) out.alt = options.alt;
  if (options.title !== undefined) out.title = options.title;
  if (options.scope !== undefined) out.scope = options.scope;
  if (options.bbox !== undefined) {
    out.bbox = [...options.bbox];
    out.placement = 'Block';
  }
  return out as PDFKit.Mixins.StructureElementOptions;
}
