/**
 * A set's PDF: its cards in order, one per page, page-numbered and bookmarked. A training
 * binder opens with front matter first: a contents page, the method pages and the
 * troubleshooting pages, whose words and numbers come from the site's own views
 * (MethodView, TroubleshootingView in ../site-view.ts, the same data the HTML pages show).
 *
 *   front matter (measured, so the contents can print page numbers) ─▶ contents pages
 *     ─▶ method pages ─▶ troubleshooting pages ─▶ exercises (the set view's, on its own
 *     cards) ─▶ log sheet, sign-off ─▶ one placeholder page per card ─▶ shell
 *   shell + each card's own PDF (card.ts cardPdf) ─ merge.ts ─▶ the set's PDF
 *
 * The cards are not drawn again: the build has made their one-page PDFs already, and a
 * card page copied at the object level costs a fraction of a millisecond against ~30 ms
 * to draw. pdfkit draws only what is the set's own: the front matter, and on each card's
 * placeholder page its page number (an artifact) and its bookmark.
 */
import type { BrandView } from '../brand.ts';
import {
  cautions as cautionsView,
  type Cautions,
  type PageSetup,
  type StationCardView,
} from '../card-view.ts';
import type { MethodView, SetView, TroubleshootingView } from '../site-view.ts';
import { voiceFor } from '../voice.ts';
import {
  cleaningItems,
  coverItems,
  exercisesItems,
  glossaryItems,
  logSheetItems,
  signOffItems,
  stepsItems,
} from './binder-pages.ts';
import { cardTitle, pageBox, type CardView } from './card.ts';
import { openPdf, pageSizePt, pdfDate } from './document.ts';
import type { Block, PageBox } from './layout.ts';
import { mergeCardPages, type PageSegment } from './merge.ts';
import { PdfFile } from './pdf-file.ts';
import { drawPageNumber, flowPages, type FlowFrame, type FlowItem } from './pages.ts';
import { Pen } from './pen.ts';
import { cardMarginPt, INK, RULE_SOFT, textPageStyle, type TextPageStyle } from './style.ts';

export interface FrontMatter {
  readonly method: MethodView;
  readonly troubleshooting: TroubleshootingView;
}

/**
 * What a set prints of a card beside its page: its titles, whether it refuses, its paper.
 * A whole CardView is one; `setCard` picks these out for a worker thread.
 */
export type SetCard = Pick<CardView, 'kind' | 'title' | 'subtitle' | 'page'> &
  Partial<Pick<StationCardView, 'refusal' | 'language'>>;

export function setCard(view: CardView): SetCard {
  const { kind, title, subtitle, page, language } = view;
  return view.kind === 'station'
    ? { kind, title, subtitle, page, language, refusal: view.refusal }
    : { kind, title, subtitle, page, language };
}

export interface SetPdfInput {
  readonly set: SetView;
  /** The set's cards, in the set's order. */
  readonly cards: readonly SetCard[];
  /** The cards' own PDFs (card.ts cardPdf's bytes), in the same order. */
  readonly cardPdfs: readonly Uint8Array[];
  /**
   * The cards' pages already in the set's object form (merge.ts pageSegment, as cached
   * beside their PDFs), in the same order; a missing one is made from its PDF. The bytes
   * are the same either way.
   */
  readonly cardSegments?: readonly (PageSegment | null)[];
  /** Present for a training binder. */
  readonly frontMatter: FrontMatter | null;
  /** Paper of the text pages (the site's). */
  readonly page: PageSetup;
  readonly author: string;
  readonly builtOn: string;
  readonly env?: NodeJS.ProcessEnv;
  /** The roaster's brand: its logo on the binder's cover. */
  readonly brand?: BrandView | null;
}

export interface SetPdf {
  readonly bytes: Buffer;
  readonly pages: number;
  /** Cover, contents and the binder's text pages (0 without front matter). */
  readonly frontMatterPages: number;
  /** The shell the cards went into (setShell), for a cache keyed by all but the cards' PDFs. */
  readonly shell: Buffer;
}

