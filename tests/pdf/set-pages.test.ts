/**
 * setPdf assembles a set from its cards' own PDFs (merge.ts): every demo set, the training
 * binder included, checked against those PDFs with readers that are not ours: poppler
 * (pdfinfo, pdftotext, pdftoppm), qpdf and pdfjs; the Debian tools' checks skip with a notice
 * where a tool is missing (not under CI=true: poppler.ts). A card page of a set must be the
 * card's own page plus its page number.
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SetPdf } from '../../generator/render/pdf/binder.ts';
import { cardPdf, cardTitle, type CardView } from '../../generator/render/pdf/card.ts';
import { pageSizePt } from '../../generator/render/pdf/document.ts';
import { setCards } from '../../generator/render/pdf/site-pdfs.ts';
import { cardMarginPt } from '../../generator/render/pdf/style.ts';
import type { SetView } from '../../generator/render/site-view.ts';
import { pdfWords } from '../../generator/words/pdf.ts';
import { NO_EPOCH, demoSetPdf, demoSite, type DemoSite } from './demo-site.ts';
import {
  describeWithTools,
  pageLines,
  pdfinfoSizes,
  renderGray,
  runTool,
  type GrayImage,
} from './poppler.ts';
import { readPdf, squash, type ReadPdf, type StructNode } from './read-pdf.ts';

interface BuiltSet {
  readonly set: SetView;
  readonly cards: readonly CardView[];
  readonly pdf: SetPdf;
  readonly file: string;
  readonly read: ReadPdf;
}

let demo: DemoSite;
let dir: string;
const cardFiles = new Map<string, { file: string; read: ReadPdf }>();
const sets: BuiltSet[] = [];

beforeAll(async () => {
  demo = await demoSite();
  dir = await mkdtemp(path.join(tmpdir(), 'stovecard-set-pages-'));
  const author = demo.data.site.businessName;
  const pdfs = new Map<string, Buffer>();
  for (const card of [...demo.data.stationCards, ...demo.data.insertCards]) {
    const bytes = (await cardPdf(card, { author, env: NO_EPOCH })).bytes;
    const file = path.join(dir, card.paths.pdfFile.replace(/\//g, '_'));
    await writeFile(file, bytes);
    pdfs.set(card.paths.pdfFile, bytes);
    cardFiles.set(card.paths.pdfFile, { file, read: await readPdf(bytes) });
  }
  for (const set of demo.data.sets) {
    const cards = setCards(set, demo.data);
    const pdf = await demoSetPdf(
      demo,
      set,
      cards.map((card) => pdfs.get(card.paths.pdfFile)!),
      author,
    );
    const file = path.join(dir, `set-${set.id}.pdf`);
    await writeFile(file, pdf.bytes);
    sets.push({ set, cards, pdf, file, read: await readPdf(pdf.bytes) });
  }
});

afterAll(async () => {
  await demo?.dispose();
  if (dir) await rm(dir, { recursive: true, force: true });
});

/** Each card page of each set: the set, the card, its page (1-based) and the card's own file. */
function cardPages() {
  return sets.flatMap((s) =>
    s.cards.map((card, i) => ({
      ...s,
      card,
      page: s.pdf.frontMatterPages + i + 1,
      own: cardFiles.get(card.paths.pdfFile)!,
    })),
  );
}

