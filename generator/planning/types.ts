/**
 * What a card recommends for one pot × coffee × stove in one room: the planner's output,
 * SI throughout. Renderers format it; they never compute physics.
 */
import type { BrewResult } from '../brew/types.ts';

/** A timing with its spread from the model's sensitivity (permeability ±30 %, heat ±10 %). */
export interface TimeRange {
  readonly lowS: number;
  readonly midS: number;
  readonly highS: number;
}

export type RefusalCode =
  | 'fill-above-valve'
  | 'pressure-near-valve'
  | 'induction-needs-magnetic-base'
  | 'no-delivery'
  | 'no-plan-fits';

export interface Refusal {
  readonly code: RefusalCode;
  /** Why no recipe is printed, in words a barista reads. */
  readonly reason: string;
  /** The nearest change that would fix it. */
  readonly suggestion: string;
}

export interface PlanContext {
  readonly potId: string;
  readonly coffeeId: string;
  readonly stoveId: string;
  readonly ambientK: number;
  readonly ambientPa: number;
  readonly altitudeM: number;
  /** Boiling point of water at the ambient pressure, K (IF97 Region 4). */
  readonly boilingK: number;
  readonly valveOpeningGaugePa: number;
  /** Model-range warnings (inputs outside what the model was checked for). */
  readonly warnings: readonly string[];
}

export interface RefusedPlan extends PlanContext {
  readonly refused: Refusal;
}

export interface StartComparison {
  readonly meanK: number;
  readonly inBandShare: number;
  readonly firstCoffeeS: number | null;
}

export interface AcceptedPlan extends PlanContext {
  readonly refused: null;
  readonly fillM3: number;
  readonly fillKg: number;
  /** Height of the fill line above the floor of the base, m. */
  readonly fillHeightM: number;
  /** Distance from the fill line down from the valve's lowest edge, m. */
  readonly belowValveM: number;
  /** Margin kept below the valve after the water has warmed and expanded, m. */
  readonly expansionMarginM: number;
  /** Dose for a level basket, never tamped, kg. */
  readonly doseKg: number;
  readonly startK: number;
  /** The kettle preset to use, K; null when the start is room temperature or no preset matches. */
  readonly kettlePresetK: number | null;
  readonly levelIndex: number;
  readonly levelLabel: string;
  readonly heatToPotW: number;
  readonly firstCoffeeS: TimeRange;
  readonly offHeatS: TimeRange;
  readonly yieldM3: number;
  readonly extraction: {
    readonly meanK: number;
    readonly p10K: number;
    readonly p50K: number;
    readonly p90K: number;
    readonly inBandShare: number;
  };
  readonly targetBandK: readonly [number, number];
  readonly coldStart: StartComparison;
  readonly peakGaugePa: number;
  /** The chosen brew re-simulated (the charts draw its cup curve). */
  readonly brew: PlannedBrew;
  /** The same pot, coffee and level started with room-temperature water. */
  readonly coldBrew: PlannedBrew;
  /** Simulations the search ran, for the benchmark. */
  readonly simulations: number;
}

export type CardPlan = AcceptedPlan | RefusedPlan;

/**
 * A run as a plan keeps it: without the 1 s time series, which nothing drawn from a plan
 * reads and which was nine tenths of a plan's cached text (~200 kB a card).
 */
export type PlannedBrew = Omit<BrewResult, 'series'>;