/** A set's shell: its own pages, and a placeholder page per card (to merge the cards into). */
export interface SetShell {
  readonly bytes: Buffer;
  readonly pages: number;
  readonly frontMatterPages: number;
}

/** A heading or paragraph as a flow block. */
function para(tag: 'H1' | 'H2' | 'P', text: string, font: TextPageStyle['body'], after = 0): Block {
  return (pen, x, y, w) => pen.para(tag, text, x, y, w, font) + after;
}

function methodItems(view: MethodView, st: TextPageStyle): FlowItem[] {
  const items: FlowItem[] = [{ block: para('H1', view.title, st.h1), keepWithNext: true }];
  for (const section of view.sections) {
    items.push({ block: para('H2', section.heading, st.h2), keepWithNext: true });
    for (const p of section.paragraphs) items.push({ block: para('P', p, st.body) });
  }
  if (view.example) {
    items.push({ block: para('H2', view.exampleHeading, st.h2), keepWithNext: true });
    items.push({ block: para('P', view.example, st.body) });
  }
  return items;
}

/** A table of short cells: a row-header column of text, the rest numbers (right-aligned). */
function numberTable(
  head: readonly string[],
  rows: readonly (readonly string[])[],
  st: TextPageStyle,
): Block {
  const pad = st.gap * 0.35;
  return (pen, x, y, w) => {
    const cols = head.length;
    const widthOf = (c: number, min: boolean) =>
      Math.max(
        min ? pen.minWidth(head[c]!, st.tableHead) : pen.width(head[c]!, st.tableHead),
        ...rows.map((r) => (min ? pen.minWidth(r[c]!, st.table) : pen.width(r[c]!, st.table))),
      ) +
      2 * pad;
    const lo = Array.from({ length: cols }, (_, c) => widthOf(c, true));
    const hi = Array.from({ length: cols }, (_, c) => widthOf(c, false));
    const loSum = lo.reduce((a, b) => a + b, 0);
    if (loSum > w) return Number.POSITIVE_INFINITY;
    const want = hi.map((h, c) => h - lo[c]!);
    const wantSum = want.reduce((a, b) => a + b, 0);
    const spare = w - loSum;
    const widths =
      wantSum >= spare
        ? lo.map((l, c) => l + (wantSum > 0 ? (want[c]! * spare) / wantSum : 0))
        : hi.map((h, c) => h + (c === 0 ? spare - wantSum : 0));
    const lefts = widths.map((_, c) => x + widths.slice(0, c).reduce((a, b) => a + b, 0));
    const inner = (c: number) => widths[c]! - 2 * pad;
    let h = 0;
    pen.group('Table', () => {
      const headH = Math.max(...head.map((t, c) => pen.height(t, inner(c), st.tableHead)));
      pen.group('THead', () =>
        pen.group('TR', () =>
          head.forEach((t, c) => {
            const th = pen.height(t, inner(c), st.tableHead);
            pen.leaf(
              'TH',
              () =>
                pen.write(t, lefts[c]! + pad, y + pad + headH - th, inner(c), st.tableHead, {
                  align: c === 0 ? 'left' : 'right',
                }),
              {
                scope: 'Column',
              },
            );
          }),
        ),
      );
      h = headH + 2 * pad;
      pen.rule(x, y + h, w, 1.2, INK);
      h += 1.2;
      pen.group('TBody', () =>
        rows.forEach((row, r) => {
          const rowH = Math.max(...row.map((t, c) => pen.height(t, inner(c), st.table))) + 2 * pad;
          pen.group('TR', () =>
            row.forEach((t, c) => {
              pen.leaf(
                c === 0 ? 'TH' : 'TD',
                () =>
                  pen.write(t, lefts[c]! + pad, y + h + pad, inner(c), st.table, {
                    align: c === 0 ? 'left' : 'right',
                  }),
                c === 0 ? { scope: 'Row' } : {},
              );
            }),
          );
          h += rowH;
          if (r < rows.length - 1) {
            pen.rule(x, y + h, w, 0.5, RULE_SOFT);
            h += 0.5;
          }
        }),
      );
    });
    return h;
  };
}

