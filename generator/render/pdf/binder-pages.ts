/**
 * The training binder's own pages (a set with `layout: binder`), as flow items for
 * binder.ts: the cover, each step with its reason, cleaning and upkeep, the glossary, the
 * blank brew-log sheet and the sign-off page. Words from the set's catalogue (`binder`,
 * generator/words/binder.ts in English), handed in by binder.ts from the set's voice.
 *
 * The log sheet's fields are read from the log files' own schema
 * (generator/content/schemas/log.schema.json): the top-level keys but `brews` head the
 * sheet, each brew's single values are the columns of the brews table, and each brew's
 * readings (arrays of [time, value] pairs) get a table of pairs. A key the words have no
 * label for is an error, so a field added to the log files reaches the sheet or the build
 * says so.
 */
import { LOGO_MAX_HEIGHT_MM, logoBox, type LogoView } from '../brand.ts';
import logSchema from '../../content/schemas/log.schema.json' with { type: 'json' };
import type { UnitSystem } from '../../content/types.ts';
import type { ExercisesView } from '../exercises.ts';
import type { Messages } from '../../words/catalogue.ts';
import type { Block } from './layout.ts';
import type { FlowItem } from './pages.ts';
import type { Pen } from './pen.ts';
import { INK, RULE_SOFT, VALVE, type TextPageStyle } from './style.ts';

type BinderWords = Messages['binder'];

interface SchemaNode {
  readonly type?: string | readonly string[];
  readonly properties?: Record<string, SchemaNode>;
  readonly items?: SchemaNode;
}

/** The fields of a brew log, in the schema's order. */
export interface LogSheetFields {
  /** Once per sheet (pot, coffee, stove, altitude). */
  readonly header: readonly string[];
  /** One value per brew (level, fill, times, yield). */
  readonly brew: readonly string[];
  /** Readings per brew, [time, value] pairs (scale, probe). */
  readonly readings: readonly string[];
}

export function logSheetFields(
  schema: SchemaNode = logSchema as unknown as SchemaNode,
): LogSheetFields {
  const top = schema.properties ?? {};
  const brewProps = top.brews?.items?.properties ?? {};
  return {
    header: Object.keys(top).filter((key) => key !== 'brews'),
    brew: Object.keys(brewProps).filter((key) => brewProps[key]!.type !== 'array'),
    readings: Object.keys(brewProps).filter((key) => brewProps[key]!.type === 'array'),
  };
}

/** The sheet's label of a log key; a key without one is a bug the build must not hide. */
export function logFieldLabel(key: string, units: UnitSystem, binder: BinderWords): string {
  const words = binder.logSheet;
  const label = (units === 'us' ? words.logFieldsUs : words.logFields)[key];
  if (label === undefined)
    throw new Error(
      `binder: the brew-log sheet has no label for the log key "${key}" (words/binder.ts)`,
    );
  return label;
}

function para(tag: 'H1' | 'H2' | 'P', text: string, font: TextPageStyle['body']): Block {
  return (pen, x, y, w) => pen.para(tag, text, x, y, w, font);
}

const title = (text: string, st: TextPageStyle): FlowItem => ({
  block: para('H1', text, st.h1),
  keepWithNext: true,
});

/** A bold term and its text, one paragraph each, kept together. */
function termBlock(term: string, text: string, st: TextPageStyle): Block {
  return (pen, x, y, w) => {
    const h = pen.para('P', term, x, y, w, st.bodyStrong);
    return h + pen.para('P', text, x, y + h, w, st.body);
  };
}

export function coverItems(
  set: { readonly title: string },
  business: string,
  /** The build date, in the language's form (Voice.date). */
  builtOn: string,
  st: TextPageStyle,
  binder: BinderWords,
  /** The roaster's logo, over the title at up to twice a card's height (brand.ts). */
  logo: LogoView | null = null,
): FlowItem[] {
  const words = binder.cover;
  const big = { ...st.h1, size: st.h1.size * 1.5 };
  const logoItem: FlowItem[] = logo
    ? [
        {
          block: (pen, x, y, w) => {
            const box = logoBox(logo, w * 0.5, 2 * LOGO_MAX_HEIGHT_MM * (72 / 25.4));
            pen.logo(logo, x, y, box.width, box.height);
            return box.height + st.gap * 2;
          },
          keepWithNext: true,
        },
      ]
    : [];
  return [
    { block: (_pen, _x, _y, _w) => st.gap * 6 },
    ...logoItem,
    { block: para('P', words.kind, st.lead), keepWithNext: true },
    { block: (pen, x, y, w) => pen.para('H1', set.title, x, y, w, big), keepWithNext: true },
    { block: para('P', words.from(business), st.bodyStrong) },
    { block: para('P', words.intro, st.body) },
    { block: para('P', words.built(builtOn), st.body) },
  ];
}

