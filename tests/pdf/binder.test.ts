/**
 * setPdf(set): a set's cards in one PDF, and the training binder with its contents,
 * method and troubleshooting pages in front. How its card pages compare with the cards'
 * own PDFs is set-pages.test.ts.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SetPdf } from '../../generator/render/pdf/binder.ts';
import { cardPdf } from '../../generator/render/pdf/card.ts';
import { isTrainingSet, setCards } from '../../generator/render/pdf/site-pdfs.ts';
import type { SetView } from '../../generator/render/site-view.ts';
import { pdfWords } from '../../generator/words/pdf.ts';
import { NO_EPOCH, demoSetPdf, demoSite, type DemoSite } from './demo-site.ts';
import { readPdf, squash, structNodes, type ReadPdf } from './read-pdf.ts';

let demo: DemoSite;
const built = new Map<string, { set: SetView; pdf: SetPdf; read: ReadPdf }>();

beforeAll(async () => {
  demo = await demoSite();
  const author = demo.data.site.businessName;
  for (const set of demo.data.sets) {
    const cards = setCards(set, demo.data);
    const cardPdfs = [];
    for (const card of cards) cardPdfs.push((await cardPdf(card, { author, env: NO_EPOCH })).bytes);
    const pdf = await demoSetPdf(demo, set, cardPdfs, author);
    built.set(set.id, { set, pdf, read: await readPdf(pdf.bytes) });
  }
});

afterAll(() => demo?.dispose());

const training = () => built.get('barista-training')!;

describe('isTrainingSet(set)', () => {
  it('is true for the demo’s barista-training set only', () => {
    expect(demo.data.sets.filter(isTrainingSet).map((s) => s.id)).toEqual(['barista-training']);
  });
});

describe('setPdf(training set)', () => {
  it('has as many pages as its cards plus the front matter, contents, method and troubleshooting', () => {
    const { set, pdf, read } = training();
    expect(pdf.frontMatterPages).toBeGreaterThanOrEqual(3);
    expect(read.pages).toBe(set.cards.length + pdf.frontMatterPages);
    expect(pdf.pages).toBe(read.pages);
  });

  it('opens with the contents, then the method and troubleshooting text of the site’s views', () => {
    const { pdf, read } = training();
    const front = squash(read.text.slice(0, pdf.frontMatterPages).join(' '));
    const method = demo.data.method;
    const trouble = demo.data.troubleshooting;
    expect(squash(read.text[0]!)).toContain(squash(pdfWords.contents.frontMatter));
    for (const section of method.sections) {
      expect(front).toContain(squash(section.heading));
      for (const p of section.paragraphs) expect(front).toContain(squash(p));
    }
    if (method.example) expect(front).toContain(squash(method.example));
    for (const row of trouble.rows) {
      for (const text of [row.symptom, row.cause, row.change])
        expect(front).toContain(squash(text));
    }
    for (const row of trouble.moves?.rows ?? []) expect(front).toContain(squash(row.change));
  });

  it('lists each card in the contents with the page it is printed on', () => {
    const { set, pdf, read } = training();
    const contents = read.text[0]!;
    setCards(set, demo.data).forEach((card, i) => {
      const page = pdf.frontMatterPages + i + 1;
      expect(squash(read.text[page - 1]!)).toContain(squash(card.title));
      expect(squash(contents)).toContain(squash(`${card.subtitle}${page}`));
    });
  });

  it('tags the contents as a TOC of TOCI entries', () => {
    const roles = structNodes(training().read.structure[0]!).map((n) => n.role);
    expect(roles).toContain('TOC');
    expect(roles.filter((r) => r === 'TOCI')).toHaveLength(2 + training().set.cards.length);
  });

  it('numbers its pages "n / total"', () => {
    const { read } = training();
    read.text.forEach((text, i) =>
      expect(squash(text)).toContain(squash(pdfWords.pageNumber(i + 1, read.pages))),
    );
  });
});

describe('setPdf(set without training)', () => {
  it('is the set’s cards only, one page each, in the set’s order', () => {
    for (const { set, pdf, read } of built.values()) {
      if (isTrainingSet(set)) continue;
      expect(pdf.frontMatterPages).toBe(0);
      expect(read.pages).toBe(set.cards.length);
      setCards(set, demo.data).forEach((card, i) =>
        expect(squash(read.text[i]!)).toContain(squash(card.title)),
      );
    }
  });
});