/** A bold label line and its paragraph, kept together ("What to change" + the advice). */
function labelled(label: string, text: string, st: TextPageStyle): Block {
  return (pen, x, y, w) => {
    const h = pen.para('P', label, x, y, w, st.bodyStrong);
    return h + pen.para('P', text, x, y + h, w, st.body);
  };
}

function troubleshootingItems(view: TroubleshootingView, st: TextPageStyle): FlowItem[] {
  const items: FlowItem[] = [
    { block: para('H1', view.title, st.h1), keepWithNext: true },
    { block: para('P', view.intro, st.lead) },
  ];
  for (const row of view.rows) {
    items.push({ block: para('H2', row.symptom, st.h2), keepWithNext: true });
    items.push({ block: labelled(view.columns.cause, row.cause, st) });
    items.push({ block: labelled(view.columns.change, row.change, st) });
  }
  const moves = view.moves;
  if (moves) {
    const c = moves.columns;
    items.push({ block: para('H2', moves.heading, st.h2), keepWithNext: true });
    items.push({ block: para('P', moves.intro, st.body), keepWithNext: true });
    items.push({
      block: numberTable(
        [c.change, c.firstCoffee, c.meanTemperature, c.inBand, c.peak],
        moves.rows.map((r) => [r.change, r.firstCoffee, r.meanTemperature, r.inBand, r.peak]),
        st,
      ),
    });
  }
  return items;
}

/**
 * The cautions at the foot of every text page (compact form), over a rule: the heading,
 * the cautions run together, and the deferral to the maker. A running foot, so a
 * pagination artifact (the cards' own cautions are the tagged ones); pdftotext and any
 * reader of the page see it on every page.
 */
function cautionsFoot(cautions: Cautions, st: TextPageStyle): Block {
  const text = cautions.items.join(' · ');
  return (pen, x, y, w) => {
    const rule = 0.8;
    let h = rule + st.gap * 0.4;
    const draw = () => {
      if (pen.drawing) pen.doc.rect(x, y, w, rule).fill(INK);
      h += pen.write(cautions.heading, x, y + h, w, st.cautionHeading);
      h += pen.write(text, x, y + h, w, st.caution);
      h += pen.write(cautions.deferral, x, y + h, w, st.cautionStrong);
    };
    if (pen.drawing) pen.artifact(draw, 'Pagination');
    else draw();
    return h;
  };
}

/** A contents line: the entry's text, dot leaders, its page number on the right. */
function contentsLine(text: string, page: number, st: TextPageStyle): Block {
  return (pen, x, y, w) => {
    const number = String(page);
    const numW = pen.width('0000', st.body);
    const textW = w - numW - st.gutter;
    const h = pen.height(text, textW, st.body);
    pen.group('TOCI', () => {
      pen.para('P', text, x, y, textW, st.body);
      const lineH = pen.lineHeight(st.body);
      pen.artifact(() => {
        const baseline = y + h - lineH + pen.ascent(st.body);
        pen.doc
          .lineWidth(0.6)
          .dash(0.6, { space: 2.4 })
          .moveTo(
            x + Math.min(textW, pen.width(lastLine(pen, text, textW, st), st.body)) + 3,
            baseline,
          )
          .lineTo(x + w - pen.width(number, st.body) - 3, baseline)
          .stroke(RULE_SOFT)
          .undash();
      });
      pen.para('Reference', number, x + w - numW, y + h - pen.lineHeight(st.body), numW, st.body, {
        noWrap: true,
        align: 'right',
      });
    });
    return h;
  };
}

/** The text of the last line `text` wraps to at `width` (for the leaders after it). */
function lastLine(pen: Pen, text: string, width: number, st: TextPageStyle): string {
  const words = text.split(' ');
  let line = '';
  for (const word of words) {
    const next = line === '' ? word : `${line} ${word}`;
    line = pen.width(next, st.body) > width ? word : next;
  }
  return line;
}

interface ContentsEntry {
  readonly text: string;
  readonly page: number;
}