export function stepsItems(st: TextPageStyle, binder: BinderWords): FlowItem[] {
  const words = binder.steps;
  return [
    title(words.title, st),
    { block: para('P', words.intro, st.lead) },
    ...words.items.map((item, i) => ({
      block: termBlock(`${i + 1}. ${item.step}`, item.why, st),
    })),
  ];
}

export function cleaningItems(st: TextPageStyle, binder: BinderWords): FlowItem[] {
  const words = binder.cleaning;
  return [
    title(words.title, st),
    { block: para('P', words.intro, st.lead) },
    ...words.items.map((item) => ({ block: termBlock(item.part, item.care, st) })),
  ];
}

export function glossaryItems(st: TextPageStyle, binder: BinderWords): FlowItem[] {
  const words = binder.glossary;
  return [
    title(words.title, st),
    ...words.items.map((item) => ({ block: termBlock(item.term, item.meaning, st) })),
  ];
}

/**
 * A table with a header row and `rows` empty rows to write in by hand: the header is a
 * tagged table head; the ruled cells are drawn as artifacts. Columns share the width,
 * each at least as wide as its longest header word; Infinity when they cannot.
 */
function blankTable(head: readonly string[], rows: number, st: TextPageStyle): Block {
  const pad = st.gap * 0.35;
  return (pen: Pen, x, y, w) => {
    const lo = head.map((t) => pen.minWidth(t, st.tableHead) + 2 * pad);
    const loSum = lo.reduce((a, b) => a + b, 0);
    if (loSum > w + 1e-6) return Number.POSITIVE_INFINITY;
    const spare = (w - loSum) / head.length;
    const widths = lo.map((l) => l + spare);
    const lefts = widths.map((_, c) => x + widths.slice(0, c).reduce((a, b) => a + b, 0));
    const inner = (c: number) => widths[c]! - 2 * pad;
    const headH = Math.max(...head.map((t, c) => pen.height(t, inner(c), st.tableHead))) + 2 * pad;
    const rowH = pen.lineHeight(st.body) * 1.9;
    const total = headH + rows * rowH;
    pen.group('Table', () =>
      pen.group('THead', () =>
        pen.group('TR', () =>
          head.forEach((t, c) =>
            pen.leaf('TH', () => pen.write(t, lefts[c]! + pad, y + pad, inner(c), st.tableHead), {
              scope: 'Column',
            }),
          ),
        ),
      ),
    );
    pen.artifact(() => {
      const doc = pen.doc;
      doc.lineWidth(0.5).strokeColor(RULE_SOFT);
      for (let r = 1; r <= rows; r++)
        doc.moveTo(x, y + headH + r * rowH).lineTo(x + w, y + headH + r * rowH);
      for (let c = 1; c < head.length; c++) doc.moveTo(lefts[c]!, y).lineTo(lefts[c]!, y + total);
      doc.stroke();
      doc.rect(x, y + headH - 0.6, w, 1.2).fill(INK);
      doc.lineWidth(0.8).strokeColor(INK).rect(x, y, w, total).stroke();
    });
    return total;
  };
}

/**
 * A blank table, split into two or three tables under one another (each led by the first
 * column) when its columns do not fit the width with their heads at the floor size.
 */
function blankTables(head: readonly string[], rows: number, st: TextPageStyle): Block {
  const [first, ...rest] = head;
  return (pen, x, y, w) => {
    const measure = pen.measuring();
    for (let parts = 1; parts <= 3; parts++) {
      const size = Math.ceil(rest.length / parts);
      const tables = Array.from({ length: parts }, (_, i) =>
        blankTable([first!, ...rest.slice(i * size, (i + 1) * size)], rows, st),
      );
      if (tables.some((t) => !Number.isFinite(t(measure, x, y, w)))) continue;
      let h = 0;
      tables.forEach((table, i) => {
        if (i > 0) h += st.gap;
        h += table(pen, x, y + h, w);
      });
      return h;
    }
    return Number.POSITIVE_INFINITY;
  };
}

/** Labels with a line to write on, two to a row. */
function fillLines(labels: readonly string[], st: TextPageStyle): Block {
  return (pen, x, y, w) => {
    const half = (w - st.gutter) / 2;
    const lineH = pen.lineHeight(st.bodyStrong) * 1.8;
    const rows = Math.ceil(labels.length / 2);
    labels.forEach((label, i) => {
      const left = x + (i % 2) * (half + st.gutter);
      const top = y + Math.floor(i / 2) * lineH;
      const baseline = top + lineH - pen.lineHeight(st.bodyStrong) * 0.25;
      pen.para('P', label, left, baseline - pen.lineHeight(st.bodyStrong), half, st.bodyStrong, {
        noWrap: true,
      });
      const start = left + pen.width(label, st.bodyStrong) + st.gap;
      pen.artifact(() => {
        pen.doc
          .lineWidth(0.6)
          .strokeColor(INK)
          .moveTo(start, baseline)
          .lineTo(left + half, baseline)
          .stroke();
      });
    });
    return rows * lineH;
  };
}

