/**
 * Card view models: everything a printed card shows, already worded and formatted in the
 * site's unit system, with its drawings (cross-section, chart, QR code) as SVG strings.
 *
 *   CardPlan (SI) + Catalogue ─ stationCardView / insertCardView ─▶ StationCardView /
 *   InsertCardView (plain data) ─▶ templates/ (HTML, Nunjucks)  and  PDF (pdfkit)
 *
 * Templates and the PDF renderer only place these values: no arithmetic, no wording, no
 * unit choice happens after this module. Keep the exported types stable; both renderers
 * depend on them. The views are JSON-safe (strings, numbers, booleans, arrays, objects).
 */
import type { TopLevelSpec } from 'vega-lite';
import type {
  Catalogue,
  CoffeeEntry,
  PaperSize,
  PotEntry,
  StoveEntry,
  UnitSystem,
} from '../content/types.ts';
import type { AcceptedPlan, CardPlan, RefusedPlan } from '../planning/types.ts';
import { heatKindOf, type HeatKind } from '../content/heat-kind.ts';
import type { Provenance } from '../content/provenance.ts';
import { cardWords } from '../words/card.ts';
import { langTag } from '../words/catalogue.ts';
import { cupChartSpec, renderChartSvg } from './chart.ts';
import { crossSection, type CrossSectionLayout } from './cross-section.ts';
import {
  altitude,
  dose,
  fillMass as fillMassQuantity,
  fillVolume,
  length,
  lengthDown,
  pressure,
  pressureRough,
  share,
  temperature,
  temperatureBand,
  timeRange,
  waterMass,
  waterVolume,
  type Quantity,
  type TimeRangeText,
} from './format.ts';
import { heatFeel, insertSteps, type InsertStep } from './insert-steps.ts';
import { insertPaths, plannerPaths, plannerSlug, stationPaths, type CardPaths } from './paths.ts';
import { bindingCauseText, refusalText, warningText } from './plan-text.ts';
import { qrSvg } from './qr.ts';

export type { Quantity, TimeRangeText } from './format.ts';
export type { CardPaths } from './paths.ts';
export type { CrossSectionLayout } from './cross-section.ts';
export type { HeatKind } from '../content/heat-kind.ts';
export type { InsertStep } from './insert-steps.ts';

/** What the build passes in for every card. */
export interface CardViewOptions {
  /** Build date printed in the footer, YYYY-MM-DD (SOURCE_DATE_EPOCH when set). */
  readonly builtOn: string;
  /** Short fingerprint printed in the footer: first 8 hex of the card's cache key. */
  readonly fingerprint: string;
  /** Units to print in; default the site's. */
  readonly units?: UnitSystem;
  /** Paper to lay out for; default the site's. */
  readonly paper?: PaperSize;
  /** Language code of the card's words; default the site's. */
  readonly language?: string;
}

/** Paper and type size of a printed card. */
export interface PageSetup {
  readonly units: UnitSystem;
  readonly paper: PaperSize;
  /** Value of the CSS `@page { size }` property, e.g. "148mm 210mm" or "5.5in 8.5in". */
  readonly cssSize: string;
  /** Paper width and height, mm (for the PDF renderer). */
  readonly widthMm: number;
  readonly heightMm: number;
  /** True on small paper (A6): smaller type and drawings. */
  readonly compact: boolean;
}

/** The usual cautions (full, or compact where space is short) and the deferral to the maker. */
export interface Cautions {
  readonly heading: string;
  readonly form: 'full' | 'compact';
  /** One line per caution (cardWords.cautions.full or .compact). */
  readonly items: readonly string[];
  /** "Follow the maker’s instructions and local rules.", printed after the list. */
  readonly deferral: string;
}

export interface Warnings {
  readonly heading: string;
  readonly items: readonly string[];
}

export interface Footer {
  /** "From <business> · <contact>". */
  readonly printedBy: string;
  /** "Computed <date> · card <fingerprint>". */
  readonly built: string;
  readonly builtOn: string;
  readonly fingerprint: string;
  /** QR code of the card's web page (SVG), when the site has a base_url. */
  readonly qrSvg: string | null;
  readonly qrCaption: string | null;
  /** The web page the QR code opens, when the site has a base_url. */
  readonly webUrl: string | null;
}

