/**
 * The data of the site's other pages (index, set pages, method, troubleshooting) and the
 * one global object the templates read (`stovecard`), built from the card views. Like
 * card-view.ts, every string is final: templates only place them.
 */
import type { Catalogue, PaperSize, SheetSpec, SourceRef } from '../content/types.ts';
import type { AcceptedPlan, RefusalCode } from '../planning/types.ts';
import type { MoveCode } from '../planning/sensitivity.ts';
import type { Messages } from '../words/catalogue.ts';
import type { Cautions, InsertCardView, PageSetup, StationCardView } from './card-view.ts';
import { cautions as cautionsView, pageNav, pageSetup, type PageNav } from './card-view.ts';
import type { PlannerPageView } from './planner-view.ts';
import { FONT_FACES, FONT_FAMILY, fontFileName, type FontFace } from './fonts.ts';
import { clock, share, temperature, temperatureBand, TIME_STEP_S } from './format.ts';
import { setPaths, sheetPdfFile, type CardPaths } from './paths.ts';
import { sheetGeometry, type SheetGeometry } from './sheet.ts';
import { voiceFor, type Voice } from './voice.ts';
import { brandView, type BrandView } from './brand.ts';
import { exercisesView, type ExercisesView } from './exercises.ts';

export type { PageNav } from './card-view.ts';

export interface SiteInfo {
  readonly title: string;
  /** Document language tag of the site's own pages (index, method, troubleshooting). */
  readonly lang: string;
  readonly businessName: string;
  readonly contact: string;
  readonly page: PageSetup;
  readonly builtOn: string;
  readonly baseUrl: string | null;
  readonly fontFamily: string;
  /** The roaster's logo and colour (brand.ts), null without one. */
  readonly brand: BrandView | null;
  /** @font-face sources, site-relative. */
  readonly fonts: readonly {
    readonly file: string;
    readonly weight: string;
    readonly style: string;
  }[];
}

/** One line of a set's list: a card and its links. */
export interface CardLink {
  readonly kind: 'station' | 'insert';
  readonly title: string;
  readonly potName: string;
  readonly coffeeName: string;
  readonly stoveName: string;
  /** Site-relative page and PDF. */
  readonly pageUrl: string;
  readonly pdfFile: string;
  /** "no recipe" for a refused station card, a row count for an insert; else ''. */
  readonly status: string;
  readonly refused: boolean;
}

export interface SetView {
  readonly id: string;
  readonly title: string;
  readonly layout: 'station' | 'insert';
  /** A training binder (`layout: binder`): its PDF opens with the front matter. */
  readonly binder: boolean;
  /** Paper of the set's PDF (its cards and text pages): the set's, else the site's. */
  readonly page: PageSetup;
  /** Language code of the set (its cards, page and PDF) and its document language tag. */
  readonly language: string;
  readonly lang: string;
  /** The set page's links, table headings and cautions, in the set's language. */
  readonly nav: PageNav;
  readonly columns: IndexView['columns'];
  readonly cautions: Cautions;
  /** "Station cards" or "Bag inserts". */
  readonly layoutLabel: string;
  readonly paths: CardPaths;
  readonly cards: readonly CardLink[];
  /** How many cards were left out for getting no recipe, and why; null when none. */
  readonly leftOut: string | null;
  /** The set page's line before the link to the set's PDF. */
  readonly pdfLine: string;
  /**
   * A training binder's exercises on its own cards (render/exercises.ts), on its set page
   * and in its PDF; null for any other set.
   */
  readonly exercises: ExercisesView | null;
  /** The set's cards several to a sheet (`sheet:`), null without. */
  readonly sheet: SheetView | null;
}

/** A set's sheets: where the cells are, the PDF's name and title, the set page's line. */
export interface SheetView {
  readonly geometry: SheetGeometry;
  /** `sets/<id>-sheet.pdf` (paths.ts sheetPdfFile). */
  readonly pdfFile: string;
  /** The sheet PDF's document title. */
  readonly title: string;
  /** The set page's line before the link ("For a desktop printer: 4 cards to each A4 sheet…"). */
  readonly label: string;
  /** The link's text. */
  readonly linkText: string;
  /** Where `sheet:` is written, for the build's message when a card does not fit its cell. */
  readonly source: SourceRef;
  readonly field: string;
}

function sheetView(set: SetOutline, voice: Voice): SheetView | null {
  if (!set.sheet) return null;
  const { paper, up } = set.sheet;
  const paperName = voice.words.print.paperNames[paper];
  return {
    geometry: sheetGeometry(paper, up),
    pdfFile: sheetPdfFile(set.id),
    title: voice.words.pdf.sheetTitle(set.title, up, paperName),
    label: voice.words.print.sheetLink(up, paperName),
    linkText: voice.words.print.sheetPdf,
    source: set.sheet.source,
    field: set.sheet.field,
  };
}