function contentsItems(
  set: SetView,
  front: readonly ContentsEntry[],
  cards: readonly ContentsEntry[],
  st: TextPageStyle,
): FlowItem[] {
  const words = voiceFor(set.language).words.pdf.contents;
  const toc = (entries: readonly ContentsEntry[]): FlowItem[] => [
    { block: (pen) => (pen.open('TOC'), 0), keepWithNext: true },
    ...entries.map((e) => ({ block: contentsLine(e.text, e.page, st) })),
    { block: (pen) => (pen.close(), 0) },
  ];
  return [
    { block: para('H1', set.title, st.h1), keepWithNext: true },
    { block: para('P', words.intro(cards.length), st.lead) },
    { block: para('H2', words.frontMatter, st.h2), keepWithNext: true },
    ...toc(front),
    { block: para('H2', words.cards, st.h2), keepWithNext: true },
    ...toc(cards),
  ];
}

function contentsText(card: SetCard, language: string): string {
  const voice = voiceFor(language);
  const words = voice.words.pdf.contents;
  if (card.kind === 'insert') return card.title;
  const line = words.station(card.title, card.subtitle);
  return card.refusal ? words.refused(line, voice.words.card.index.refused) : line;
}

/**
 * A set's cards in one PDF; with front matter, the training binder. `shell`: the bytes
 * setShell drew before for the same input but the card PDFs (a cached one), else drawn.
 */
export async function setPdf(input: SetPdfInput, shell: Uint8Array | null = null): Promise<SetPdf> {
  const drawn: SetShell = shell ? shellOf(shell, input.cards.length) : await setShell(input);
  const { cardPdfs } = input;
  if (cardPdfs.length !== input.cards.length)
    throw new Error(`PDF: ${input.cards.length} cards in the set and ${cardPdfs.length} card PDFs`);
  const segments = input.cardSegments;
  if (segments && segments.length !== cardPdfs.length)
    throw new Error(`PDF: ${cardPdfs.length} card PDFs and ${segments.length} card segments`);
  const grafts = cardPdfs.map((pdf, i) => ({
    page: drawn.frontMatterPages + i,
    pdf,
    segment: segments?.[i] ?? null,
  }));
  return {
    bytes: mergeCardPages(drawn.bytes, grafts),
    pages: drawn.pages,
    frontMatterPages: drawn.frontMatterPages,
    shell: drawn.bytes,
  };
}

/** A shell drawn before, with its page counts (the cards' placeholders are the last pages). */
function shellOf(bytes: Uint8Array, cards: number): SetShell {
  const pages = new PdfFile(bytes).pages().length;
  if (pages < cards) throw new Error(`PDF: a set shell of ${pages} pages for ${cards} cards`);
  return { bytes: Buffer.from(bytes), pages, frontMatterPages: pages - cards };
}