export interface LabelledValue {
  readonly label: string;
  readonly value: string;
}

export interface WaterStep {
  readonly heading: string;
  /** "Heat the water to" or "Water at room temperature". */
  readonly temperatureLabel: string;
  readonly temperature: Quantity;
  /** True when the water is heated before sealing. */
  readonly heated: boolean;
  /** Which kettle setting (or a thermometer), or that room-temperature water is fine. */
  readonly temperatureNotes: readonly string[];
  readonly fillLabel: string;
  readonly fillVolume: Quantity;
  readonly fillMass: Quantity;
  /** "(215 g on a scale)". */
  readonly fillMassText: string;
  readonly fillHeight: Quantity;
  readonly belowValve: Quantity;
  /** "The fill line is 27 mm above the floor of the base, 5 mm below …". */
  readonly fillLineText: string;
  readonly crossSectionSvg: string;
  readonly crossSection: CrossSectionLayout;
}

export interface CoffeeStep {
  readonly heading: string;
  readonly doseLabel: string;
  readonly dose: Quantity;
  /** Level basket, grind class, do not tamp. */
  readonly lines: readonly string[];
}

export interface HeatStep {
  readonly heading: string;
  readonly settingLabel: string;
  /** The stove level's own label, as written in its YAML. */
  readonly level: string;
  /** "on the <stove>". */
  readonly stoveText: string;
  readonly note: string | null;
}

export interface TimingsStep {
  readonly heading: string;
  readonly note: string;
  readonly firstCoffeeLabel: string;
  readonly firstCoffee: TimeRangeText;
  readonly offHeatLabel: string;
  readonly offHeat: TimeRangeText;
  readonly watchHeading: string;
  readonly watch: readonly string[];
}

export interface ChartBlock {
  readonly heading: string;
  /** Inline SVG rendered by vega at build time. */
  readonly svg: string;
  /** The vega-lite spec it was rendered from. */
  readonly spec: TopLevelSpec;
  readonly caption: string;
  /** Text alternative of the chart. */
  readonly alt: string;
}

export interface ExpectBlock {
  readonly heading: string;
  readonly rows: readonly LabelledValue[];
  readonly notes: readonly string[];
}

/** The recipe of an accepted plan, in the order a person works. */
export interface StationRecipe {
  readonly water: WaterStep;
  readonly coffee: CoffeeStep;
  readonly heat: HeatStep;
  readonly timings: TimingsStep;
  readonly chart: ChartBlock;
  readonly expect: ExpectBlock;
}

/** A refused plan: why, and what to change. Never a recipe. */
export interface RefusalBlock {
  readonly heading: string;
  readonly note: string;
  readonly whyLabel: string;
  readonly reason: string;
  readonly changeLabel: string;
  readonly suggestion: string;
}

export interface StationCardView {
  readonly kind: 'station';
  /** Document language tag of the card's page and PDF (words/catalogue.ts langTag). */
  readonly lang: string;
  /** "<pot>--<coffee>--<stove>". */
  readonly id: string;
  readonly potId: string;
  readonly coffeeId: string;
  readonly stoveId: string;
  /** The coffee's name. */
  readonly title: string;
  /** "in the <pot> · on the <stove>". */
  readonly subtitle: string;
  readonly potName: string;
  readonly coffeeName: string;
  readonly stoveName: string;
  readonly page: PageSetup;
  readonly paths: CardPaths;
  /** Exactly one of recipe and refusal is non-null. */
  readonly recipe: StationRecipe | null;
  readonly refusal: RefusalBlock | null;
  readonly warnings: Warnings | null;
  readonly cautions: Cautions;
  readonly footer: Footer;
  /** The coffee's page for customers (planner-view.ts), linked from the card's page. */
  readonly planner: PlannerLink;
}

/** A card's link to its coffee's page for customers. */
export interface PlannerLink {
  /** Site-relative page address, e.g. "brew/house-blend/". */
  readonly pageUrl: string;
  readonly webUrl: string | null;
  readonly label: string;
  /** Language code of the page (the card's). */
  readonly language: string;
}

