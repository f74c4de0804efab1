/** The part of svg-to-pdfkit 0.1.8 the PDF renderer uses (the package ships no types). */
declare module 'svg-to-pdfkit' {
  export interface SvgToPdfOptions {
    width?: number;
    height?: number;
    preserveAspectRatio?: string;
    /** Treat SVG user units as pt instead of px (no 72/96 scaling). */
    assumePt?: boolean;
    precision?: number;
    useCSS?: boolean;
    /** Names the registered pdfkit font for an SVG font-family, weight and style. */
    fontCallback?: (
      family: string,
      bold: boolean,
      italic: boolean,
      fontOptions: { fauxItalic: boolean; fauxBold: boolean },
    ) => string;
    warningCallback?: (message: string) => void;
  }
  export default function SVGtoPDF(
    doc: PDFKit.PDFDocument,
    svg: string,
    x?: number,
    y?: number,
    options?: SvgToPdfOptions,
  ): void;
}