describeWithTools(
  ['pdfinfo', 'pdftotext', 'pdftoppm'],
  'setPdf(set, cardPdfs) read by poppler',
  () => {
    it('pdfinfo reads every set without a complaint: pages, page sizes, Tagged: yes', () => {
      expect(sets.map((s) => s.set.id)).toContain('barista-training');
      for (const { set, cards, pdf, file } of sets) {
        const info = runTool('pdfinfo', [file]);
        expect(info.stderr, `${set.id}: pdfinfo stderr`).toBe('');
        expect(info.stdout).toMatch(/^Tagged:\s+yes$/m);
        expect(info.stdout).toMatch(new RegExp(`^Pages:\\s+${pdf.pages}$`, 'm'));
        const text = pageSizePt(demo.data.site.page.widthMm, demo.data.site.page.heightMm);
        const expected = [
          ...Array.from({ length: pdf.frontMatterPages }, () => text),
          ...cards.map((c) => pageSizePt(c.page.widthMm, c.page.heightMm)),
        ];
        expect(pdfinfoSizes(file, pdf.pages), set.id).toEqual(expected);
      }
    });

    it('pdftotext shows on each card page the card’s own text and its page number, nothing else', () => {
      for (const { set, pdf, file, page, own, card } of cardPages()) {
        // White space aside: the page number's narrow spaces come out of pdftotext as none.
        const lines = pageLines(file, page).map(squash);
        const expected = [...pageLines(own.file, 1), pdfWords.pageNumber(page, pdf.pages)].map(
          squash,
        );
        expect(lines.sort(), `${set.id} page ${page} (${card.id})`).toEqual(expected.sort());
      }
    });

    it('pdftoppm draws each card page as the card’s own page but for the page number (regression check)', () => {
      // The same content stream and font bytes are drawn, so outside the bottom margin,
      // where the page number sits, the pixels must be the same; inside it, some must not.
      const dpi = 40;
      for (const { set, file, page, own, card } of cardPages()) {
        const a = renderGray(file, page, dpi, path.join(dir, 'set-page'));
        const b = renderGray(own.file, 1, dpi, path.join(dir, 'card-page'));
        expect([a.width, a.height]).toEqual([b.width, b.height]);
        const margin = Math.ceil((cardMarginPt(card.page.paper) / 72) * dpi);
        const { above, below } = differing(a, b, a.height - margin);
        const what = `${set.id} page ${page} (${card.id})`;
        expect(above, `${what}: pixels differing above the bottom margin`).toBe(0);
        expect(below, `${what}: the page number in the bottom margin`).toBeGreaterThan(0);
      }
    });
  },
);

describeWithTools(['qpdf'], 'setPdf(set, cardPdfs) read by qpdf', () => {
  it('qpdf --check finds no problem', () => {
    for (const { set, file } of sets) {
      const check = runTool('qpdf', ['--check', file]);
      expect(check.status, `${set.id}: ${check.stdout}${check.stderr}`).toBe(0);
    }
  });
});

/** Pixels differing by more than a quarter of the gray range, above and below row `split`. */
function differing(a: GrayImage, b: GrayImage, split: number): { above: number; below: number } {
  let above = 0;
  let below = 0;
  for (let i = 0; i < a.pixels.length; i++) {
    if (Math.abs(a.pixels[i]! - b.pixels[i]!) > 64) {
      if (Math.floor(i / a.width) < split) above += 1;
      else below += 1;
    }
  }
  return { above, below };
}

/** A structure tree with pdfjs's content ids reduced to the marked-content id. */
function shape(node: StructNode | { readonly type: string; readonly id?: string } | null): unknown {
  if (!node) return null;
  if ('type' in node) return { type: node.type, id: node.id?.replace(/^p\d+R_/, '') };
  return { role: node.role, alt: node.alt, children: node.children?.map(shape) };
}

describe('setPdf(set, cardPdfs) read by pdfjs', () => {
  it('gives each card page the card’s own structure tree (Document › Art › …)', () => {
    for (const { set, read, page, own, card } of cardPages()) {
      const tree = read.structure[page - 1]!;
      expect(shape(tree), `${set.id} page ${page} (${card.id})`).toEqual(
        shape(own.read.structure[0]!),
      );
    }
  });

  it('bookmarks every card by its title, opening the card’s page', () => {
    for (const { set, read, page, card } of cardPages()) {
      expect(read.outline, set.id).toContainEqual({ title: cardTitle(card), page: page - 1 });
    }
  });

  it('stays a tagged PDF declaring PDF/A-2b, in the set’s language, with its output intent', () => {
    for (const { set, read, pdf } of sets) {
      expect(read.marked, set.id).toBe(true);
      expect(read.xmp).toContain('<pdfaid:part>2</pdfaid:part>');
      expect(read.info.Title).toBe(pdfWords.setTitle(set.title));
      const text = pdf.bytes.toString('latin1');
      expect(text).toContain('/OutputIntents');
      // The set's own language: the demo has English and Spanish sets (BCP 47 tags).
      expect(set.lang, set.id).toBe(set.language === 'es' ? 'es-ES' : 'en-GB');
      expect(text).toContain(`/Lang (${set.lang})`);
    }
  });
});
