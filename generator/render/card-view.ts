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
import { brandView, type BrandView } from './brand.ts';
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
import { heatFeel, insertSteps, labelNeedsFeel, type InsertStep } from './insert-steps.ts';
import {
  insertPaths,
  pathLanguage,
  plannerPaths,
  plannerSlug,
  stationPaths,
  type CardPaths,
} from './paths.ts';
import { bindingCauseText, refusalText, warningText } from './plan-text.ts';
import { qrSvg } from './qr.ts';
import { asVoice, voiceFor, type Voice } from './voice.ts';
import type { Messages } from '../words/catalogue.ts';

export type { Quantity, TimeRangeText } from './format.ts';
export type { CardPaths } from './paths.ts';
export type { BrandView, LogoView } from './brand.ts';
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

/** The links at the top of a page and its print hint ("Print this card on one page. PDF"), in the page's language. */
export type PageNav = Messages['card']['nav'] & { readonly pdf: string };

/** A page's links in a voice's language. */
export function pageNav(voice: Voice): PageNav {
  return { ...voice.words.card.nav, pdf: voice.words.card.index.pdf };
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
  /**
   * The card's margin, mm, when not its paper's own (style.ts PAPER_STYLE): a card in a
   * sheet's cell (render/sheet.ts), whose `paper` is then only the class of its type sizes.
   */
  readonly marginMm?: number;
}

