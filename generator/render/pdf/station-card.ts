/**
 * The station card as PDF blocks, in the order of the HTML card
 * (templates/_includes/partials/station-card.njk): header; 1 water with the cross-section;
 * 2 coffee beside 3 heat; 4 times and what to watch for; 5 the chart beside 6 what to
 * expect; warnings; then the cautions and the footer at the foot of the page. A refused
 * plan gets the refusal box in place of the recipe, never a recipe.
 */
import type {
  ChartBlock,
  CoffeeStep,
  ExpectBlock,
  HeatStep,
  Quantity,
  RefusalBlock,
  StationCardView,
  TimingsStep,
  WaterStep,
} from '../card-view.ts';
import {
  cautionsBlock,
  footerBlock,
  headerBlock,
  labelLine,
  listBlock,
  shownCautions,
  stepHeading,
  warningsBlock,
} from './blocks.ts';
import { beside, type Block, type CardFrame } from './layout.ts';
import { svgSize, type Pen } from './pen.ts';
import type { StationOptional } from './card.ts';
import { MIN_TEXT_PT, VALVE, type CardStyle } from './style.ts';

/** Smallest font size used inside an SVG drawing, px (its labels). */
export function svgMinFontPx(svg: string): number {
  const sizes = [...svg.matchAll(/font-size="([\d.]+)(?:px)?"/g)].map((m) => Number(m[1]));
  return sizes.length > 0 ? Math.min(...sizes) : 11;
}

/** Narrowest width at which a drawing's labels stay at MIN_TEXT_PT or more. */
export function figureMinWidth(svg: string): number {
  return (svgSize(svg).width * MIN_TEXT_PT) / svgMinFontPx(svg);
}

/**
 * Narrowest width a drawing may have beside text: four fifths of its natural size. A
 * narrower column puts the text under the drawing instead, so a drawing is shrunk to
 * its fine-print limit only when the whole column is that narrow.
 */
function figureBesideWidth(svg: string, st: CardStyle): number {
  return Math.max(figureMinWidth(svg), 0.8 * svgSize(svg).width * st.drawingScale);
}

/**
 * An SVG drawing at its natural size for this style, never wider than the column nor so
 * small that its labels drop under MIN_TEXT_PT (Infinity when the column is that narrow).
 */
function figureBlock(svg: string, alt: string, st: CardStyle): Block {
  const min = figureMinWidth(svg);
  const natural = Math.max(min, svgSize(svg).width * st.drawingScale);
  return (pen, x, y, w) => {
    if (w < min) return Number.POSITIVE_INFINITY;
    return pen.figure(svg, x, y, Math.min(natural, w), alt);
  };
}

/** "151" in large type with " mL" smaller on the same baseline, then an aside ("(151 g on a scale)"). */
function bigValue(
  pen: Pen,
  q: Quantity,
  aside: string | null,
  x: number,
  y: number,
  w: number,
  st: CardStyle,
): number {
  let h = 0;
  pen.leaf('P', () => {
    h = pen.inline(
      [
        { text: q.value, font: st.big },
        { text: `\u00a0${q.unit}`, font: st.bigUnit },
        ...(aside ? [{ text: ` ${aside}`, font: st.bigAside }] : []),
      ],
      x,
      y,
      w,
    );
  });
  return h;
}

function waterBlock(water: WaterStep, potName: string, st: CardStyle, withDrawing = true): Block {
  const alt = water.crossSectionAlt;
  const drawing = figureBlock(water.crossSectionSvg, alt, st);
  const text: Block = (pen, x, y, w) => {
    let h = labelLine(pen, water.temperatureLabel, x, y, w, st);
    h += bigValue(pen, water.temperature, null, x, y + h, w, st);
    for (const note of water.temperatureNotes) h += pen.para('P', note, x, y + h, w, st.note);
    h += st.padding;
    h += labelLine(pen, water.fillLabel, x, y + h, w, st);
    h += bigValue(pen, water.fillVolume, water.fillMassText, x, y + h, w, st);
    return h + pen.para('P', water.fillLineText, x, y + h, w, st.note);
  };
  const pair = !withDrawing
    ? text
    : beside(
        {
          block: text,
          share: 0.4,
          minWidth: (pen) =>
            pen.width(`${water.fillVolume.value}\u00a0${water.fillVolume.unit}`, st.big) * 1.3,
        },
        {
          block: drawing,
          share: 0.6,
          minWidth: () => figureBesideWidth(water.crossSectionSvg, st),
        },
        st.gutter,
        st.gap,
      );
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      const hh = stepHeading(pen, 1, water.heading, null, x, y, w, st);
      return hh + pair(pen, x, y + hh, w);
    });
}

function coffeeBlock(coffee: CoffeeStep, st: CardStyle): Block {
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      let h = stepHeading(pen, 2, coffee.heading, null, x, y, w, st);
      h += labelLine(pen, coffee.doseLabel, x, y + h, w, st);
      h += bigValue(pen, coffee.dose, null, x, y + h, w, st);
      coffee.lines.forEach((line, i) => {
        const last = i === coffee.lines.length - 1;
        h += pen.para('P', line, x, y + h, w, last ? st.noteStrong : st.note);
      });
      return h;
    });
}

function heatBlock(heat: HeatStep, st: CardStyle): Block {
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      let h = stepHeading(pen, 3, heat.heading, null, x, y, w, st);
      h += labelLine(pen, heat.settingLabel, x, y + h, w, st);
      h += pen.para('P', heat.level, x, y + h, w, st.big);
      h += pen.para('P', heat.stoveText, x, y + h, w, st.note);
      if (heat.note) h += pen.para('P', heat.note, x, y + h, w, st.note);
      return h;
    });
}