/** The set's own pages drawn by pdfkit, and a placeholder page per card. */
export async function setShell(
  input: Omit<SetPdfInput, 'cardPdfs' | 'cardSegments'>,
): Promise<SetShell> {
  const [widthPt, heightPt] = pageSizePt(input.page.widthMm, input.page.heightMm);
  const textPage: PageBox = { widthPt, heightPt };
  const st = textPageStyle(input.page.paper);
  const voice = voiceFor(input.set.language, input.page.units);
  const pdfWords = voice.words.pdf;
  const foot = cautionsFoot(cautionsView('compact', voice), st);
  const open = openPdf({
    title: pdfWords.setTitle(input.set.title),
    author: input.author,
    lang: input.set.lang,
    date: pdfDate(input.builtOn, input.env),
    // The shell's /ID is not kept: mergeCardPages hashes the set's from all its objects.
    idSeed: JSON.stringify({ set: input.set.id }),
  });
  const { doc } = open;
  const measure = new Pen(doc, false);
  const footH = foot(measure, st.marginPt, 0, widthPt - 2 * st.marginPt);
  const frame: FlowFrame = {
    page: textPage,
    marginPt: st.marginPt,
    gap: st.gap,
    footPt: footH + st.gap,
  };

  // Front matter is measured first: the contents needs every part's first page.
  let parts: { title: string; items: FlowItem[]; pages: number }[] = [];
  let contents: FlowItem[] = [];
  let contentsPages = 0;
  let cover: FlowItem[] = [];
  let coverPages = 0;
  if (input.frontMatter) {
    const { method, troubleshooting } = input.frontMatter;
    const words = voice.words.binder;
    cover = coverItems(
      input.set,
      input.author,
      voice.date(input.builtOn),
      st,
      words,
      input.brand?.logo ?? null,
    );
    coverPages = flowPages(measure, frame, cover, () => {});
    parts = [
      { title: method.title, items: methodItems(method, st), pages: 0 },
      { title: words.steps.title, items: stepsItems(st, words), pages: 0 },
      { title: words.cleaning.title, items: cleaningItems(st, words), pages: 0 },
      { title: words.glossary.title, items: glossaryItems(st, words), pages: 0 },
      { title: troubleshooting.title, items: troubleshootingItems(troubleshooting, st), pages: 0 },
      ...(input.set.exercises
        ? [
            {
              title: input.set.exercises.title,
              items: exercisesItems(input.set.exercises, st, pdfWords),
              pages: 0,
            },
          ]
        : []),
      {
        title: words.logSheet.title,
        items: logSheetItems(st, input.page.units, words),
        pages: 0,
      },
      { title: words.signOff.title, items: signOffItems(st, words), pages: 0 },
    ];
    for (const part of parts) part.pages = flowPages(measure, frame, part.items, () => {});
    // Page numbers only widen to another digit rarely; measure with the final ones.
    const contentsFor = (first: number) => {
      let page = first;
      const front = parts.map((part) => {
        const entry = { text: part.title, page };
        page += part.pages;
        return entry;
      });
      const cards = input.cards.map((card, i) => ({
        text: contentsText(card, input.set.language),
        page: page + i,
      }));
      return contentsItems(input.set, front, cards, st);
    };
    contentsPages = flowPages(measure, frame, contentsFor(coverPages + 2), () => {});
    contents = contentsFor(coverPages + contentsPages + 1);
    const again = flowPages(measure, frame, contents, () => {});
    if (again !== contentsPages) {
      contentsPages = again;
      contents = contentsFor(coverPages + contentsPages + 1);
    }
  }
  const frontMatterPages =
    coverPages + contentsPages + parts.reduce((sum, part) => sum + part.pages, 0);
  const total = frontMatterPages + input.cards.length;

  let pageNo = 0;
  const pen = new Pen(doc, true, open.root);
  const newTextPage = () => {
    doc.addPage({ size: [widthPt, heightPt], margin: 0 });
    pageNo += 1;
    drawPageNumber(pen, textPage, st.marginPt, pdfWords.pageNumber(pageNo, total), st.pageNumber);
    foot(pen, st.marginPt, heightPt - st.marginPt - footH, widthPt - 2 * st.marginPt);
  };
  if (input.frontMatter) {
    pen.group('Sect', () => flowPages(pen, frame, cover, newTextPage), {
      title: input.set.title,
    });
    doc.outline.addItem(input.set.title, { pageNumber: 0 } as never);
    const contentsFirst = pageNo;
    pen.group('Sect', () => flowPages(pen, frame, contents, newTextPage), {
      title: pdfWords.contents.heading,
    });
    doc.outline.addItem(pdfWords.contents.heading, { pageNumber: contentsFirst } as never);
    for (const part of parts) {
      const first = pageNo;
      pen.group('Sect', () => flowPages(pen, frame, part.items, newTextPage), {
        title: part.title,
      });
      doc.outline.addItem(part.title, { pageNumber: first } as never);
    }
  }
  for (const card of input.cards) {
    const page = pageBox(card);
    doc.addPage({ size: [page.widthPt, page.heightPt], margin: 0 });
    pageNo += 1;
    const number = pdfWords.pageNumber(pageNo, total);
    drawPageNumber(pen, page, cardMarginPt(card.page.paper), number, st.pageNumber);
    doc.outline.addItem(cardTitle(card));
  }
  return { bytes: await open.finish(), pages: pageNo, frontMatterPages };
}
