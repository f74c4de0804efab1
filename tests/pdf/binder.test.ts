/**
 * setPdf(set): a set's cards in one PDF, and the training binder (`layout: binder`) with
 * its cover, contents, method, steps and reasons, cleaning, glossary, troubleshooting,
 * exercises, brew-log sheet and sign-off pages in front (the exercises' own checks:
 * tests/pipeline/exercises.test.ts). How its card pages compare with the cards'
 * own PDFs is set-pages.test.ts.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SetPdf } from '../../generator/render/pdf/binder.ts';
import { cardPdf } from '../../generator/render/pdf/card.ts';
import { isBinderSet, setCards } from '../../generator/render/pdf/site-pdfs.ts';
import type { SetView } from '../../generator/render/site-view.ts';
import { pdfWords } from '../../generator/words/pdf.ts';
import { binderWords } from '../../generator/words/binder.ts';
import { LANGUAGES, wordsFor } from '../../generator/words/catalogue.ts';
import { logFieldLabel, logSheetFields } from '../../generator/render/pdf/binder-pages.ts';
import { readFile } from 'node:fs/promises';
import { parse } from 'yaml';
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

describe('isBinderSet(set)', () => {
  it('is true for the demo’s layout: binder set only', () => {
    expect(demo.data.sets.filter(isBinderSet).map((s) => s.id)).toEqual(['barista-training']);
  });
});

describe('setPdf(training set)', () => {
  it('has as many pages as its cards plus the front matter, contents, method and troubleshooting', () => {
    const { set, pdf, read } = training();
    expect(pdf.frontMatterPages).toBeGreaterThanOrEqual(3);
    expect(read.pages).toBe(set.cards.length + pdf.frontMatterPages);
    expect(pdf.pages).toBe(read.pages);
  });

  it('opens with the cover, the contents, then the method and troubleshooting text of the site’s views', () => {
    const { set, pdf, read } = training();
    const front = squash(read.text.slice(0, pdf.frontMatterPages).join(' '));
    const method = demo.data.method;
    const trouble = demo.data.troubleshooting;
    expect(squash(read.text[0]!)).toContain(squash(binderWords.cover.kind));
    expect(squash(read.text[0]!)).toContain(squash(set.title));
    expect(squash(read.text[1]!)).toContain(squash(pdfWords.contents.frontMatter));
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
    const contents = read.text[1]!;
    setCards(set, demo.data).forEach((card, i) => {
      const page = pdf.frontMatterPages + i + 1;
      expect(squash(read.text[page - 1]!)).toContain(squash(card.title));
      expect(squash(contents)).toContain(squash(`${card.subtitle}${page}`));
    });
  });

  it('tags the contents as a TOC of TOCI entries', () => {
    // Page 2: the contents (page 1 is the cover).
    const roles = structNodes(training().read.structure[1]!).map((n) => n.role);
    expect(roles).toContain('TOC');
    // One entry per part after the contents (method … exercises … sign-off), one per card.
    expect(roles.filter((r) => r === 'TOCI')).toHaveLength(8 + training().set.cards.length);
  });

  it('has every part of a binder, in order: cover, contents, method, steps and why, cleaning, glossary, troubleshooting, exercises, log sheet, sign-off, cards', () => {
    const { pdf, read } = training();
    const front = read.text.slice(0, pdf.frontMatterPages).map(squash);
    const firstPageOf = (text: string) => front.findIndex((page) => page.includes(squash(text)));
    const order = [
      binderWords.cover.kind,
      pdfWords.contents.frontMatter,
      demo.data.method.sections[0]!.paragraphs[0]!,
      binderWords.steps.items[0]!.why,
      binderWords.cleaning.items.find((i) => i.part === 'Gasket')!.care,
      binderWords.glossary.items[0]!.meaning,
      demo.data.troubleshooting.rows[0]!.cause,
      binderWords.exercises.intro,
      binderWords.logSheet.intro,
      binderWords.signOff.checks[0]!,
    ].map(firstPageOf);
    expect(order.every((page) => page >= 0)).toBe(true);
    expect([...order].sort((a, b) => a - b)).toEqual(order);
    // Every step has its reason; the upkeep covers gasket, filter plate and valve and defers
    // to the maker (the cautions' own deferral rule).
    const all = front.join(' ');
    for (const item of binderWords.steps.items) expect(all).toContain(squash(item.why));
    for (const part of ['Gasket', 'Filter plate', 'Safety valve'])
      expect(all).toContain(squash(part));
    expect(all).toContain(squash('Follow the maker’s instructions for your pot'));
  });

  it('prints a log sheet whose fields are exactly the keys of a log file (log.schema.json)', async () => {
    // The schema is the outside value here: the keys `stovecard fit` reads from logs/*.yaml.
    const schema = JSON.parse(
      await readFile('generator/content/schemas/log.schema.json', 'utf8'),
    ) as { properties: Record<string, { items?: { properties: Record<string, unknown> } }> };
    const keys = [
      ...Object.keys(schema.properties).filter((k) => k !== 'brews'),
      ...Object.keys(schema.properties.brews!.items!.properties),
    ];
    const fields = logSheetFields();
    expect([...fields.header, ...fields.brew, ...fields.readings].sort()).toEqual([...keys].sort());
    // Every label the words have is a field of the schema (none left from an older log).
    for (const language of LANGUAGES) {
      const words = wordsFor(language).binder.logSheet;
      expect(Object.keys(words.logFields).sort(), language).toEqual([...keys].sort());
      expect(Object.keys(words.logFieldsUs).sort(), language).toEqual([...keys].sort());
    }
    // The demo's own log uses only fields the sheet has.
    const demoLog = parse(await readFile('content/logs/first-morning.yaml', 'utf8')) as {
      brews: Record<string, unknown>[];
    } & Record<string, unknown>;
    const used = new Set([
      ...Object.keys(demoLog).filter((k) => k !== 'brews'),
      ...demoLog.brews.flatMap((b) => Object.keys(b)),
    ]);
    for (const key of used) expect(keys).toContain(key);
    const { pdf, read } = training();
    const sheet = squash(read.text.slice(0, pdf.frontMatterPages).join(' '));
    for (const key of keys)
      expect(sheet).toContain(squash(logFieldLabel(key, 'metric', binderWords)));
    // No key itself: the sheet is for people, not for the file (no-yaml-keys.test.ts).
    for (const key of keys.filter((k) => k.includes('_'))) expect(sheet).not.toContain(key);
  });

  it('a log field the words have no label for fails, never prints a blank column', () => {
    const schema = {
      properties: {
        pot: {},
        brews: { items: { properties: { level: {}, new_reading_s: { type: 'number' } } } },
      },
    };
    const fields = logSheetFields(schema);
    expect(fields.brew).toEqual(['level', 'new_reading_s']);
    expect(() => fields.brew.map((key) => logFieldLabel(key, 'metric', binderWords))).toThrow(
      /new_reading_s/,
    );
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
      if (isBinderSet(set)) continue;
      expect(pdf.frontMatterPages).toBe(0);
      expect(read.pages).toBe(set.cards.length);
      setCards(set, demo.data).forEach((card, i) =>
        expect(squash(read.text[i]!)).toContain(squash(card.title)),
      );
    }
  });
});