/** The usual cautions (full, or compact where space is short) and the deferral to the maker. */
export interface Cautions {
  readonly heading: string;
  readonly form: 'full' | 'compact';
  /** One line per caution (the voice's card.cautions.full or .compact). */
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
  /** Text alternative of the QR code, when there is one. */
  readonly qrAlt: string | null;
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
  /** Text alternative of the cross-section: its title and the fill-line sentence. */
  readonly crossSectionAlt: string;
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
  /** Language code of the card's words (the set's: CardSet.language). */
  readonly language: string;
  /** The page's links and print hint, in the card's language. */
  readonly nav: PageNav;
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
  /** The roaster's logo and colour (site.yaml brand:), null without one; brand.ts. */
  readonly brand: BrandView | null;
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
  /** Language code of the card's words (the set's: CardSet.language). */
  readonly language: string;
  /** The page's links and print hint, in the card's language. */
  readonly nav: PageNav;
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
  /** The roaster's logo and colour (site.yaml brand:), null without one; brand.ts. */
  readonly brand: BrandView | null;
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

/** A paper's width and height, mm, portrait. */
export function paperMm(paper: PaperSize): { readonly widthMm: number; readonly heightMm: number } {
  const { widthMm, heightMm } = PAPER[paper];
  return { widthMm, heightMm };
}

/** Papers small enough for the compact cautions and drawings (A6 and 4 × 6 in cards). */
export const COMPACT_PAPERS: ReadonlySet<PaperSize> = new Set<PaperSize>(['A6', '4x6in']);

/**
 * A card's view laid out for other paper (a set with its own \`paper:\`): the page and the
 * cautions' form are all of a view that depends on the paper.
 */
export function onPaper<
  V extends { readonly page: PageSetup; readonly cautions: Cautions; readonly language: string },
>(view: V, paper: PaperSize): V {
  if (view.page.paper === paper) return view;
  const page = pageSetup(view.page.units, paper);
  const voice = voiceFor(view.language, view.page.units);
  return { ...view, page, cautions: cautions(page.compact ? 'compact' : 'full', voice) };
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
export function cautions(form: 'full' | 'compact' = 'full', voice?: Voice | UnitSystem): Cautions {
  const words = asVoice(voice).words.card.cautions;
  return {
    heading: words.heading,
    form,
    items: form === 'full' ? words.full : words.compact,
    deferral: words.deferral,
  };
}

function warnings(items: readonly string[], voice: Voice): Warnings | null {
  const unique = [...new Set(items)];
  return unique.length > 0 ? { heading: voice.words.card.warningsHeading, items: unique } : null;
}

async function footer(
  catalogue: Catalogue,
  webUrl: string | null,
  options: CardViewOptions,
  voice: Voice,
  caption: string = voice.words.card.footer.qr,
): Promise<Footer> {
  const { business } = catalogue.site;
  const words = voice.words.card.footer;
  return {
    printedBy: words.printedBy(business.name, business.contact),
    built: words.built(voice.date(options.builtOn), options.fingerprint),
    builtOn: options.builtOn,
    fingerprint: options.fingerprint,
    qrSvg: webUrl ? await qrSvg(webUrl, words.qrLabel) : null,
    qrCaption: webUrl ? caption : null,
    qrAlt: webUrl ? voice.words.pdf.qrAlt(webUrl) : null,
    webUrl,
  };
}

/** The coffee's page for customers, in the card's language (paths.ts plannerSlug). */
function plannerLink(coffee: CoffeeEntry, catalogue: Catalogue, voice: Voice): PlannerLink {
  const site = catalogue.site;
  const language = voice.language;
  const paths = plannerPaths(plannerSlug(coffee.id, language, site.language), site.baseUrl);
  return {
    language,
    pageUrl: paths.pageUrl,
    webUrl: paths.webUrl,
    label: voice.words.card.planner.link(coffee.name),
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
  voice: Voice,
): Promise<StationRecipe> {
  const words = voice.words.card;
  const site = catalogue.site;
  const start = temperature(plan.startK, voice);
  // Heated whenever the start is above the room; the kettle preset only when one matches.
  const heated = plan.startK > plan.ambientK + 0.5;
  const preset = plan.kettlePresetK;
  const temperatureNotes = heated
    ? [
        preset !== null && site.kettlePresetsK.some((k) => sameK(k, preset))
          ? words.water.kettlePreset(temperature(preset, voice).text)
          : words.water.thermometer(start.text),
        words.water.heatedNote,
      ]
    : [words.water.roomTemperatureNote(temperature(plan.ambientK, voice).text)];
  // Fill numbers are safety limits: rounded down, never up (generator/render/format.ts).
  const fillHeight = lengthDown(plan.fillHeightM, voice);
  const belowValve = lengthDown(plan.belowValveM, voice);
  const fillMass = fillMassQuantity(plan.fillKg, voice);
  const drawing = crossSection({
    pot: e.pot.model,
    potName: e.pot.name,
    fillHeightM: plan.fillHeightM,
    belowValveM: plan.belowValveM,
    units: voice,
  });

  const band = temperatureBand(plan.targetBandK, voice);
  const planShare = share(plan.extraction.inBandShare).text;
  const coldShare = share(plan.coldStart.inBandShare).text;
  const spec = cupChartSpec({
    units: voice,
    plan: plan.brew.cupCurve,
    cold: plan.coldBrew.cupCurve,
    bandK: plan.targetBandK,
  });

  const expectRows: LabelledValue[] = [
    { label: words.expect.yield, value: waterVolume(plan.yieldM3, voice).text },
    { label: words.expect.inBand(band), value: words.expect.inBandValue(planShare, coldShare) },
    {
      label: words.expect.peakPressure,
      value: e.pot.valveOpeningAssumed
        ? words.expect.peakPressureAssumedValue(
            pressure(plan.peakGaugePa, voice).text,
            pressureRough(plan.valveOpeningGaugePa, voice).text,
          )
        : words.expect.peakPressureValue(
            pressure(plan.peakGaugePa, voice).text,
            pressure(plan.valveOpeningGaugePa, voice).text,
          ),
    },
  ];
  if (Math.abs(plan.altitudeM) >= 0.5) {
    expectRows.push({
      label: words.expect.boiling,
      value: words.expect.boilingValue(
        temperature(plan.boilingK, voice).text,
        altitude(plan.altitudeM, voice).text,
      ),
    });
  }
  const grindAssumed = e.coffee.permeabilityAssumed ? e.coffee.grind : null;
  const stoveAssumed = e.stove.efficiencyAssumed && !e.stove.levels[plan.levelIndex]?.fitted;
  const level = e.stove.levels[plan.levelIndex];
  const measured = [
    ...(e.coffee.permeabilityProvenance
      ? [{ what: 'grind' as const, ...provenanceText(e.coffee.permeabilityProvenance, voice) }]
      : []),
    ...(level?.provenance
      ? [{ what: 'heat' as const, ...provenanceText(level.provenance, voice) }]
      : []),
    ...(plan.spread.finalShare?.measured && e.coffee.tighteningProvenance
      ? [{ what: 'tightening' as const, ...provenanceText(e.coffee.tighteningProvenance, voice) }]
      : []),
  ];
  const shareAssumed = plan.spread.finalShare?.measured === false;
  const notes = [
    ...(plan.bindingCause ? [bindingCauseText(plan, voice)] : []),
    ...(grindAssumed || stoveAssumed || shareAssumed
      ? [words.expect.assumed(grindAssumed, stoveAssumed, shareAssumed)]
      : []),
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
      fillVolume: fillVolume(plan.fillM3, voice),
      fillMass,
      fillMassText: words.water.fillMass(fillMass.text),
      fillHeight,
      belowValve,
      fillLineText: words.water.fillLine(fillHeight.text, belowValve.text),
      crossSectionSvg: drawing.svg,
      crossSectionAlt: voice.words.pdf.crossSectionAlt(
        voice.words.card.crossSection.title(e.pot.name),
        words.water.fillLine(fillHeight.text, belowValve.text),
      ),
      crossSection: drawing.layout,
    },
    coffee: {
      heading: words.coffee.heading,
      doseLabel: words.coffee.dose,
      dose: dose(plan.doseKg, voice),
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
function provenanceText(
  p: Provenance,
  voice: Voice,
): { percent: string; log: string; date: string } {
  const percent = String(Number((p.sigmaRel * 100).toPrecision(2))).replace('.', voice.decimal);
  return {
    percent,
    log: p.log,
    date: /^\d{4}-\d\d-\d\d$/.test(p.date) ? voice.date(p.date) : p.date,
  };
}

function refusal(plan: RefusedPlan, voice: Voice): RefusalBlock {
  const words = voice.words.card.refusal;
  const text = refusalText(plan.refused, voice);
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
  const voice = voiceFor(
    options.language ?? catalogue.site.language,
    options.units ?? catalogue.site.units,
  );
  const paper = options.paper ?? catalogue.site.paper;
  const request = { potId: plan.potId, coffeeId: plan.coffeeId, stoveId: plan.stoveId };
  const paths = stationPaths(
    request,
    catalogue.site.baseUrl,
    pathLanguage(voice.language, catalogue.site.language),
  );
  return {
    kind: 'station',
    lang: voice.lang,
    language: voice.language,
    nav: pageNav(voice),
    id: paths.pageUrl.slice('cards/'.length, -1),
    ...request,
    title: e.coffee.name,
    subtitle: voice.words.card.stationSubtitle(e.pot.name, e.stove.name),
    potName: e.pot.name,
    coffeeName: e.coffee.name,
    stoveName: e.stove.name,
    page: pageSetup(voice.units, paper),
    paths,
    recipe: plan.refused === null ? await recipe(plan, e, catalogue, voice) : null,
    refusal: plan.refused === null ? null : refusal(plan, voice),
    warnings: warnings(
      plan.warnings.map((w) => warningText(w, voice)),
      voice,
    ),
    cautions: cautions(pageSetup(voice.units, paper).compact ? 'compact' : 'full', voice),
    footer: await footer(catalogue, paths.webUrl, options, voice),
    brand: brandView(catalogue.site, voice.words.card.footer.logoAlt),
    planner: plannerLink(e.coffee, catalogue, voice),
  };
}

function insertRow(
  row: InsertCardInput['rows'][number],
  potRowSpan: number,
  catalogue: Catalogue,
  voice: Voice,
): InsertRow {
  const { plan } = row;
  const e = entriesOf(plan, catalogue);
  const kind = heatKindOf[e.stove.stoveKind];
  const words = voice.words.card.insert;
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
      pathLanguage(voice.language, catalogue.site.language),
    ),
  };
  if (plan.refused !== null) {
    return {
      ...base,
      refused: {
        label: words.notSuitable,
        reason: voice.words.card.refusal.short[plan.refused.code],
      },
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
    fill: fillVolume(plan.fillM3, voice),
    dose: dose(plan.doseKg, voice),
    start: isHeated(plan) ? temperature(plan.startK, voice).text : words.roomTemperature,
    level: plan.levelLabel,
    setting: labelNeedsFeel(plan.levelLabel)
      ? words.setting(plan.levelLabel, words.heatFeel[heatFeel(e.stove, plan.levelIndex)])
      : plan.levelLabel,
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
  voice: Voice,
): Warnings | null {
  const byText = new Map<string, string[]>();
  inputs.forEach((input, i) => {
    for (const text of input.plan.warnings.map((w) => warningText(w, voice))) {
      const names = byText.get(text) ?? [];
      names.push(voice.words.card.insert.rowName(rows[i]!.cupsLabel, rows[i]!.heatLabel));
      byText.set(text, names);
    }
  });
  return warnings(
    [...byText.entries()].map(([text, names]) => voice.words.card.insert.rowWarning(names, text)),
    voice,
  );
}

/** The insert card of one coffee: a row per pot size × kind of stove. */
export async function insertCardView(
  input: InsertCardInput,
  catalogue: Catalogue,
  options: CardViewOptions,
): Promise<InsertCardView> {
  const coffee = entry(catalogue.coffees, input.coffeeId, 'coffee');
  const voice = voiceFor(
    options.language ?? catalogue.site.language,
    options.units ?? catalogue.site.units,
  );
  const paper = options.paper ?? catalogue.site.paper;
  const paths = insertPaths(input.slug ?? input.coffeeId, catalogue.site.baseUrl);
  const words = voice.words.card.insert;
  // The table prints the rows with a recipe; a pot's span counts only those.
  const shown = input.rows.filter((row) => row.plan.refused === null);
  const rows = input.rows.map((row) => {
    if (row.plan.refused !== null) return insertRow(row, 0, catalogue, voice);
    const at = shown.indexOf(row);
    const first = at === 0 || shown[at - 1]!.potId !== row.potId;
    let span = 0;
    if (first) while (shown[at + span]?.potId === row.potId) span++;
    return insertRow(row, span, catalogue, voice);
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
          voice,
        );
  const refusedRows = rows.filter((row) => row.refused !== null);
  const planner = plannerLink(coffee, catalogue, voice);
  return {
    kind: 'insert',
    lang: voice.lang,
    language: voice.language,
    nav: pageNav(voice),
    id: input.slug ?? input.coffeeId,
    setId: input.setId,
    coffeeId: input.coffeeId,
    title: coffee.name,
    subtitle: voice.words.card.insertSubtitle(coffee.roast, coffee.grind),
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
    page: pageSetup(voice.units, paper),
    paths,
    warnings: insertWarnings(rows, input.rows, voice),
    cautions: cautions(pageSetup(voice.units, paper).compact ? 'compact' : 'full', voice),
    footer: await footer(
      catalogue,
      planner.webUrl,
      options,
      voice,
      voice.words.card.footer.qrPlanner,
    ),
    brand: brandView(catalogue.site, voice.words.card.footer.logoAlt),
    planner,
  };
}
