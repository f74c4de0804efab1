/**
 * A PDF document as every stovecard PDF is made: PDF 1.7, PDF/A-2b (fonts embedded, sRGB
 * output intent, XMP metadata), tagged (a structure tree a screen reader follows), and
 * reproducible: same input, same bytes.
 *
 *   - CreationDate and ModDate are fixed: SOURCE_DATE_EPOCH when set, else the build
 *     date the views carry, at 00:00 UTC (pdfDate);
 *   - the file identifier (trailer /ID) is derived from the content (`idSeed`), not from
 *     the clock;
 *   - the XMP packet is written by us (xmpInfo), with every value XML-escaped: pdfkit
 *     0.20 pastes Title and Author into the XML unescaped, so a coffee named "A & B"
 *     would make the metadata invalid, and it leaves out xmp:ModifyDate, which PDF/A
 *     wants to match the Info dictionary's ModDate.
 */
import { createHash } from 'node:crypto';
import PDFDocument from 'pdfkit';
import { voiceFor } from '../voice.ts';

/** The creator tool's name, the same in every language. */
const pdfWords = voiceFor().words.pdf;
import { escapeXml } from '../svg.ts';
import { registerPdfFonts, startingFont } from './fonts.ts';

export interface PdfMeta {
  /** Document title (shown by viewers instead of the file name: displayTitle). */
  readonly title: string;
  /** The business that prints the cards. */
  readonly author: string;
  readonly subject?: string;
  /** Document language tag (`/Lang`, dc:language): generator/words/catalogue.ts langTag. */
  readonly lang: string;
  /** Creation and modification date (pdfDate). */
  readonly date: Date;
  /** Text the file identifier is hashed from: the content the document is made of. */
  readonly idSeed: string;
}

/** A document being written, with its structure root (a `Document` element). */
export interface OpenPdf {
  readonly doc: PDFKit.PDFDocument;
  readonly root: PDFKit.PDFStructureElement;
  /** Ends the document and resolves to its bytes. */
  finish(): Promise<Buffer>;
}

const MM_TO_PT = 72 / 25.4;

/** Paper size in pt from mm, to 0.01 pt (so A5 is 419.53 × 595.28 pt). */
export function pageSizePt(widthMm: number, heightMm: number): [number, number] {
  const r = (v: number) => Math.round(v * MM_TO_PT * 100) / 100;
  return [r(widthMm), r(heightMm)];
}

/**
 * The date written into a PDF: SOURCE_DATE_EPOCH when set (seconds since 1970 UTC, see
 * https://reproducible-builds.org/specs/source-date-epoch/), else `builtOn` (YYYY-MM-DD)
 * at 00:00 UTC.
 */
export function pdfDate(builtOn: string, env: NodeJS.ProcessEnv = process.env): Date {
  const raw = env.SOURCE_DATE_EPOCH;
  if (raw !== undefined && raw.trim() !== '') {
    const seconds = Number(raw);
    if (!Number.isInteger(seconds) || seconds < 0) {
      throw new Error(`SOURCE_DATE_EPOCH must be a whole number of seconds, got "${raw}"`);
    }
    return new Date(seconds * 1000);
  }
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(builtOn);
  if (!match) throw new Error(`PDF date: the build date must be YYYY-MM-DD, got "${builtOn}"`);
  return new Date(Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3])));
}

/** 16 bytes of sha256 over the seed: the trailer's /ID, the same for the same content. */
export function fileId(seed: string): Uint8Array {
  return new Uint8Array(createHash('sha256').update(seed).digest().subarray(0, 16));
}

const isoSeconds = (date: Date): string => `${date.toISOString().slice(0, 19)}Z`;

/** The XMP descriptions of the Info entries (the PDF/A identification is added by pdfkit). */
export function xmpInfo(info: {
  title: string;
  author: string;
  subject?: string;
  lang: string;
  creator: string;
  producer: string;
  date: Date;
}): string {
  const x = escapeXml;
  const when = isoSeconds(info.date);
  const description = info.subject
    ? `<dc:description><rdf:Alt><rdf:li xml:lang="x-default">${x(info.subject)}</rdf:li></rdf:Alt></dc:description>`
    : '';
  return [
    `<rdf:Description rdf:about="" xmlns:xmp="http://ns.adobe.com/xap/1.0/">`,
    `<xmp:CreateDate>${when}</xmp:CreateDate><xmp:ModifyDate>${when}</xmp:ModifyDate>`,
    `<xmp:MetadataDate>${when}</xmp:MetadataDate><xmp:CreatorTool>${x(info.creator)}</xmp:CreatorTool>`,
    `</rdf:Description>`,
    `<rdf:Description rdf:about="" xmlns:dc="http://purl.org/dc/elements/1.1/">`,
    `<dc:format>application/pdf</dc:format>`,
    `<dc:title><rdf:Alt><rdf:li xml:lang="x-default">${x(info.title)}</rdf:li></rdf:Alt></dc:title>`,
    `<dc:creator><rdf:Seq><rdf:li>${x(info.author)}</rdf:li></rdf:Seq></dc:creator>`,
    description,
    `<dc:language><rdf:Bag><rdf:li>${x(info.lang)}</rdf:li></rdf:Bag></dc:language>`,
    `</rdf:Description>`,
    `<rdf:Description rdf:about="" xmlns:pdf="http://ns.adobe.com/pdf/1.3/">`,
    `<pdf:Producer>${x(info.producer)}</pdf:Producer>`,
    `</rdf:Description>`,
  ].join('\n');
}

const PRODUCER = 'PDFKit';

/** A new document with no page yet (callers add pages of their cards' sizes). */
export function openPdf(meta: PdfMeta): OpenPdf {
  const doc = new PDFDocument({
    autoFirstPage: false,
    margin: 0,
    // DejaVu as the starting font, so pdfkit does not load Helvetica (never embedded, as
    // PDF/A would need, because no text is ever set in it); the shared parse of it.
    font: startingFont(),
    pdfVersion: '1.7',
    subset: 'PDF/A-2b',
    tagged: true,
    lang: meta.lang,
    displayTitle: true,
    info: {
      Title: meta.title,
      Author: meta.author,
      ...(meta.subject ? { Subject: meta.subject } : {}),
      Creator: pdfWords.creator,
      Producer: PRODUCER,
      CreationDate: meta.date,
      ModDate: meta.date,
    },
  });
  // Content-derived identifier instead of pdfkit's hash of the Info dictionary (which
  // would give two cards with the same title and date the same /ID).
  (doc as unknown as { _id: Uint8Array })._id = fileId(meta.idSeed);
  // Our escaped XMP in place of pdfkit's (see the module comment); called by doc.end().
  const xmp = xmpInfo({
    title: meta.title,
    author: meta.author,
    ...(meta.subject ? { subject: meta.subject } : {}),
    lang: meta.lang,
    creator: pdfWords.creator,
    producer: PRODUCER,
    date: meta.date,
  });
  (doc as unknown as { _addInfo: () => void })._addInfo = () => doc.appendXML(xmp);
  registerPdfFonts(doc);

  const root = doc.struct('Document');
  doc.addStructure(root);

  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const ended = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  return {
    doc,
    root,
    finish() {
      root.end();
      doc.end();
      return ended;
    },
  };
}
