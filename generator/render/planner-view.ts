/**
 * The customer's page of a coffee (brew/<coffee>/index.html): a form for their pot, stove
 * and kettle, the answer and the card worked out in the browser (generator/browser/
 * planner.ts, the same engine and card code as the build), and a brew timer that writes a
 * log entry. This module makes the page's view at build time: the form's words and
 * choices, and the entries the script plans with, as JSON embedded in the page (so it
 * needs nothing but its own files, and works offline once loaded).
 *
 * Form controls are named after the keys of the content files they stand for (`cups`,
 * `sealed_volume_ml`, `stove_kind`, `kettle_presets_c`, …); each answer element carries
 * `data-field` (a `stovecard plan --json` field) and `data-value` (its JSON there).
 */
import type {
  Catalogue,
  CoffeeEntry,
  PotEntry,
  SiteEntry,
  StoveEntry,
  UnitSystem,
} from '../content/types.ts';
import { voiceFor } from './voice.ts';
import { fieldKey, OWN_POT_FIELDS, STOVE_KINDS, STOVE_POWERS } from '../content/own-entries.ts';
import {
  cautions,
  pageNav,
  pageSetup,
  type Cautions,
  type PageNav,
  type PageSetup,
} from './card-view.ts';
import { measureDrawingSvg } from './measure-drawing.ts';
import { plannerPaths, type CardPaths } from './paths.ts';
import { temperature } from './format.ts';

/** What the script plans with: the site's entries and settings, SI as the content layer made them. */
export interface PlannerData {
  readonly coffee: CoffeeEntry;
  readonly pots: readonly PotEntry[];
  readonly stoves: readonly StoveEntry[];
  readonly site: Pick<
    SiteEntry,
    'business' | 'language' | 'units' | 'paper' | 'kettlePresetsK' | 'room' | 'brand'
  >;
  readonly language: string;
  readonly builtOn: string;
}

/** The answer's rows, in order: the plan --json fields a script can read off the page. */
export const ANSWER_FIELDS = [
  'startC',
  'fillMl',
  'doseG',
  'level',
  'firstCoffeeS',
  'offHeatS',
  'yieldMl',
  'refused',
] as const;
export type AnswerField = (typeof ANSWER_FIELDS)[number];

export interface FormOption {
  readonly value: string;
  readonly label: string;
}

export interface FormField {
  readonly name: string;
  readonly label: string;
  /** number inputs; material is the one select */
  readonly options: readonly FormOption[] | null;
  readonly required: boolean;
  readonly step: string;
}

export interface PlannerPageView {
  readonly kind: 'planner';
  readonly lang: string;
  /** The page's links at the top, in its language. */
  readonly nav: PageNav;
  readonly language: string;
  readonly id: string;
  readonly coffeeId: string;
  readonly title: string;
  readonly intro: string;
  readonly noScript: string;
  readonly paths: CardPaths;
  readonly page: PageSetup;
  readonly units: UnitSystem;
  readonly pot: {
    readonly legend: string;
    readonly cupsLabel: string;
    readonly options: readonly FormOption[];
    readonly ownLegend: string;
    readonly ownIntro: string;
    readonly drawingSvg: string;
    readonly ownCupsLabel: string;
    readonly fields: readonly FormField[];
  };
  readonly stove: {
    readonly legend: string;
    readonly label: string;
    readonly options: readonly FormOption[];
    readonly ownLegend: string;
    readonly kindLabel: string;
    readonly kinds: readonly FormOption[];
    readonly powerLabel: string;
    readonly powers: readonly FormOption[];
  };
  readonly kettle: {
    readonly legend: string;
    readonly presetsName: string;
    readonly presetsLabel: string;
    readonly presetsValue: string;
    readonly altitudeName: string;
    readonly altitudeLabel: string;
    readonly altitudeValue: string;
  };
  readonly answer: {
    readonly heading: string;
    readonly rows: readonly { readonly field: AnswerField; readonly label: string }[];
    readonly working: string;
    readonly print: string;
    readonly share: string;
  };
  readonly timer: {
    readonly heading: string;
    readonly intro: string;
    readonly buttons: readonly { readonly name: string; readonly label: string }[];
    readonly fields: readonly { readonly name: string; readonly label: string }[];
    readonly levelLabel: string;
    readonly output: string;
    readonly copy: string;
    readonly download: string;
  };
  readonly cautions: Cautions;
  /** PlannerData as JSON, `<` escaped, for a `<script type="application/json">`. */
  readonly dataJson: string;
}

/** JSON that cannot end its <script> element early. */
function scriptJson(value: unknown): string {
  return JSON.stringify(value).replace(/</g, '\\u003c');
}

/** The site's pots by size, smallest first; one per size (the first in the content's order). */
function potsBySize(pots: readonly PotEntry[]): PotEntry[] {
  const bySize = new Map<number, PotEntry>();
  for (const pot of pots) if (!bySize.has(pot.cups)) bySize.set(pot.cups, pot);
  return [...bySize.values()].sort((a, b) => a.cups - b.cups);
}

