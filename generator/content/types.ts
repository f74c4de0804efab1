/**
 * Entries as the rest of the generator sees them after loading and validation: the names
 * and labels a person wrote, plus the SI models the physics takes. Trade units stay in YAML.
 */
import type { Provenance } from './provenance.ts';
import type { Brand } from './brand.ts';
import type { BedModel, PotModel } from '../brew/types.ts';

/** Where a value came from, for error messages and card footers. */
export interface SourceRef {
  /** Path relative to the content folder, e.g. "pots/three-cup.yaml". */
  readonly file: string;
  readonly line: number;
  readonly column: number;
}

export interface EntryBase {
  /** File stem, unique per kind: "three-cup" for pots/three-cup.yaml. */
  readonly id: string;
  readonly name: string;
  readonly source: SourceRef;
  /** sha256 of the file's bytes, hex, for fingerprints and the build cache. */
  readonly hash: string;
}

export interface PotEntry extends EntryBase {
  readonly kind: 'pot';
  readonly cups: number;
  readonly model: PotModel;
  /** True when valve_opening_bar was not given and the default was assumed. */
  readonly valveOpeningAssumed: boolean;
  /** The base can be used on induction (magnetic steel, or a plate the entry declares). */
  readonly inductionReady: boolean;
}

export type GrindClass = 'fine' | 'medium-fine' | 'medium' | 'medium-coarse' | 'coarse';

export interface CoffeeEntry extends EntryBase {
  readonly kind: 'coffee';
  readonly roast: string;
  readonly grind: GrindClass;
  readonly notes?: string;
  readonly bed: BedModel;
  /** True when permeability_m2 was not given and the grind-class default was used. */
  readonly permeabilityAssumed: boolean;
  /** Which log measured permeability_m2, when, and its σ (provenance.ts). */
  readonly permeabilityProvenance?: Provenance;
  /** Which log measured bed.tightening.final_share, when, and its σ (provenance.ts). */
  readonly tighteningProvenance?: Provenance;
  /**
   * Delivery phase (first coffee to off-heat) a three-cup pot's plan must fit in, s; null
   * when the file gives none. Smaller pots scale it (planning/delivery.ts).
   */
  readonly deliveryWindowS: readonly [number, number] | null;
}

export type StoveKind = 'gas' | 'electric-coil' | 'radiant' | 'induction';

export interface StoveLevel {
  readonly label: string;
  /** Nameplate input power of the level, W. */
  readonly powerW: number;
  /** Heat reaching the pot, W: a fitted value when the entry has one, else power × efficiency. */
  readonly heatToPotW: number;
  readonly fitted: boolean;
  /** Which log measured heatToPotW, when, and its σ (the note `fit --write` leaves; provenance.ts). */
  readonly provenance?: Provenance;
}

export interface StoveEntry extends EntryBase {
  readonly kind: 'stove';
  readonly stoveKind: StoveKind;
  /** Share of input reaching the pot, 0–1. */
  readonly efficiency: number;
  readonly efficiencyAssumed: boolean;
  /** Ordered as written, which must be gentlest first. */
  readonly levels: readonly StoveLevel[];
}

/** One brew a person timed, as written in a brew log (SI). */
export interface LoggedBrew {
  readonly source: SourceRef;
  readonly level: string;
  readonly fillVolumeM3: number;
  readonly startK: number;
  readonly ambientK: number;
  readonly firstCoffeeS?: number;
  readonly sputterS?: number;
  readonly heatOffS?: number;
  readonly yieldM3?: number;
  /** Scale readings: (time, cup mass). */
  readonly cupMass?: readonly {
    readonly tS: number;
    readonly kg: number;
    readonly source: SourceRef;
  }[];
  /** Probe readings of the water in the base: (time, temperature). */
  readonly waterTemperature?: readonly {
    readonly tS: number;
    readonly k: number;
    readonly source: SourceRef;
  }[];
}

export interface LogEntry extends EntryBase {
  readonly kind: 'log';
  readonly potId: string;
  readonly coffeeId: string;
  readonly stoveId: string;
  readonly altitudeM: number;
  readonly brews: readonly LoggedBrew[];
}

export type UnitSystem = 'metric' | 'us';
export type PaperSize = 'A4' | 'A5' | 'A6' | 'letter' | 'half-letter' | '4x6in';

/** Cards to a sheet (a set's `sheet: { up: … }`): 2, 4 or 8. */
export type SheetUp = 2 | 4 | 8;

/** A set's `sheet:`: its cards imposed several to a sheet for a desktop printer. */
export interface SheetSpec {
  readonly paper: PaperSize;
  readonly up: SheetUp;
  /** Where `sheet:` is written (site.yaml), for the build's message when a card does not fit its cell. */
  readonly source: SourceRef;
  /** The key as the content errors name it: `sets[2].sheet`. */
  readonly field: string;
}

export interface CardRequest {
  readonly potId: string;
  readonly coffeeId: string;
  readonly stoveId: string;
}

export interface CardSet {
  readonly id: string;
  readonly title: string;
  readonly layout: 'station' | 'insert';
  /** `layout: binder`: a station set whose PDF opens with the training front matter. */
  readonly binder: boolean;
  /** Paper of the set's PDF: the set's `paper:`, else the site's. */
  readonly paper: PaperSize;
  /** The set's `sheet:` (its cards several to a sheet, `sets/<id>-sheet.pdf`), null without one. */
  readonly sheet: SheetSpec | null;
  /**
   * Language code of the set's cards, pages and PDFs (`language:` of the set, else of the
   * site, else en); one of the schema's enum, which matches generator/words/ catalogues.
   */
  readonly language: string;
  readonly cards: readonly CardRequest[];
  /**
   * Station sets: the cards of `cards` that came from `every_coffee_with_every_pot` and are
   * left out of the set when their plan is refused (empty with `include_refused: true`).
   */
  readonly leaveOutIfRefused: readonly CardRequest[];
  /** For insert sets: the coffees, one insert each. */
  readonly coffeeIds: readonly string[];
  readonly source: SourceRef;
}

export interface SiteEntry {
  readonly kind: 'site';
  readonly source: SourceRef;
  readonly hash: string;
  readonly business: { readonly name: string; readonly contact: string };
  /** Language code of the site's own pages (index, method, troubleshooting) and the sets' default. */
  readonly language: string;
  readonly units: UnitSystem;
  readonly paper: PaperSize;
  /** Kettle presets, K, ascending. */
  readonly kettlePresetsK: readonly number[];
  readonly room: { readonly ambientK: number; readonly altitudeM: number };
  /** Address the site will be published at, for QR codes; undefined when not given. */
  readonly baseUrl?: string;
  /** The roaster's logo and colour (site.yaml `brand:`, brand.ts); absent when not given. */
  readonly brand?: Brand;
  readonly sets: readonly CardSet[];
}

export interface Catalogue {
  readonly contentDir: string;
  readonly site: SiteEntry;
  readonly pots: ReadonlyMap<string, PotEntry>;
  readonly coffees: ReadonlyMap<string, CoffeeEntry>;
  readonly stoves: ReadonlyMap<string, StoveEntry>;
  readonly logs: ReadonlyMap<string, LogEntry>;
  /** Files passed over: editor lock and backup files, dotfiles (relative paths; catalogue.ts). */
  readonly skipped?: readonly string[];
}
