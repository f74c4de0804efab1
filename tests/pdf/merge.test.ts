/**
 * mergeCardPages(shell, grafts) on small documents made by openPdf (so by pdfkit, as the
 * cards are): a shell with a tagged front page and two placeholder pages carrying only a
 * page-number artifact and a bookmark, and one-page cards with text, a tagged link
 * annotation and a title holding PDF syntax. Read back with pdfjs and with our reader;
 * the rules checked are ISO 32000-1's (§14.7.4 parent tree, §14.7.2 structure hierarchy,
 * §12.5.2 one page per annotation, §9.6.4 subset tags).
 */
import { describe, expect, it } from 'vitest';
import { openPdf } from '../../generator/render/pdf/document.ts';
import {
  decodeSegment,
  encodeSegment,
  mergeCardPages,
  pageSegment,
  type CardGraft,
} from '../../generator/render/pdf/merge.ts';
import { PdfFile } from '../../generator/render/pdf/pdf-file.ts';
import {
  intOf,
  isDict,
  isRef,
  nameOf,
  type PdfDict,
  type PdfValue,
} from '../../generator/render/pdf/pdf-syntax.ts';
import { describeWithTools, runTool } from './poppler.ts';
import { readPdf, squash, structNodes } from './read-pdf.ts';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';

const DATE = new Date(Date.UTC(2024, 4, 1));
const A6: [number, number] = [297.64, 419.53];

/** A one-page tagged card: an Art with a heading and a link, as pdfkit tags them. */
async function card(title: string, url: string, size = A6): Promise<Buffer> {
  const { doc, root, finish } = openPdf({
    title,
    author: 'Test',
    lang: 'en-GB',
    date: DATE,
    idSeed: title,
  });
  doc.addPage({ size, margin: 0 });
  const art = doc.struct('Art', { title } as never);
  root.add(art);
  art.add(doc.struct('H1', {}, () => doc.font('DejaVuSans-Bold').fontSize(14).text(title, 20, 20)));
  const link = doc.struct('Link');
  art.add(link);
  link.add(() => doc.font('DejaVuSans').fontSize(9).text(url, 20, 60, { lineBreak: false }));
  doc.link(20, 60, 200, 12, url, { structParent: link } as never);
  link.end();
  art.end();
  return finish();
}

/** A shell: one tagged front page, then a placeholder page per card with "n / total". */
async function shell(cards: number, size = A6): Promise<Buffer> {
  const { doc, root, finish } = openPdf({
    title: 'Set',
    author: 'Test',
    lang: 'en-GB',
    date: DATE,
    idSeed: 's',
  });
  const total = cards + 1;
  doc.addPage({ size: [300, 400], margin: 0 });
  root.add(
    doc.struct('P', {}, () => doc.font('DejaVuSans').fontSize(12).text('Front page', 20, 20)),
  );
  doc.outline.addItem('Front');
  for (let i = 0; i < cards; i++) {
    doc.addPage({ size, margin: 0 });
    doc.markContent('Artifact', { type: 'Pagination' } as never);
    doc
      .font('DejaVuSans')
      .fontSize(7)
      .text(`${i + 2} / ${total}`, 120, size[1] - 14, {
        lineBreak: false,
      });
    doc.endMarkedContent();
    doc.outline.addItem(`Card ${i + 1}`);
  }
  return finish();
}

/** Every object of a file, by number (our reader, over its cross-reference table). */
function objects(bytes: Uint8Array): Map<number, PdfDict> {
  const file = new PdfFile(bytes);
  const out = new Map<number, PdfDict>();
  const size = intOf(file.trailer.get('Size'))!;
  for (let num = 1; num < size; num++) {
    const value = file.object(num).value;
    if (isDict(value)) out.set(num, value);
  }
  return out;
}

const byType = (all: Map<number, PdfDict>, type: string) =>
  [...all].filter(([, d]) => nameOf(d.get('Type')) === type);

const TRICKY = 'Lot (12 0 R) \\ ) blend';

async function merged() {
  const cards = [
    await card(TRICKY, 'https://example.com/one'),
    await card('Second card', 'https://example.com/two'),
  ];
  const bytes = mergeCardPages(await shell(2), [
    { page: 1, pdf: cards[0]! },
    { page: 2, pdf: cards[1]! },
  ]);
  return { cards, bytes };
}