function timesBlock(t: TimingsStep, st: CardStyle): Block {
  const time =
    (label: string, value: string): Block =>
    (pen, x, y, w) => {
      const h = labelLine(pen, label, x, y, w, st);
      const vw = pen.width(value, st.time);
      if (vw > w) return Number.POSITIVE_INFINITY;
      return h + pen.para('P', value, x, y + h, w, st.time, { noWrap: true });
    };
  const minTime = (value: string) => (pen: Pen) => pen.width(value, st.time);
  const times = beside(
    {
      block: time(t.firstCoffeeLabel, t.firstCoffee.text),
      share: 1,
      minWidth: minTime(t.firstCoffee.text),
    },
    { block: time(t.offHeatLabel, t.offHeat.text), share: 1, minWidth: minTime(t.offHeat.text) },
    st.gutter,
    st.padding,
  );
  const watch = listBlock(t.watch, st.list, st, {
    numbered: true,
    columns: st.listColumns,
    strongLast: true,
  });
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      let h = stepHeading(pen, 4, t.heading, t.note, x, y, w, st);
      h += times(pen, x, y + h, w);
      h += st.padding;
      h += pen.para('H3', t.watchHeading, x, y + h, w, st.h3);
      return h + watch(pen, x, y + h, w);
    });
}

function chartBlock(chart: ChartBlock, st: CardStyle): Block {
  const figure = figureBlock(chart.svg, chart.alt, st);
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      let h = stepHeading(pen, 5, chart.heading, null, x, y, w, st);
      h += figure(pen, x, y + h, w);
      if (!st.compact) h += pen.para('P', chart.caption, x, y + h, w, st.caption);
      return h;
    });
}

function expectBlock(expect: ExpectBlock, st: CardStyle): Block {
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      let h = stepHeading(pen, 6, expect.heading, null, x, y, w, st);
      pen.group('L', () => {
        for (const row of expect.rows) {
          pen.group('LI', () => {
            h += st.padding * 0.6;
            h += pen.para('Lbl', row.label, x, y + h, w, st.expectLabel);
            h += pen.para('LBody', row.value, x, y + h, w, st.expect);
          });
        }
      });
      for (const note of expect.notes)
        h += st.padding * 0.6 + pen.para('P', note, x, y + h + st.padding * 0.6, w, st.note);
      return h;
    });
}

function refusalBlock(refusal: RefusalBlock, st: CardStyle): Block {
  const border = st.ruleHeavy;
  const pad = st.padding * 3;
  return (pen, x, y, w) => {
    const inner: Block = (p, ix, iy, iw) =>
      p.group('Sect', () => {
        let h = stepHeading(p, null, refusal.heading, null, ix, iy, iw, st, st.refusalHeading);
        h += p.para('P', refusal.note, ix, iy + h, iw, st.note);
        h += st.padding;
        h += p.para('H3', refusal.whyLabel, ix, iy + h, iw, st.h3);
        h += p.para('P', refusal.reason, ix, iy + h, iw, st.reason);
        h += st.padding;
        h += p.para('H3', refusal.changeLabel, ix, iy + h, iw, st.h3);
        return h + p.para('P', refusal.suggestion, ix, iy + h, iw, st.reason);
      });
    const innerH = inner(pen.measuring(), x + pad, y + pad, w - 2 * pad);
    const h = innerH + 2 * pad;
    pen.artifact(() => {
      pen.doc
        .lineWidth(border)
        .rect(x + border / 2, y + border / 2, w - border, h - border)
        .stroke(VALVE);
    });
    if (pen.drawing) inner(pen, x + pad, y + pad, w - 2 * pad);
    return h;
  };
}

/** Narrowest column a step's text may have beside another step. */
const textColumnMin = (st: CardStyle) => (pen: Pen) => pen.width('Fill the basket to the', st.note);

/** The station card's blocks at one style. */
export function stationFrame(
  view: StationCardView,
  st: CardStyle,
  dropped: ReadonlySet<StationOptional | string> = new Set(),
): CardFrame {
  const body: Block[] = [];
  const r = view.recipe;
  if (r) {
    body.push(waterBlock(r.water, view.potName, st, !dropped.has('cross-section')));
    body.push(
      beside(
        { block: coffeeBlock(r.coffee, st), share: 1, minWidth: textColumnMin(st) },
        { block: heatBlock(r.heat, st), share: 1, minWidth: textColumnMin(st) },
        st.gutter,
        st.gap,
      ),
    );
    body.push(timesBlock(r.timings, st));
    const chart = !dropped.has('chart');
    const expect = !dropped.has('expect');
    if (chart && !expect) body.push(chartBlock(r.chart, st));
    else if (!chart && expect) body.push(expectBlock(r.expect, st));
    else if (chart && expect)
      body.push(
        beside(
          {
            block: chartBlock(r.chart, st),
            share: 1.35,
            minWidth: () => figureBesideWidth(r.chart.svg, st),
          },
          { block: expectBlock(r.expect, st), share: 1, minWidth: textColumnMin(st) },
          st.gutter,
          st.gap,
        ),
      );
  } else if (view.refusal) {
    body.push(refusalBlock(view.refusal, st));
  }
  body.push(warningsBlock(view.warnings, st));
  return {
    header: headerBlock(view.title, view.subtitle, null, st, view.brand?.logo ?? null),
    body,
    bottom: [cautionsBlock(shownCautions(view, dropped.has('long-cautions')), st)],
    footer: footerBlock(dropped.has('qr-code') ? { ...view.footer, qrSvg: null } : view.footer, st),
  };
}