/** One row of an insert card: a pot size on a kind of stove. */
export interface InsertRow {
  readonly potId: string;
  readonly stoveId: string;
  readonly potName: string;
  /** "3-cup". */
  readonly cupsLabel: string;
  /**
   * Rows with a recipe of the same pot are consecutive in the table: the first carries
   * their count, the others (and every refused row, which the table leaves out) 0.
   */
  readonly potRowSpan: number;
  readonly heatKind: HeatKind;
  /** "Gas", "Electric", "Induction". */
  readonly heatLabel: string;
  readonly stoveName: string;
  /** Null for a recipe; else "Not suitable" and the short reason. */
  readonly refused: { readonly label: string; readonly reason: string } | null;
  readonly fill: Quantity | null;
  readonly dose: Quantity | null;
  /** "80 °C", or "room temp.". */
  readonly start: string | null;
  readonly level: string | null;
  /** The knob's label and the heat in words ("low · medium heat"), as the Setting cell prints it. */
  readonly setting: string | null;
  readonly firstCoffee: TimeRangeText | null;
  readonly offHeat: TimeRangeText | null;
  /** The full station card of this row. */
  readonly stationPaths: CardPaths;
}

export interface InsertCardView {
  readonly kind: 'insert';
  /** Document language tag of the card's page and PDF (words/catalogue.ts langTag). */
  readonly lang: string;
  /** The page slug: the coffee id (or "<coffee>--<set>", see paths.ts). */
  readonly id: string;
  readonly setId: string;
  readonly coffeeId: string;
  readonly title: string;
  readonly subtitle: string;
  readonly notes: string | null;
  readonly heading: string;
  readonly intro: string;
  readonly columns: {
    readonly pot: string;
    readonly heat: string;
    readonly fill: string;
    readonly dose: string;
    readonly start: string;
    readonly level: string;
    readonly firstCoffee: string;
    readonly offHeat: string;
  };
  /** Every row, refused ones included; the table prints those with a recipe. */
  readonly rows: readonly InsertRow[];
  /** The numbered steps for a stranger (insert-steps.ts); empty when no row has a recipe. */
  readonly stepsHeading: string;
  readonly steps: readonly InsertStep[];
  /** The refused rows, said in plain words under the table; null when there are none. */
  readonly unsuitable: { readonly heading: string; readonly items: readonly string[] } | null;
  /** "Full cards … : <url>" when the site has a base_url. */
  readonly webLine: string | null;
  readonly page: PageSetup;
  readonly paths: CardPaths;
  readonly warnings: Warnings | null;
  readonly cautions: Cautions;
  /** Its QR code opens the coffee's page for customers (the planner), not the insert's page. */
  readonly footer: Footer;
  readonly planner: PlannerLink;
}

/** What the build hands insertCardView: the set, the coffee and one plan per row. */
export interface InsertCardInput {
  readonly setId: string;
  readonly coffeeId: string;
  /** Page slug (paths.ts); default the coffee id. */
  readonly slug?: string;
  readonly rows: readonly {
    readonly potId: string;
    readonly stoveId: string;
    readonly plan: CardPlan;
  }[];
}

/** Paper sizes; CSS gets explicit dimensions (Chromium knows no "A6" or "half-letter" keyword). */
const PAPER: Record<PaperSize, { css: string; widthMm: number; heightMm: number }> = {
  A4: { css: '210mm 297mm', widthMm: 210, heightMm: 297 },
  A5: { css: '148mm 210mm', widthMm: 148, heightMm: 210 },
  A6: { css: '105mm 148mm', widthMm: 105, heightMm: 148 },
  letter: { css: '8.5in 11in', widthMm: 215.9, heightMm: 279.4 },
  'half-letter': { css: '5.5in 8.5in', widthMm: 139.7, heightMm: 215.9 },
  '4x6in': { css: '4in 6in', widthMm: 101.6, heightMm: 152.4 },
};

