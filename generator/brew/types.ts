/**
 * The brew simulation's inputs and outputs. Everything here is SI (K, Pa, m, m³, kg, s, W);
 * trade units (°C, mL, g, bar, mm) appear only in generator/content and generator/render.
 * The model these quantities feed is generator/brew/simulate.ts (DEVELOPERS.md, "The brew model").
 */

import type { BedTightening } from './bed.ts';

export type BaseMaterial = 'aluminium' | 'stainless-steel';

/** A stovetop pot's geometry and build, SI. */
export interface PotModel {
  /** Sealed volume of the base with the funnel seated (funnel displacement subtracted), m³. */
  readonly sealedVolumeM3: number;
  /** Inner diameter of the base (vertical walls assumed), m. */
  readonly baseInnerDiameterM: number;
  /** Height of the safety valve's lowest edge above the floor of the base, m. */
  readonly valveHeightM: number;
  /** Gauge pressure at which the safety valve opens, Pa. */
  readonly valveOpeningGaugePa: number;
  readonly baseMaterial: BaseMaterial;
  readonly baseMassKg: number;
  /** Funnel basket: inner diameter and depth (bed height when filled level), m. */
  readonly basketDiameterM: number;
  readonly basketDepthM: number;
  /** Funnel tube: inner diameter, and the gap between its lower end and the floor, m. */
  readonly tubeInnerDiameterM: number;
  readonly tubeGapM: number;
  /** Height of the spout outlet in the upper chamber above the floor of the base, m. */
  readonly spoutHeightM: number;
  /** Capacity of the upper chamber, m³. */
  readonly upperCapacityM3: number;
  /** Heat-loss coefficient U·A of the base to room air, W/K (fitted or default). */
  readonly heatLossWPerK: number;
}

/** A coffee bed as brewed (level basket, not tamped), SI. */
export interface BedModel {
  /** Darcy permeability of the wet bed, m². */
  readonly permeabilityM2: number;
  /** Bulk density of the ground coffee in a level, untamped basket, kg/m³. */
  readonly bulkDensityKgM3: number;
  /** Water held back by the spent grounds per kg of dry coffee, kg/kg. */
  readonly retentionKgPerKg: number;
  /** Target extraction band [low, high], K. */
  readonly targetBandK: readonly [number, number];
  /**
   * Optional: the permeability falls as water passes (bed.ts). Absent = the classic model
   * of constant permeability, computed exactly as before.
   */
  readonly tightening?: BedTightening;
}

/** The room the pot is brewed in. */
export interface RoomModel {
  readonly ambientK: number;
  readonly ambientPa: number;
}

/** One brew to simulate. */
export interface BrewSetup {
  readonly pot: PotModel;
  readonly bed: BedModel;
  readonly room: RoomModel;
  /** Heat reaching the pot while the heat is on (stove power × efficiency), W. */
  readonly heatInputW: number;
  /** Water poured into the base, measured at the start temperature, m³. */
  readonly fillVolumeM3: number;
  /** Water temperature when the pot is sealed, K. */
  readonly startK: number;
  /** Time at which the heat is taken away, s; undefined = left on until the sputter. */
  readonly heatOffAtS?: number;
  /** Give up after this long, s (default 1800). */
  readonly timeLimitS?: number;
  /** Collect the time series (costs time; the planner turns it off). Default true. */
  readonly collectSeries?: boolean;
  /**
   * Relative tolerance of the integration (default 1e-6, the accuracy every check of the
   * model is made at). The planner searches at a looser one and re-runs its choice at 1e-6.
   */
  readonly relativeTolerance?: number;
}

export type BrewEventKind =
  | 'flow-start'
  | 'first-coffee'
  | 'heat-off'
  | 'flow-stop'
  | 'sputter'
  | 'valve-opens'
  | 'time-limit';

export interface BrewEvent {
  readonly kind: BrewEventKind;
  readonly tS: number;
  /** Water temperature in the base at the event, K. */
  readonly waterK: number;
  readonly gaugePa: number;
  readonly cupM3: number;
}

export interface SeriesPoint {
  readonly tS: number;
  readonly waterK: number;
  /** Temperature of the coffee leaving the bed (cooler than the water while the grounds warm), K. */
  readonly coffeeK: number;
  /** The same coffee as it leaves the spout at room pressure: at most the local boiling point, K. */
  readonly spoutK: number;
  readonly gaugePa: number;
  readonly cupM3: number;
  readonly flowM3PerS: number;
  /** Liquid left in the base, m³. */
  readonly baseLiquidM3: number;
}

/**
 * Volume-weighted distribution of the extraction temperature over the cup. The extraction
 * temperature of a millilitre is the temperature of the water as it reaches the grounds
 * (the water in the base when it is displaced): the SCA's brewing-temperature range is
 * defined at the point of contact with the coffee.
 */
export interface ExtractionSummary {
  readonly meanK: number;
  readonly p10K: number;
  readonly p50K: number;
  readonly p90K: number;
  /** Share of the cup volume extracted inside the target band, 0–1. */
  readonly inBandShare: number;
  /** Share of the cup volume extracted below the band, 0–1. */
  readonly belowBandShare: number;
}

export interface BrewResult {
  readonly events: readonly BrewEvent[];
  readonly flowStartS: number | null;
  readonly firstCoffeeS: number | null;
  /** Temperature of the first coffee leaving the bed (the grounds start at room temperature), K. */
  readonly firstCoffeeK: number | null;
  readonly heatOffS: number | null;
  readonly sputterS: number | null;
  readonly endS: number;
  readonly endReason: 'sputter' | 'flow-stopped' | 'valve-opens' | 'time-limit';
  readonly yieldM3: number;
  readonly leftInBaseM3: number;
  /** Water held in the tube, grounds and upper column, m³. */
  readonly retainedM3: number;
  readonly doseKg: number;
  /** Null when no coffee reached the cup. */
  readonly extraction: ExtractionSummary | null;
  /**
   * Coffee reaching the spout hotter than the local boiling point flashes there: the
   * boiling point, the steam flashed (an upper bound, kg) and the cup volume concerned.
   */
  readonly flash: {
    readonly boilingK: number;
    readonly flashedKg: number;
    readonly aboveBoilingM3: number;
  };
  /** Cumulative cup volume against extraction temperature, for charts: ascending cupM3. */
  readonly cupCurve: readonly { readonly cupM3: number; readonly extractionK: number }[];
  readonly peakGaugePa: number;
  readonly valveOpens: boolean;
  readonly series: readonly SeriesPoint[];
  /** Bookkeeping for the invariant checks. */
  readonly balance: {
    readonly initialWaterKg: number;
    readonly finalBaseLiquidKg: number;
    readonly finalVapourKg: number;
    readonly initialVapourKg: number;
    readonly heldUpKg: number;
    readonly cupKg: number;
    readonly heatInJ: number;
    readonly heatLostJ: number;
    readonly storedEnergyChangeJ: number;
    readonly enthalpyOutJ: number;
  };
  readonly stats: { readonly steps: number; readonly rhsEvaluations: number };
}
