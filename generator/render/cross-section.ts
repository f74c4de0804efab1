/**
 * A drawn cross-section of a pot, to scale, from the entry's own dimensions: the base with
 * its water up to the fill line, the safety valve, the funnel tube and basket, the upper
 * chamber with its column and spout. The fill line and the valve are marked and labelled,
 * and the gap between them is shown.
 *
 * Heights follow brew/geometry.ts (z = 0 at the floor of the base, the base drawn as its
 * equivalent cylinder). The upper chamber is drawn with the base's diameter and the height
 * that holds its capacity: the entries do not give its shape, so that part is schematic.
 * One scale for x and y (px per metre), so every position is proportional to the pot.
 */
import type { PotModel } from '../brew/types.ts';
import { potGeometry } from '../brew/geometry.ts';
import type { UnitSystem } from '../content/types.ts';
import { FONT_FAMILY } from './fonts.ts';
import { lengthDown } from './format.ts';
import { el, escapeXml, n } from './svg.ts';
import { measureText } from './text-measure.ts';
import { asVoice, type Voice } from './voice.ts';

export interface CrossSectionInput {
  readonly pot: PotModel;
  readonly potName: string;
  /** Height of the fill line above the floor, m (AcceptedPlan.fillHeightM). */
  readonly fillHeightM: number;
  /**
   * The fill line's gap below the valve, m (AcceptedPlan.belowValveM): labelled with the
   * same rounding down as the card's text, so the two never differ. Default: from the pot.
   */
  readonly belowValveM?: number;
  /** The output's voice, or a unit system (English). */
  readonly units: UnitSystem | Voice;
}

/** Where things were drawn, SVG px (y grows downward), for tests and for PDF placement. */
export interface CrossSectionLayout {
  readonly widthPx: number;
  readonly heightPx: number;
  readonly scalePxPerM: number;
  readonly potLeftX: number;
  readonly potRightX: number;
  readonly floorY: number;
  readonly fillY: number;
  readonly valveY: number;
  readonly tubeEndY: number;
  readonly baseTopY: number;
  readonly bedTopY: number;
  readonly spoutY: number;
  readonly topY: number;
}

export interface CrossSection {
  readonly svg: string;
  readonly layout: CrossSectionLayout;
}

/** Largest drawn size of the pot itself, px. */
const MAX_POT_HEIGHT_PX = 220;
const MAX_POT_WIDTH_PX = 110;
const FONT_PX = 11;
const LINE_PX = 14;
const SMALL_FONT_PX = 9.5;
const SMALL_LINE_PX = 12;
const MARGIN_PX = 6;
const WALL_PX = 3;
const VALVE_STUB_PX = 7;
const LEADER_PX = 18;

const INK = '#000000';
const WATER = '#8cc3ec';
const WATER_LINE = '#004a8f';
const VALVE = '#b00000';
const COFFEE = '#7a5230';

interface Label {
  /** First line (bold when `bold`), then smaller lines below it. */
  readonly lines: readonly string[];
  /** Point the leader starts from. */
  readonly ax: number;
  readonly ay: number;
  readonly bold?: boolean;
  readonly color?: string;
  y: number;
}

const labelHeight = (label: Label): number => LINE_PX + (label.lines.length - 1) * SMALL_LINE_PX;

/** Pushes labels apart so none overlap, keeping their order by anchor height. */
function spread(labels: Label[], minY: number): void {
  labels.sort((a, b) => a.ay - b.ay);
  let bottom = minY;
  for (const label of labels) {
    label.y = Math.max(label.ay, bottom + LINE_PX / 2);
    bottom = label.y - LINE_PX / 2 + labelHeight(label);
  }
}