/** Papers small enough for the compact cautions and drawings (A6 and 4 × 6 in cards). */
export const COMPACT_PAPERS: ReadonlySet<PaperSize> = new Set<PaperSize>(['A6', '4x6in']);

/**
 * A card's view laid out for other paper (a set with its own \`paper:\`): the page and the
 * cautions' form are all of a view that depends on the paper.
 */
export function onPaper<V extends { readonly page: PageSetup; readonly cautions: Cautions }>(
  view: V,
  paper: PaperSize,
): V {
  if (view.page.paper === paper) return view;
  const page = pageSetup(view.page.units, paper);
  return { ...view, page, cautions: cautions(page.compact ? 'compact' : 'full') };
}

export function pageSetup(units: UnitSystem, paper: PaperSize): PageSetup {
  const p = PAPER[paper];
  return {
    units,
    paper,
    cssSize: p.css,
    widthMm: p.widthMm,
    heightMm: p.heightMm,
    compact: COMPACT_PAPERS.has(paper),
  };
}

/** The cautions every page carries: the compact list where space is short (A6). */
export function cautions(form: 'full' | 'compact' = 'full'): Cautions {
  const words = cardWords.cautions;
  return {
    heading: words.heading,
    form,
    items: form === 'full' ? words.full : words.compact,
    deferral: words.deferral,
  };
}

function warnings(items: readonly string[]): Warnings | null {
  const unique = [...new Set(items)];
  return unique.length > 0 ? { heading: cardWords.warningsHeading, items: unique } : null;
}

async function footer(
  catalogue: Catalogue,
  webUrl: string | null,
  options: CardViewOptions,
  caption: string = cardWords.footer.qr,
): Promise<Footer> {
  const { business } = catalogue.site;
  const words = cardWords.footer;
  return {
    printedBy: words.printedBy(business.name, business.contact),
    built: words.built(options.builtOn, options.fingerprint),
    builtOn: options.builtOn,
    fingerprint: options.fingerprint,
    qrSvg: webUrl ? await qrSvg(webUrl) : null,
    qrCaption: webUrl ? caption : null,
    webUrl,
  };
}

/** The coffee's page for customers, in the card's language (paths.ts plannerSlug). */
function plannerLink(
  coffee: CoffeeEntry,
  catalogue: Catalogue,
  options: CardViewOptions,
): PlannerLink {
  const site = catalogue.site;
  const language = options.language ?? site.language;
  const paths = plannerPaths(plannerSlug(coffee.id, language, site.language), site.baseUrl);
  return {
    language,
    pageUrl: paths.pageUrl,
    webUrl: paths.webUrl,
    label: cardWords.planner.link(coffee.name),
  };
}

function entry<T>(map: ReadonlyMap<string, T>, id: string, what: string): T {
  const found = map.get(id);
  if (!found) throw new Error(`card view: no ${what} "${id}" in the catalogue`);
  return found;
}

interface Entries {
  readonly pot: PotEntry;
  readonly coffee: CoffeeEntry;
  readonly stove: StoveEntry;
}

function entriesOf(plan: CardPlan, catalogue: Catalogue): Entries {
  return {
    pot: entry(catalogue.pots, plan.potId, 'pot'),
    coffee: entry(catalogue.coffees, plan.coffeeId, 'coffee'),
    stove: entry(catalogue.stoves, plan.stoveId, 'stove'),
  };
}

function sameK(a: number, b: number): boolean {
  return Math.abs(a - b) < 0.05;
}