export interface IndexView {
  readonly title: string;
  readonly intro: string;
  readonly setsHeading: string;
  readonly moreHeading: string;
  readonly links: readonly { readonly label: string; readonly url: string }[];
  readonly columns: {
    readonly pot: string;
    readonly coffee: string;
    readonly stove: string;
    readonly page: string;
    readonly pdf: string;
    readonly open: string;
    readonly download: string;
  };
}

export interface MethodView {
  readonly title: string;
  readonly sections: readonly {
    readonly heading: string;
    readonly paragraphs: readonly string[];
  }[];
  readonly exampleHeading: string;
  /** A worked comparison from one of the site's own cards; null when no card has a recipe. */
  readonly example: string | null;
}

/** One input changed on one card's recipe, and what the model says it does. */
export interface MoveRow {
  /** Which input was changed (planning/sensitivity.ts). */
  readonly code: MoveCode;
  readonly change: string;
  readonly firstCoffee: string;
  readonly meanTemperature: string;
  readonly inBand: string;
  readonly peak: string;
}

export interface MovesView {
  /** The card the table was computed for: its entries' ids and names. */
  readonly card: {
    readonly potId: string;
    readonly coffeeId: string;
    readonly stoveId: string;
    readonly pot: string;
    readonly coffee: string;
    readonly stove: string;
  };
  readonly heading: string;
  readonly intro: string;
  readonly columns: Messages['troubleshooting']['movesColumns'];
  readonly rows: readonly MoveRow[];
}

export interface TroubleshootingView {
  readonly title: string;
  readonly intro: string;
  readonly columns: Messages['troubleshooting']['columns'];
  readonly rows: Messages['troubleshooting']['rows'];
  readonly moves: MovesView | null;
}

export interface SiteData {
  readonly site: SiteInfo;
  readonly nav: PageNav;
  readonly index: IndexView;
  readonly sets: readonly SetView[];
  readonly stationCards: readonly StationCardView[];
  readonly insertCards: readonly InsertCardView[];
  readonly method: MethodView;
  readonly troubleshooting: TroubleshootingView;
  /** The full cautions and the deferral, on the index, set, method and troubleshooting pages. */
  readonly cautions: Cautions;
  /**
   * A training binder's front matter in each language a set speaks (SetView.language):
   * the method and troubleshooting pages of that language. The site's own pages are
   * `method` and `troubleshooting` above, in the site's language.
   */
  readonly frontMatter?: Readonly<
    Record<string, { readonly method: MethodView; readonly troubleshooting: TroubleshootingView }>
  >;
  /** The customer's page of each coffee a card links (render/planner-view.ts). */
  readonly plannerPages: readonly PlannerPageView[];
}

/** What the build knows about a set: its id, title, layout and card slugs in order. */
export interface SetOutline {
  readonly id: string;
  readonly title: string;
  readonly layout: 'station' | 'insert';
  readonly binder?: boolean;
  /** Paper of the set's PDF; default the site's. */
  readonly paper?: PaperSize;
  /** The set's `sheet:` (content CardSet.sheet); absent or null without. */
  readonly sheet?: SheetSpec | null;
  /** Language code of the set (content CardSet.language). */
  readonly language: string;
  readonly cardSlugs: readonly string[];
  /** Refusal codes of the cards left out of the set (pipeline/leave-out.ts), one each. */
  readonly leftOut?: readonly RefusalCode[];
}

const FACE_CSS: Record<FontFace, { weight: string; style: string }> = {
  regular: { weight: 'normal', style: 'normal' },
  bold: { weight: 'bold', style: 'normal' },
  oblique: { weight: 'normal', style: 'italic' },
  'bold-oblique': { weight: 'bold', style: 'italic' },
};

/** Where the build copies the fonts, site-relative. */
export const FONTS_DIR = 'assets/fonts';

/** The site's voice: its own pages speak the site's language in its units. */
export function siteVoice(catalogue: Catalogue): Voice {
  return voiceFor(catalogue.site.language, catalogue.site.units);
}

/** The links at the top of a page and its print hint, in the voice's language (default English). */
export function siteNav(voice: Voice = voiceFor()): PageNav {
  return pageNav(voice);
}

export function siteInfo(catalogue: Catalogue, builtOn: string): SiteInfo {
  const site = catalogue.site;
  const voice = siteVoice(catalogue);
  return {
    title: voice.words.card.siteTitle,
    lang: voice.lang,
    businessName: site.business.name,
    contact: site.business.contact,
    page: pageSetup(site.units, site.paper),
    builtOn,
    baseUrl: site.baseUrl ?? null,
    fontFamily: FONT_FAMILY,
    brand: brandView(site, voice.words.card.footer.logoAlt),
    fonts: FONT_FACES.map((face) => ({
      file: `${FONTS_DIR}/${fontFileName(face)}`,
      ...FACE_CSS[face],
    })),
  };
}