describe('mergeCardPages(shell, grafts)', () => {
  it('puts each card’s page in its placeholder’s place, with the placeholder’s page number over it', async () => {
    const { bytes } = await merged();
    const read = await readPdf(bytes);
    expect(read.pages).toBe(3);
    expect(read.sizes).toEqual([[300, 400], A6, A6]);
    expect(squash(read.text[0]!)).toBe('Frontpage');
    expect(squash(read.text[1]!)).toBe(squash(`${TRICKY} https://example.com/one 2 / 3`));
    expect(squash(read.text[2]!)).toBe(squash('Second card https://example.com/two 3 / 3'));
  });

  it('keeps the bookmarks, now opening the cards’ pages', async () => {
    const read = await readPdf((await merged()).bytes);
    expect(read.outline).toEqual([
      { title: 'Front', page: 0 },
      { title: 'Card 1', page: 1 },
      { title: 'Card 2', page: 2 },
    ]);
  });

  it('keeps each card’s link annotation on its own page, tagged as a Link (§12.5.2, §14.7.4.4)', async () => {
    const read = await readPdf((await merged()).bytes);
    expect(read.links).toEqual([[], ['https://example.com/one'], ['https://example.com/two']]);
    for (const page of [1, 2]) {
      const roles = structNodes(read.structure[page]!).map((n) => n.role);
      expect(roles, `page ${page + 1}`).toEqual(['Root', 'Document', 'Art', 'H1', 'Link']);
      const link = structNodes(read.structure[page]!).find((n) => n.role === 'Link')!;
      // pdfjs calls an object reference (OBJR) child "object".
      expect(link.children?.map((c) => ('type' in c ? c.type : 'element'))).toEqual([
        'content',
        'object',
      ]);
    }
  });

  it('gives every parent-tree key one owner, and /ParentTreeNextKey past the last (§14.7.4.4)', async () => {
    const all = objects((await merged()).bytes);
    const keys: number[] = [];
    for (const [, dict] of all) {
      for (const key of ['StructParents', 'StructParent']) {
        const k = intOf(dict.get(key));
        if (k !== null) keys.push(k);
      }
    }
    expect(keys.sort((a, b) => a - b)).toEqual([0, 1, 2, 3, 4]);
    const [[, root]] = byType(all, 'StructTreeRoot') as [[number, PdfDict]];
    const nums = (root.get('ParentTree') as PdfDict).get('Nums') as PdfValue[];
    expect(nums.filter((_, i) => i % 2 === 0).map(intOf)).toEqual([0, 1, 2, 3, 4]);
    expect(intOf(root.get('ParentTreeNextKey'))).toBe(5);
    // Each annotation's key leads to the element holding its OBJR.
    for (const [num, annot] of byType(all, 'Annot')) {
      const key = intOf(annot.get('StructParent'))!;
      const owner = nums[nums.findIndex((v, i) => i % 2 === 0 && intOf(v) === key) + 1]!;
      const element = isRef(owner) ? all.get(owner.num)! : null;
      expect(nameOf(element?.get('S')), `annotation ${num}`).toBe('Link');
      const objr = (element!.get('K') as PdfValue[]).find((k) => isDict(k)) as PdfDict;
      expect((objr.get('Obj') as { num: number }).num).toBe(num);
    }
  });

  it('moves the cards’ Art elements under the shell’s Document, in page order (§14.7.2)', async () => {
    const all = objects((await merged()).bytes);
    const [docNum, document] = [...all].find(([, d]) => nameOf(d.get('S')) === 'Document')!;
    const kids = (document.get('K') as PdfValue[]).map((k) => all.get((k as { num: number }).num)!);
    expect(kids.map((k) => nameOf(k.get('S')))).toEqual(['P', 'Art', 'Art']);
    for (const kid of kids) expect((kid.get('P') as { num: number }).num).toBe(docNum);
    const pages = new PdfFile((await merged()).bytes).pages().map((p) => p.num);
    expect(kids.map((k) => (k.get('Pg') as { num: number } | undefined)?.num)).toEqual([
      pages[0],
      undefined,
      undefined,
    ]);
  });

  it('copies a title holding "(12 0 R)" byte for byte: text in strings is never a reference', async () => {
    const { cards, bytes } = await merged();
    const title = /\/T (\(Lot .*? blend\))/.exec(cards[0]!.toString('latin1'))![1]!;
    expect(title).toContain(String.raw`\(12 0 R\)`);
    expect(bytes.toString('latin1')).toContain(`/T ${title}`);
  });

  /** The subset names of a file's font descriptors, each checked to name one program. */
  function subsetNames(bytes: Uint8Array): Map<string, number> {
    const names = new Map<string, number>();
    for (const [, d] of byType(objects(bytes), 'FontDescriptor')) {
      const name = nameOf(d.get('FontName'))!;
      expect(name).toMatch(/^[A-Z]{6}\+DejaVuSans/);
      expect(name).not.toMatch(/^[BC]ZZZZZ\+/); // pdfkit's tag for every document's subset
      const program = (d.get('FontFile2') as { num: number }).num;
      expect(names.get(name) ?? program, name).toBe(program);
      names.set(name, program);
    }
    return names;
  }

  it('names each font subset by its program (§9.6.4): one name per different subset', async () => {
    // Every subset starts with the same base (fonts.ts SUBSET_BASE): the shell's and both
    // cards' regular face are one subset, the cards' bold another.
    expect(subsetNames((await merged()).bytes).size).toBe(2);
    // A title with a letter outside the base (Ł, U+0141) makes that card's bold its own.
    const bytes = mergeCardPages(await shell(2), [
      { page: 1, pdf: await card('Plain', 'https://example.com/one') },
      { page: 2, pdf: await card('Łódź blend', 'https://example.com/two') },
    ]);
    const names = subsetNames(bytes);
    expect(names.size).toBe(3);
    expect(new Set(names.values()).size).toBe(3);
  });

  it('stores the same card twice with one copy of its fonts, but two pages and two Art elements', async () => {
    const one = await card('Same', 'https://example.com/same');
    const bytes = mergeCardPages(await shell(2), [
      { page: 1, pdf: one },
      { page: 2, pdf: one },
    ]);
    const all = objects(bytes);
    // The shell's regular face is the cards' (the same base subset), then the bold.
    expect(byType(all, 'FontDescriptor')).toHaveLength(2);
    expect(byType(all, 'Page')).toHaveLength(3);
    expect(byType(all, 'Annot')).toHaveLength(2);
    expect([...all.values()].filter((d) => nameOf(d.get('S')) === 'Art')).toHaveLength(2);
    expect((await readPdf(bytes)).text.map(squash)).toEqual([
      'Frontpage',
      squash('Same https://example.com/same 2 / 3'),
      squash('Same https://example.com/same 3 / 3'),
    ]);
  });

  it('gives the same bytes for the same inputs, and another /ID for another card', async () => {
    const a = await merged();
    const b = await merged();
    expect(a.bytes.equals(b.bytes)).toBe(true);
    const other = mergeCardPages(await shell(2), [
      { page: 1, pdf: a.cards[0]! },
      { page: 2, pdf: await card('Another', 'https://example.com/two') },
    ]);
    const id = (bytes: Buffer) => /\/ID \[<([0-9a-f]{32})>/.exec(bytes.toString('latin1'))?.[1];
    expect(id(a.bytes)).toMatch(/^[0-9a-f]{32}$/);
    expect(id(other)).not.toBe(id(a.bytes));
  });

  it('refuses a card of another size than its placeholder, and a card PDF of two pages', async () => {
    const wide = await card('Wide', 'https://example.com', [419.53, 595.28]);
    await expect(async () =>
      mergeCardPages(await shell(1), [{ page: 1, pdf: wide }]),
    ).rejects.toThrow(/419.53×595.28 pt, its place in the set 297.64×419.53 pt/);
    const two = await shell(1);
    await expect(async () =>
      mergeCardPages(await shell(1), [{ page: 1, pdf: two }]),
    ).rejects.toThrow(/2 pages, not one/);
  });
});

/** A card page's segment as the cache holds it: encoded, then read back for its PDF. */
const cached = (pdf: Uint8Array) => decodeSegment(encodeSegment(pageSegment(pdf), pdf), pdf);

/** The set of `pdfs` in placeholder pages 1…n, from their PDFs alone or with segments. */
async function setOf(pdfs: readonly Uint8Array[], segments?: readonly unknown[]) {
  const grafts: CardGraft[] = pdfs.map((pdf, i) => ({
    page: i + 1,
    pdf,
    ...(segments ? { segment: segments[i] as CardGraft['segment'] } : {}),
  }));
  return mergeCardPages(await shell(pdfs.length), grafts);
}

describe('a set from its cards’ cached segments (pageSegment, encodeSegment, decodeSegment)', () => {
  // Own rule (merge.ts): a segment depends on its card PDF alone, so a set filled in from
  // cached segments is, byte for byte, the set merged from the card PDFs.
  let a: Buffer, b: Buffer, c: Buffer;
  const text = async (bytes: Uint8Array) => (await readPdf(bytes)).text.map(squash);

  it('reads back what it wrote, and gives the bytes of the set merged from the PDFs', async () => {
    a = await card(TRICKY, 'https://example.com/a');
    b = await card('Card B', 'https://example.com/b');
    c = await card('Łódź C', 'https://example.com/c');
    const fresh = await setOf([a, b, c]);
    const segments = [a, b, c].map(cached);
    expect(segments.every((s) => s !== null)).toBe(true);
    expect((await setOf([a, b, c], segments)).equals(fresh)).toBe(true);
  });

  it('puts a changed card’s new page in its place, the others from the cache', async () => {
    const b2 = await card('Card B, edited', 'https://example.com/b2');
    const cache = new Map([a, b, c].map((pdf) => [pdf, cached(pdf)]));
    const incremental = await setOf([a, b2, c], [cache.get(a), null, cache.get(c)]);
    expect(incremental.equals(await setOf([a, b2, c]))).toBe(true);
    const pages = await text(incremental);
    expect(pages[2]).toBe(squash('Card B, edited https://example.com/b2 3 / 4'));
    expect(pages.join(' ')).not.toContain(squash('Card B https://example.com/b '));
  });

  it('leaves a removed card out and follows a new order', async () => {
    const [sa, sb, sc] = [a, b, c].map(cached);
    const removed = await setOf([a, c], [sa, sc]);
    expect(removed.equals(await setOf([a, c]))).toBe(true);
    expect(await text(removed)).toEqual([
      'Frontpage',
      squash(`${TRICKY} https://example.com/a 2 / 3`),
      squash('Łódź C https://example.com/c 3 / 3'),
    ]);
    const reordered = await setOf([c, b, a], [sc, sb, sa]);
    expect(reordered.equals(await setOf([c, b, a]))).toBe(true);
    expect((await text(reordered)).slice(1)).toEqual([
      squash('Łódź C https://example.com/c 2 / 4'),
      squash('Card B https://example.com/b 3 / 4'),
      squash(`${TRICKY} https://example.com/a 4 / 4`),
    ]);
    const read = await readPdf(reordered);
    expect(read.outline.map((o) => o.page)).toEqual([0, 1, 2, 3]);
    expect(read.links).toEqual([
      [],
      ['https://example.com/c'],
      ['https://example.com/b'],
      ['https://example.com/a'],
    ]);
  });

  it('refuses a segment that is not its PDF’s: another card’s, another format, cut short', async () => {
    const text = encodeSegment(pageSegment(a), a);
    expect(decodeSegment(text, a)).not.toBeNull();
    // b's bytes have another length and trailer (its /ID): the segment is not b's.
    expect(decodeSegment(text, b)).toBeNull();
    const otherId = Buffer.from(
      a.toString('latin1').replace(/\/ID \[<[0-9a-f]/, '/ID [<x'),
      'latin1',
    );
    expect(otherId.length).toBe(a.length);
    expect(decodeSegment(text, otherId)).toBeNull();
    expect(decodeSegment(text.replace('"format":1', '"format":0'), a)).toBeNull();
    expect(decodeSegment(text.slice(0, text.length - 10), a)).toBeNull();
    // Streams moved: the same length and trailer, but the offsets no longer fall on a stream.
    const at = a.indexOf('stream\n') + 7;
    const shifted = Buffer.concat([
      a.subarray(0, at - 7),
      Buffer.from(' '),
      a.subarray(at - 7, at + 100),
      a.subarray(at + 101),
    ]);
    expect(shifted.length).toBe(a.length);
    expect(decodeSegment(text, shifted)).toBeNull();
  });
});

describeWithTools(['qpdf'], 'a set from cached segments, read by qpdf', () => {
  it('passes qpdf --check', async () => {
    const pdfs = [
      await card(TRICKY, 'https://example.com/a'),
      await card('Card B', 'https://example.com/b'),
    ];
    const bytes = await setOf(pdfs, pdfs.map(cached));
    const dir = await mkdtemp(path.join(tmpdir(), 'stovecard-segments-'));
    try {
      const file = path.join(dir, 'set.pdf');
      await writeFile(file, bytes);
      const run = runTool('qpdf', ['--check', file]);
      expect(run.status, run.stdout + run.stderr).toBe(0);
      expect(run.stdout).toContain('No syntax or stream encoding errors');
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