export function logSheetItems(
  st: TextPageStyle,
  units: UnitSystem,
  binder: BinderWords,
  fields = logSheetFields(),
): FlowItem[] {
  const words = binder.logSheet;
  const labelOf = (key: string) => logFieldLabel(key, units, binder);
  const items: FlowItem[] = [
    title(words.title, st),
    { block: para('P', words.intro, st.body) },
    { block: fillLines([...fields.header.map(labelOf), words.filledBy, words.date], st) },
    {
      block: blankTables([words.brewColumn, ...fields.brew.map(labelOf)], words.brewRows, st),
    },
  ];
  for (const key of fields.readings) {
    const label = labelOf(key);
    const pair = [words.time, words.readingUnit(label)];
    const head = [
      words.brewColumn,
      ...Array.from({ length: words.readingPairs }, () => pair).flat(),
    ];
    items.push({ block: para('P', words.readingsIntro(label), st.bodyStrong), keepWithNext: true });
    items.push({ block: blankTables(head, words.brewRows, st) });
  }
  if (units === 'us') items.push({ block: para('P', words.usNote, st.body) });
  return items;
}

/** A tick box (artifact) before each check, then the name, date and signature lines. */
export function signOffItems(st: TextPageStyle, binder: BinderWords): FlowItem[] {
  const words = binder.signOff;
  const check =
    (text: string): Block =>
    (pen, x, y, w) => {
      const box = pen.lineHeight(st.body) * 0.8;
      const indent = box + st.gap;
      const h = pen.height(text, w - indent, st.body);
      pen.artifact(() => {
        pen.doc
          .lineWidth(0.8)
          .strokeColor(INK)
          .rect(x, y + (pen.lineHeight(st.body) - box) / 2, box, box)
          .stroke();
      });
      pen.para('P', text, x + indent, y, w - indent, st.body);
      return h;
    };
  return [
    title(words.title, st),
    { block: para('P', words.intro, st.lead) },
    ...words.checks.map((text) => ({ block: check(text) })),
    { block: (_pen) => st.gap },
    {
      block: fillLines(
        [words.trainee, words.trainer, words.date, words.date, words.signature, words.signature],
        st,
      ),
    },
  ];
}

/** A bold label over a list (numbered or bulleted): L › LI › Lbl + LBody, kept whole. */
function labelledList(
  label: string,
  items: readonly string[],
  marks: (i: number) => string,
  st: TextPageStyle,
): Block {
  return (pen, x, y, w) => {
    let h = pen.para('P', label, x, y, w, st.bodyStrong);
    const indent = Math.max(...items.map((_, i) => pen.width(marks(i), st.body))) + st.gap * 0.6;
    const itemGap = st.body.size * 0.25;
    pen.group('L', () =>
      items.forEach((item, i) => {
        if (i > 0) h += itemGap;
        pen.group('LI', () => {
          pen.para('Lbl', marks(i), x, y + h, indent, st.body, { noWrap: true });
          h += pen.para('LBody', item, x + indent, y + h, w - indent, st.body);
        });
      }),
    );
    return h;
  };
}

/**
 * The exercises: each with its heading, the card it uses, its goal, steps, what to write
 * down, what a good result looks like and its safety line (label in the cautions' red).
 * `listNumber` and `bullet` are the language's list marks (words/pdf.ts).
 */
export function exercisesItems(
  view: ExercisesView,
  st: TextPageStyle,
  marks: { readonly listNumber: (n: number) => string; readonly bullet: string },
): FlowItem[] {
  const l = view.labels;
  const labelled =
    (label: string, text: string, font = st.bodyStrong): Block =>
    (pen, x, y, w) => {
      const h = pen.para('P', label, x, y, w, font);
      return h + pen.para('P', text, x, y + h, w, st.body);
    };
  const items: FlowItem[] = [title(view.title, st), { block: para('P', view.intro, st.lead) }];
  view.exercises.forEach((ex, i) => {
    // An exercise is kept on one page where it fits one (flowPages caps the keep at a page).
    const blocks: Block[] = [
      para('H2', `${marks.listNumber(i + 1)} ${ex.heading}`, st.h2),
      labelled(l.card, ex.card),
      labelled(l.goal, ex.goal),
      labelledList(l.steps, ex.steps, (n) => marks.listNumber(n + 1), st),
      labelledList(l.record, ex.record, () => marks.bullet, st),
      labelled(l.good, ex.good),
      labelled(l.safety, ex.safety, { ...st.bodyStrong, color: VALVE }),
    ];
    blocks.forEach((block, b) => items.push({ block, keepWithNext: b < blocks.length - 1 }));
  });
  return items;
}