export function crossSection(input: CrossSectionInput): CrossSection {
  const { pot } = input;
  const g = potGeometry(pot);
  const voice = asVoice(input.units);
  const words = voice.words.card.crossSection;
  const upperAreaM2 = g.baseAreaM2;
  const upperHeightM = Math.max(
    pot.upperCapacityM3 / upperAreaM2,
    (pot.spoutHeightM - g.bedTopM) * 1.2,
  );
  const totalHeightM = g.bedTopM + upperHeightM;
  const s = Math.min(MAX_POT_HEIGHT_PX / totalHeightM, MAX_POT_WIDTH_PX / pot.baseInnerDiameterM);

  const potLeftX = MARGIN_PX + 4;
  const potWidth = pot.baseInnerDiameterM * s;
  const potRightX = potLeftX + potWidth;
  const cx = (potLeftX + potRightX) / 2;
  const topY = MARGIN_PX + LINE_PX / 2;
  const floorY = topY + totalHeightM * s;
  const y = (zM: number): number => floorY - zM * s;

  const fillY = y(input.fillHeightM);
  const valveY = y(pot.valveHeightM);
  const tubeEndY = y(pot.tubeGapM);
  const baseTopY = y(g.baseHeightM);
  const bedTopY = y(g.bedTopM);
  const spoutY = y(pot.spoutHeightM);
  const tubeW = Math.max(3, pot.tubeInnerDiameterM * s);
  const basketW = Math.min(potWidth - 2, pot.basketDiameterM * s);
  const gap = lengthDown(input.belowValveM ?? pot.valveHeightM - input.fillHeightM, voice).text;

  const labelX = potRightX + VALVE_STUB_PX + LEADER_PX;
  const labels: Label[] = [
    { lines: [words.basket], ax: cx + basketW / 2, ay: (baseTopY + bedTopY) / 2, y: 0 },
    { lines: [words.tube], ax: cx + tubeW / 2, ay: (tubeEndY + fillY) / 2, y: 0 },
    {
      lines: [words.valve],
      ax: potRightX + VALVE_STUB_PX,
      ay: valveY,
      bold: true,
      color: VALVE,
      y: 0,
    },
    {
      lines: [words.fillLine, words.margin(gap)],
      ax: potRightX,
      ay: fillY,
      bold: true,
      color: WATER_LINE,
      y: 0,
    },
  ];
  spread(labels, topY);
  const labelsWidth = Math.max(
    ...labels.flatMap((l) =>
      l.lines.map((line, i) =>
        measureText(
          line,
          i === 0 ? { fontSize: FONT_PX, bold: l.bold ?? false } : { fontSize: SMALL_FONT_PX },
        ),
      ),
    ),
  );
  const widthPx = Math.ceil(labelX + labelsWidth + MARGIN_PX);
  const lowestLabel = Math.max(...labels.map((l) => l.y - LINE_PX / 2 + labelHeight(l)));
  const heightPx = Math.ceil(Math.max(floorY + WALL_PX, lowestLabel) + MARGIN_PX);

  const parts: string[] = [];
  // Water in the base, up to the fill line.
  parts.push(
    el('rect', {
      class: 'water',
      x: potLeftX,
      y: fillY,
      width: potWidth,
      height: floorY - fillY,
      fill: WATER,
    }),
  );
  // Walls: base, upper chamber (open top drawn as a lid line).
  parts.push(
    el('rect', {
      class: 'base',
      x: potLeftX,
      y: baseTopY,
      width: potWidth,
      height: floorY - baseTopY,
      fill: 'none',
      stroke: INK,
      'stroke-width': WALL_PX,
    }),
    el('rect', {
      class: 'upper',
      x: potLeftX,
      y: topY,
      width: potWidth,
      height: bedTopY - topY,
      fill: 'none',
      stroke: INK,
      'stroke-width': WALL_PX,
    }),
  );
  // Funnel: tube from its lower end up to the basket, then the basket of coffee.
  parts.push(
    el('rect', {
      class: 'tube',
      x: cx - tubeW / 2,
      y: baseTopY,
      width: tubeW,
      height: tubeEndY - baseTopY,
      fill: '#ffffff',
      stroke: INK,
      'stroke-width': 1.5,
    }),
    el('rect', {
      class: 'basket',
      x: cx - basketW / 2,
      y: bedTopY,
      width: basketW,
      height: baseTopY - bedTopY,
      fill: COFFEE,
      stroke: INK,
      'stroke-width': 1.5,
    }),
  );
  // Column and spout in the upper chamber.
  parts.push(
    el('rect', {
      class: 'column',
      x: cx - tubeW / 2,
      y: spoutY,
      width: tubeW,
      height: bedTopY - spoutY,
      fill: '#ffffff',
      stroke: INK,
      'stroke-width': 1.5,
    }),
    el('path', {
      class: 'spout',
      d: `M${n(cx - tubeW / 2)} ${n(spoutY)} q${n(-tubeW)} ${n(-tubeW)} ${n(-tubeW * 2)} ${n(tubeW * 0.2)} M${n(cx + tubeW / 2)} ${n(spoutY)} q${n(tubeW)} ${n(-tubeW)} ${n(tubeW * 2)} ${n(tubeW * 0.2)}`,
      fill: 'none',
      stroke: INK,
      'stroke-width': 1.5,
    }),
  );
  // Valve: a stub through the right wall, and its level across the base.
  parts.push(
    el('line', {
      class: 'valve-line',
      'data-z-mm': n(pot.valveHeightM * 1000),
      x1: potLeftX,
      y1: valveY,
      x2: potRightX,
      y2: valveY,
      stroke: VALVE,
      'stroke-width': 1.5,
      'stroke-dasharray': '4 3',
    }),
    el('rect', {
      class: 'valve',
      x: potRightX,
      y: valveY - 4,
      width: VALVE_STUB_PX,
      height: 8,
      fill: VALVE,
    }),
  );
  // Fill line, drawn over the water.
  parts.push(
    el('line', {
      class: 'fill-line',
      'data-z-mm': n(input.fillHeightM * 1000),
      x1: potLeftX - 4,
      y1: fillY,
      x2: potRightX + 4,
      y2: fillY,
      stroke: WATER_LINE,
      'stroke-width': 2.5,
    }),
  );
  // Labels with leaders.
  for (const label of labels) {
    const tspans = label.lines
      .map((line, i) =>
        i === 0
          ? `<tspan x="${n(labelX)}"${label.bold ? ' font-weight="bold"' : ''}>${escapeXml(line)}</tspan>`
          : `<tspan x="${n(labelX)}" dy="${SMALL_LINE_PX}" font-size="${SMALL_FONT_PX}">${escapeXml(line)}</tspan>`,
      )
      .join('');
    parts.push(
      el('path', {
        class: 'leader',
        d: `M${n(label.ax)} ${n(label.ay)} L${n(labelX - 10)} ${n(label.y)} H${n(labelX - 3)}`,
        stroke: label.color ?? INK,
        'stroke-width': 0.8,
        fill: 'none',
      }),
      el(
        'text',
        { y: label.y + FONT_PX * 0.35, 'font-size': FONT_PX, fill: label.color ?? INK },
        tspans,
      ),
    );
  }

  const title = words.title(input.potName);
  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" class="cross-section" role="img" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}" font-family="${FONT_FAMILY}">` +
    `<title>${escapeXml(title)}</title>` +
    parts.join('') +
    '</svg>';
  return {
    svg,
    layout: {
      widthPx,
      heightPx,
      scalePxPerM: s,
      potLeftX,
      potRightX,
      floorY,
      fillY,
      valveY,
      tubeEndY,
      baseTopY,
      bedTopY,
      spoutY,
      topY,
    },
  };
}