async function recipe(
  plan: AcceptedPlan,
  e: Entries,
  catalogue: Catalogue,
  units: UnitSystem,
): Promise<StationRecipe> {
  const words = cardWords;
  const site = catalogue.site;
  const start = temperature(plan.startK, units);
  // Heated whenever the start is above the room; the kettle preset only when one matches.
  const heated = plan.startK > plan.ambientK + 0.5;
  const preset = plan.kettlePresetK;
  const temperatureNotes = heated
    ? [
        preset !== null && site.kettlePresetsK.some((k) => sameK(k, preset))
          ? words.water.kettlePreset(temperature(preset, units).text)
          : words.water.thermometer(start.text),
        words.water.heatedNote,
      ]
    : [words.water.roomTemperatureNote(temperature(plan.ambientK, units).text)];
  // Fill numbers are safety limits: rounded down, never up (generator/render/format.ts).
  const fillHeight = lengthDown(plan.fillHeightM, units);
  const belowValve = lengthDown(plan.belowValveM, units);
  const fillMass = fillMassQuantity(plan.fillKg, units);
  const drawing = crossSection({
    pot: e.pot.model,
    potName: e.pot.name,
    fillHeightM: plan.fillHeightM,
    belowValveM: plan.belowValveM,
    units,
  });

  const band = temperatureBand(plan.targetBandK, units);
  const planShare = share(plan.extraction.inBandShare).text;
  const coldShare = share(plan.coldStart.inBandShare).text;
  const spec = cupChartSpec({
    units,
    plan: plan.brew.cupCurve,
    cold: plan.coldBrew.cupCurve,
    bandK: plan.targetBandK,
  });

  const expectRows: LabelledValue[] = [
    { label: words.expect.yield, value: waterVolume(plan.yieldM3, units).text },
    { label: words.expect.inBand(band), value: words.expect.inBandValue(planShare, coldShare) },
    {
      label: words.expect.peakPressure,
      value: e.pot.valveOpeningAssumed
        ? words.expect.peakPressureAssumedValue(
            pressure(plan.peakGaugePa, units).text,
            pressureRough(plan.valveOpeningGaugePa, units).text,
          )
        : words.expect.peakPressureValue(
            pressure(plan.peakGaugePa, units).text,
            pressure(plan.valveOpeningGaugePa, units).text,
          ),
    },
  ];
  if (Math.abs(plan.altitudeM) >= 0.5) {
    expectRows.push({
      label: words.expect.boiling,
      value: words.expect.boilingValue(
        temperature(plan.boilingK, units).text,
        altitude(plan.altitudeM, units).text,
      ),
    });
  }
  const grindAssumed = e.coffee.permeabilityAssumed ? e.coffee.grind : null;
  const stoveAssumed = e.stove.efficiencyAssumed && !e.stove.levels[plan.levelIndex]?.fitted;
  const level = e.stove.levels[plan.levelIndex];
  const measured = [
    ...(e.coffee.permeabilityProvenance
      ? [{ what: 'grind' as const, ...provenanceText(e.coffee.permeabilityProvenance) }]
      : []),
    ...(level?.provenance ? [{ what: 'heat' as const, ...provenanceText(level.provenance) }] : []),
  ];
  const notes = [
    ...(plan.bindingCause ? [bindingCauseText(plan, units)] : []),
    ...(grindAssumed || stoveAssumed ? [words.expect.assumed(grindAssumed, stoveAssumed)] : []),
    ...(measured.length > 0 ? [words.expect.measured(measured)] : []),
  ];

  return {
    water: {
      heading: words.water.heading,
      temperatureLabel: heated ? words.water.heated : words.water.roomTemperature,
      temperature: start,
      heated,
      temperatureNotes,
      fillLabel: words.water.fill,
      fillVolume: fillVolume(plan.fillM3, units),
      fillMass,
      fillMassText: words.water.fillMass(fillMass.text),
      fillHeight,
      belowValve,
      fillLineText: words.water.fillLine(fillHeight.text, belowValve.text),
      crossSectionSvg: drawing.svg,
      crossSection: drawing.layout,
    },
    coffee: {
      heading: words.coffee.heading,
      doseLabel: words.coffee.dose,
      dose: dose(plan.doseKg, units),
      lines: [words.coffee.level, words.coffee.grind(e.coffee.grind), words.coffee.noTamp],
    },
    heat: {
      heading: words.heat.heading,
      settingLabel: words.heat.setting,
      level: plan.levelLabel,
      stoveText: words.heat.on(e.stove.name),
      note: e.stove.levels[plan.levelIndex]?.fitted ? words.heat.fitted : null,
    },
    timings: {
      heading: words.timings.heading,
      note: words.timings.clockNote,
      firstCoffeeLabel: words.timings.firstCoffee,
      firstCoffee: timeRange(plan.firstCoffeeS.lowS, plan.firstCoffeeS.highS),
      offHeatLabel: words.timings.offHeat,
      offHeat: timeRange(plan.offHeatS.lowS, plan.offHeatS.highS),
      watchHeading: words.timings.watchHeading,
      watch: words.timings.watch,
    },
    chart: {
      heading: words.chart.heading,
      svg: await renderChartSvg(spec),
      spec,
      caption: words.chart.caption,
      alt: words.chart.alt(planShare, coldShare, band),
    },
    expect: { heading: words.expect.heading, rows: expectRows, notes },
  };
}

