/** openPdf's fixed parts: paper sizes, dates, the file identifier and the XMP packet. */
import { describe, expect, it } from 'vitest';
import {
  fileId,
  openPdf,
  pageSizePt,
  pdfDate,
  xmpInfo,
} from '../../generator/render/pdf/document.ts';
import { readPdf } from './read-pdf.ts';

describe('pageSizePt(mm)', () => {
  // ISO 216 A sizes and ANSI letter, in PostScript points (1 pt = 1/72 in = 25.4/72 mm).
  it('pageSizePt(210, 297) is A4, 595.28 × 841.89 pt', () => {
    expect(pageSizePt(210, 297)).toEqual([595.28, 841.89]);
  });
  it('pageSizePt(215.9, 279.4) is US letter, 612 × 792 pt exactly', () => {
    expect(pageSizePt(215.9, 279.4)).toEqual([612, 792]);
  });
  it('pageSizePt(139.7, 215.9) is US half-letter, 396 × 612 pt', () => {
    expect(pageSizePt(139.7, 215.9)).toEqual([396, 612]);
  });
});

describe('pdfDate(builtOn, env)', () => {
  it('pdfDate("2024-05-01", {}) is 2024-05-01 00:00 UTC', () => {
    expect(pdfDate('2024-05-01', {}).toISOString()).toBe('2024-05-01T00:00:00.000Z');
  });
  it('SOURCE_DATE_EPOCH=1700000000 is 2023-11-14 22:13:20 UTC, whatever the build date', () => {
    expect(pdfDate('2024-05-01', { SOURCE_DATE_EPOCH: '1700000000' }).toISOString()).toBe(
      '2023-11-14T22:13:20.000Z',
    );
  });
  it('a SOURCE_DATE_EPOCH that is not whole seconds is an error', () => {
    expect(() => pdfDate('2024-05-01', { SOURCE_DATE_EPOCH: '17e8.5' })).toThrow(
      /SOURCE_DATE_EPOCH/,
    );
  });
});

describe('fileId(seed)', () => {
  it('is 16 bytes, the same for the same seed and different for another', () => {
    expect(fileId('a')).toHaveLength(16);
    expect(Buffer.from(fileId('a')).equals(Buffer.from(fileId('a')))).toBe(true);
    expect(Buffer.from(fileId('a')).equals(Buffer.from(fileId('b')))).toBe(false);
  });
});

describe('xmpInfo(info)', () => {
  it('escapes markup in the title and author instead of pasting it into the XML', () => {
    const xml = xmpInfo({
      title: '<script>alert("x")</script> & Co',
      author: 'A <b>B</b>',
      lang: 'en-GB',
      creator: 'stovecard',
      producer: 'PDFKit',
      date: new Date(Date.UTC(2024, 4, 1)),
    });
    expect(xml).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; Co');
    expect(xml).toContain('A &lt;b&gt;B&lt;/b&gt;');
    expect(xml).not.toContain('<script>');
    expect(xml).toContain('<xmp:CreateDate>2024-05-01T00:00:00Z</xmp:CreateDate>');
    expect(xml).toContain('<xmp:ModifyDate>2024-05-01T00:00:00Z</xmp:ModifyDate>');
  });
});

describe('openPdf(meta)', () => {
  async function blank(title: string, seed: string): Promise<Buffer> {
    const open = openPdf({
      title,
      author: 'Brindlemoss Roastery',
      lang: 'en-GB',
      date: new Date(Date.UTC(2024, 4, 1)),
      idSeed: seed,
    });
    open.doc.addPage({ size: [420, 595], margin: 0 });
    return open.finish();
  }

  it('writes PDF 1.7 declaring PDF/A-2b, tagged, with the fixed dates and the Info matching the XMP', async () => {
    const bytes = await blank('A & B', 'seed');
    expect(bytes.subarray(0, 8).toString('latin1')).toBe('%PDF-1.7');
    const pdf = await readPdf(bytes);
    expect(pdf.xmp).toContain('<pdfaid:part>2</pdfaid:part>');
    expect(pdf.xmp).toContain('<pdfaid:conformance>B</pdfaid:conformance>');
    expect(pdf.xmp).toContain('<rdf:li xml:lang="x-default">A &amp; B</rdf:li>');
    expect(pdf.marked).toBe(true);
    expect(pdf.info.Title).toBe('A & B');
    expect(pdf.info.CreationDate).toBe('D:20240501000000Z');
    expect(pdf.info.ModDate).toBe('D:20240501000000Z');
    expect(pdf.info.Language).toBe('en-GB');
    const text = bytes.toString('latin1');
    expect(text).toContain('/StructTreeRoot');
    expect(text).toContain('/OutputIntents');
    expect(text).toContain('/DisplayDocTitle true');
  });

  it('the same content gives the same bytes; another seed another /ID', async () => {
    const a = await blank('t', 'one');
    expect(a.equals(await blank('t', 'one'))).toBe(true);
    const b = await blank('t', 'two');
    expect(a.equals(b)).toBe(false);
    const id = (bytes: Buffer) => /\/ID \[<([0-9a-f]+)>/.exec(bytes.toString('latin1'))?.[1];
    expect(id(a)).toBe(Buffer.from(fileId('one')).toString('hex'));
    expect(id(b)).toBe(Buffer.from(fileId('two')).toString('hex'));
  });
});