/** The page of one coffee in one language. `slug` names its folder (paths.ts plannerSlug). */
export function plannerPageView(
  coffeeId: string,
  slug: string,
  language: string,
  catalogue: Catalogue,
  builtOn: string,
): PlannerPageView {
  const coffee = catalogue.coffees.get(coffeeId)!;
  const site = catalogue.site;
  const units = site.units;
  const voice = voiceFor(language, units);
  const words = voice.words.planner;
  const pots = [...catalogue.pots.values()];
  const stoves = [...catalogue.stoves.values()];
  const data: PlannerData = {
    coffee,
    pots,
    stoves,
    site: {
      business: site.business,
      language: site.language,
      units,
      paper: site.paper,
      kettlePresetsK: site.kettlePresetsK,
      room: site.room,
      ...(site.brand ? { brand: site.brand } : {}),
    },
    language,
    builtOn,
  };
  const fieldLabels = words.pot.fields as Record<string, string>;
  const fields: FormField[] = Object.values(OWN_POT_FIELDS)
    .flat()
    .map((field) => {
      const name = fieldKey(field, units);
      return {
        name,
        label: fieldLabels[name]!,
        options:
          field === 'material'
            ? Object.entries(words.pot.materials).map(([value, label]) => ({ value, label }))
            : null,
        required: true,
        step: name.endsWith('_in') ? '0.01' : '1',
      };
    });
  const presetUnit = units === 'us' ? 'f' : 'c';
  const presets = site.kettlePresetsK.map((k) => temperature(k, units).value).join(', ');
  const altitude =
    units === 'us' ? Math.round(site.room.altitudeM / 0.3048) : Math.round(site.room.altitudeM);
  return {
    kind: 'planner',
    lang: voice.lang,
    nav: pageNav(voice),
    language,
    id: slug,
    coffeeId,
    title: words.pageTitle(coffee.name),
    intro: words.intro,
    noScript: words.noScript,
    paths: plannerPaths(slug, site.baseUrl),
    page: pageSetup(units, site.paper),
    units,
    pot: {
      legend: words.pot.legend,
      cupsLabel: words.pot.cups,
      options: [
        ...potsBySize(pots).map((pot) => ({
          value: String(pot.cups),
          label: words.pot.cupsOption(pot.cups, pot.name),
        })),
        { value: 'own', label: words.pot.own },
      ],
      ownLegend: words.pot.own,
      ownIntro: words.pot.ownIntro,
      drawingSvg: measureDrawingSvg(words.pot.drawingAlt),
      ownCupsLabel: words.pot.ownCups,
      fields,
    },
    stove: {
      legend: words.stove.legend,
      label: words.stove.stove,
      options: [
        ...stoves.map((stove) => ({ value: stove.id, label: stove.name })),
        { value: 'own', label: words.stove.own },
      ],
      ownLegend: words.stove.own,
      kindLabel: words.stove.kind,
      kinds: STOVE_KINDS.map((kind) => ({ value: kind, label: words.stove.kinds[kind] })),
      powerLabel: words.stove.power,
      powers: STOVE_POWERS.map((power) => ({ value: power, label: words.stove.powers[power] })),
    },
    kettle: {
      legend: words.kettle.legend,
      presetsName: `kettle_presets_${presetUnit}`,
      presetsLabel: words.kettle.presets(units),
      presetsValue: presets,
      altitudeName: units === 'us' ? 'altitude_ft' : 'altitude_m',
      altitudeLabel: words.kettle.altitude(units),
      altitudeValue: String(altitude),
    },
    answer: {
      heading: words.answer.heading,
      rows: ANSWER_FIELDS.map((field) => ({ field, label: words.answer[field] })),
      working: words.answer.working,
      print: words.answer.print,
      share: words.answer.share,
    },
    timer: {
      heading: words.timer.heading,
      intro: words.timer.intro,
      buttons: [
        { name: 'heat_on', label: words.timer.heatOn },
        { name: 'first_coffee', label: words.timer.firstCoffee },
        { name: 'sputter', label: words.timer.sputter },
        { name: 'off_heat', label: words.timer.offHeat },
        { name: 'reset', label: words.timer.reset },
      ],
      fields: [
        { name: units === 'us' ? 'fill_floz' : 'fill_ml', label: words.timer.fill(units) },
        { name: `start_${presetUnit}`, label: words.timer.start(units) },
        { name: `room_${presetUnit}`, label: words.timer.room(units) },
        { name: 'cup_g', label: words.timer.cup },
      ],
      levelLabel: words.timer.level,
      output: words.timer.output,
      copy: words.timer.copy,
      download: words.timer.download,
    },
    cautions: cautions('full', voice),
    dataJson: scriptJson(data),
  };
}