/** A fitted value's σ (in percent, two figures), its log and date, as the card prints them. */
function provenanceText(p: Provenance): { percent: string; log: string; date: string } {
  return { percent: String(Number((p.sigmaRel * 100).toPrecision(2))), log: p.log, date: p.date };
}

function refusal(plan: RefusedPlan, units: UnitSystem): RefusalBlock {
  const words = cardWords.refusal;
  const text = refusalText(plan.refused, units);
  return {
    heading: words.heading,
    note: words.note,
    whyLabel: words.why,
    reason: text.reason,
    changeLabel: words.change,
    suggestion: text.suggestion,
  };
}

/** The full card for one pot × coffee × stove: a recipe, or a refusal that says why. */
export async function stationCardView(
  plan: CardPlan,
  catalogue: Catalogue,
  options: CardViewOptions,
): Promise<StationCardView> {
  const e = entriesOf(plan, catalogue);
  const units = options.units ?? catalogue.site.units;
  const paper = options.paper ?? catalogue.site.paper;
  const request = { potId: plan.potId, coffeeId: plan.coffeeId, stoveId: plan.stoveId };
  const paths = stationPaths(request, catalogue.site.baseUrl);
  return {
    kind: 'station',
    lang: langTag(options.language ?? catalogue.site.language),
    id: paths.pageUrl.slice('cards/'.length, -1),
    ...request,
    title: e.coffee.name,
    subtitle: cardWords.stationSubtitle(e.pot.name, e.stove.name),
    potName: e.pot.name,
    coffeeName: e.coffee.name,
    stoveName: e.stove.name,
    page: pageSetup(units, paper),
    paths,
    recipe: plan.refused === null ? await recipe(plan, e, catalogue, units) : null,
    refusal: plan.refused === null ? null : refusal(plan, units),
    warnings: warnings(plan.warnings.map((w) => warningText(w, units))),
    cautions: cautions(pageSetup(units, paper).compact ? 'compact' : 'full'),
    footer: await footer(catalogue, paths.webUrl, options),
    planner: plannerLink(e.coffee, catalogue, options),
  };
}

function insertRow(
  row: InsertCardInput['rows'][number],
  potRowSpan: number,
  catalogue: Catalogue,
  units: UnitSystem,
): InsertRow {
  const { plan } = row;
  const e = entriesOf(plan, catalogue);
  const kind = heatKindOf[e.stove.stoveKind];
  const words = cardWords.insert;
  const base = {
    potId: row.potId,
    stoveId: row.stoveId,
    potName: e.pot.name,
    cupsLabel: words.cups(e.pot.cups),
    potRowSpan,
    heatKind: kind,
    heatLabel: words.heatKind(kind),
    stoveName: e.stove.name,
    stationPaths: stationPaths(
      { potId: row.potId, coffeeId: plan.coffeeId, stoveId: row.stoveId },
      catalogue.site.baseUrl,
    ),
  };
  if (plan.refused !== null) {
    return {
      ...base,
      refused: { label: words.notSuitable, reason: cardWords.refusal.short[plan.refused.code] },
      fill: null,
      dose: null,
      start: null,
      level: null,
      setting: null,
      firstCoffee: null,
      offHeat: null,
    };
  }
  return {
    ...base,
    refused: null,
    fill: fillVolume(plan.fillM3, units),
    dose: dose(plan.doseKg, units),
    start: isHeated(plan) ? temperature(plan.startK, units).text : words.roomTemperature,
    level: plan.levelLabel,
    setting: words.setting(plan.levelLabel, words.heatFeel[heatFeel(e.stove, plan.levelIndex)]),
    firstCoffee: timeRange(plan.firstCoffeeS.lowS, plan.firstCoffeeS.highS),
    offHeat: timeRange(plan.offHeatS.lowS, plan.offHeatS.highS),
  };
}