function stationLink(card: StationCardView, voice: Voice): CardLink {
  return {
    kind: 'station',
    title: card.title,
    potName: card.potName,
    coffeeName: card.coffeeName,
    stoveName: card.stoveName,
    pageUrl: card.paths.pageUrl,
    pdfFile: card.paths.pdfFile,
    status: card.refusal ? voice.words.card.index.refused : '',
    refused: card.refusal !== null,
  };
}

function insertLink(card: InsertCardView): CardLink {
  return {
    kind: 'insert',
    title: card.title,
    potName: '',
    coffeeName: card.title,
    stoveName: '',
    pageUrl: card.paths.pageUrl,
    pdfFile: card.paths.pdfFile,
    status: '',
    refused: false,
  };
}

export function setViews(
  outlines: readonly SetOutline[],
  stations: ReadonlyMap<string, StationCardView>,
  inserts: ReadonlyMap<string, InsertCardView>,
  baseUrl: string | undefined,
  /** The site's page: its units, and the paper of a set that names none. */
  sitePage: PageSetup,
  /** The troubleshooting table a binder in this language prints (its exercises quote it). */
  movesFor: (language: string) => MovesView | null = () => null,
): SetView[] {
  return outlines.map((set) => {
    const voice = voiceFor(set.language, sitePage.units);
    const words = voice.words.card.index;
    const stationCard = (slug: string) => {
      const card = stations.get(slug);
      if (!card) throw new Error(`site view: no station card "${slug}"`);
      return card;
    };
    return {
      id: set.id,
      title: set.title,
      layout: set.layout,
      binder: set.binder === true,
      page: pageSetup(sitePage.units, set.paper ?? sitePage.paper),
      language: set.language,
      lang: voice.lang,
      nav: siteNav(voice),
      columns: indexColumns(voice),
      cautions: cautionsView('full', voice),
      layoutLabel: set.binder
        ? voice.words.print.binderLabel
        : set.layout === 'station'
          ? words.station
          : words.insert,
      paths: setPaths(set.id, baseUrl),
      cards: set.cardSlugs.map((slug) => {
        if (set.layout === 'station') return stationLink(stationCard(slug), voice);
        const card = inserts.get(slug);
        if (!card) throw new Error(`site view: no insert card "${slug}"`);
        return insertLink(card);
      }),
      leftOut: voice.words.print.leftOut(set.leftOut ?? []),
      pdfLine: voice.words.print.setPdf(set.binder === true),
      exercises: set.binder
        ? exercisesView(set.cardSlugs.map(stationCard), movesFor(set.language), voice)
        : null,
      sheet: sheetView(set, voice),
    };
  });
}

function indexColumns(voice: Voice): IndexView['columns'] {
  const words = voice.words.card.index;
  return {
    pot: words.pot,
    coffee: words.coffee,
    stove: words.stove,
    page: words.page,
    pdf: words.pdf,
    open: words.open,
    download: words.download,
  };
}

export function indexView(catalogue: Catalogue): IndexView {
  const voice = siteVoice(catalogue);
  const words = voice.words.card.index;
  return {
    title: words.title,
    intro: words.intro(catalogue.site.business.name),
    setsHeading: words.sets,
    moreHeading: words.more,
    links: [
      { label: words.method, url: 'method/' },
      { label: words.troubleshooting, url: 'troubleshooting/' },
    ],
    columns: indexColumns(voice),
  };
}

const aboutClock = (s: number): string => clock(Math.round(s / TIME_STEP_S) * TIME_STEP_S);

/** The method page, with a worked example from the first card that has a cold-start comparison. */
export function methodView(
  example: { plan: AcceptedPlan; potName: string; coffeeName: string; stoveName: string } | null,
  catalogue: Catalogue,
  voice: Voice = siteVoice(catalogue),
): MethodView {
  const methodWords = voice.words.method;
  const units = voice;
  let text: string | null = null;
  if (example && example.plan.coldStart.firstCoffeeS !== null) {
    const p = example.plan;
    text = methodWords.example({
      coffee: example.coffeeName,
      pot: example.potName,
      stove: example.stoveName,
      start: temperature(p.startK, units).text,
      planFirst: aboutClock(p.firstCoffeeS.midS),
      planShare: share(p.extraction.inBandShare, units).text,
      coldFirst: aboutClock(p.coldStart.firstCoffeeS!),
      coldShare: share(p.coldStart.inBandShare, units).text,
      band: temperatureBand(p.targetBandK, units),
    });
  }
  return {
    title: methodWords.title,
    sections: methodWords.sections,
    exampleHeading: methodWords.exampleHeading,
    example: text,
  };
}

export function troubleshootingView(
  moves: MovesView | null,
  voice: Voice = voiceFor(),
): TroubleshootingView {
  const troubleshootingWords = voice.words.troubleshooting;
  return {
    title: troubleshootingWords.title,
    intro: troubleshootingWords.intro,
    columns: troubleshootingWords.columns,
    rows: troubleshootingWords.rows,
    moves,
  };
}