/** Heated whenever the start is above the room (as the station card's water step says). */
function isHeated(plan: AcceptedPlan): boolean {
  return plan.startK > plan.ambientK + 0.5;
}

/** Each distinct warning once, naming the rows it applies to ("3-cup gas, 6-cup electric: …"). */
function insertWarnings(
  rows: readonly InsertRow[],
  inputs: InsertCardInput['rows'],
  units: UnitSystem,
): Warnings | null {
  const byText = new Map<string, string[]>();
  inputs.forEach((input, i) => {
    for (const text of input.plan.warnings.map((w) => warningText(w, units))) {
      const names = byText.get(text) ?? [];
      names.push(cardWords.insert.rowName(rows[i]!.cupsLabel, rows[i]!.heatLabel));
      byText.set(text, names);
    }
  });
  return warnings(
    [...byText.entries()].map(([text, names]) => cardWords.insert.rowWarning(names, text)),
  );
}

/** The insert card of one coffee: a row per pot size × kind of stove. */
export async function insertCardView(
  input: InsertCardInput,
  catalogue: Catalogue,
  options: CardViewOptions,
): Promise<InsertCardView> {
  const coffee = entry(catalogue.coffees, input.coffeeId, 'coffee');
  const units = options.units ?? catalogue.site.units;
  const paper = options.paper ?? catalogue.site.paper;
  const paths = insertPaths(input.slug ?? input.coffeeId, catalogue.site.baseUrl);
  const words = cardWords.insert;
  // The table prints the rows with a recipe; a pot's span counts only those.
  const shown = input.rows.filter((row) => row.plan.refused === null);
  const rows = input.rows.map((row) => {
    if (row.plan.refused !== null) return insertRow(row, 0, catalogue, units);
    const at = shown.indexOf(row);
    const first = at === 0 || shown[at - 1]!.potId !== row.potId;
    let span = 0;
    if (first) while (shown[at + span]?.potId === row.potId) span++;
    return insertRow(row, span, catalogue, units);
  });
  const table = rows.filter((row) => row.refused === null);
  const steps =
    table.length === 0
      ? []
      : insertSteps(
          table.map((row, i) => ({
            start: row.start!,
            room: !(shown[i]!.plan.refused === null && isHeated(shown[i]!.plan)),
            fill: row.fill!.text,
            dose: row.dose!.text,
            setting: row.setting!,
            offHeat: row.offHeat!.text,
          })),
          words.columns,
        );
  const refusedRows = rows.filter((row) => row.refused !== null);
  const planner = plannerLink(coffee, catalogue, options);
  return {
    kind: 'insert',
    lang: langTag(options.language ?? catalogue.site.language),
    id: input.slug ?? input.coffeeId,
    setId: input.setId,
    coffeeId: input.coffeeId,
    title: coffee.name,
    subtitle: cardWords.insertSubtitle(coffee.roast, coffee.grind),
    notes: coffee.notes ?? null,
    heading: words.heading,
    intro: words.intro,
    columns: words.columns,
    rows,
    stepsHeading: words.steps.heading,
    steps,
    unsuitable:
      refusedRows.length === 0
        ? null
        : {
            heading: words.unsuitableHeading,
            items: refusedRows.map((row) =>
              words.unsuitable(row.cupsLabel, words.onHeat[row.heatKind], row.refused!.reason),
            ),
          },
    webLine: paths.webUrl ? words.web(paths.webUrl) : null,
    page: pageSetup(units, paper),
    paths,
    warnings: insertWarnings(rows, input.rows, units),
    cautions: cautions(pageSetup(units, paper).compact ? 'compact' : 'full'),
    footer: await footer(catalogue, planner.webUrl, options, cardWords.footer.qrPlanner),
    planner,
  };
}
