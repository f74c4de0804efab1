/**
 * What a card recommends for one pot × coffee × stove in one room: the planner's output,
 * SI throughout. Renderers format it; they never compute physics.
 */
import type { BrewResult } from '../brew/types.ts';
import type { GrindClass } from '../content/types.ts';

/** A timing with its spread from the model's sensitivity (permeability ±30 %, heat ±10 %). */
export interface TimeRange {
  readonly lowS: number;
  readonly midS: number;
  readonly highS: number;
}

/**
 * Why no recipe is printed, as a code and SI facts. The words a barista reads are made at
 * the edges (generator/render/plan-text.ts with generator/words/), so a cached plan holds
 * no language and no unit system.
 */
export type Refusal =
  | { readonly code: 'induction-needs-magnetic-base'; readonly facts: { readonly potName: string } }
  | {
      readonly code: 'fill-above-valve';
      readonly facts: { readonly askedM3: number; readonly limitM3: number; readonly marginM: number };
    }
  | {
      readonly code: 'pressure-near-valve';
      readonly facts: { readonly peakPa: number; readonly valvePa: number; readonly grind: GrindClass };
    }
  | { readonly code: 'no-delivery'; readonly facts: Record<string, never> }
  | {
      readonly code: 'no-plan-fits';
      readonly facts: { readonly lowS: number; readonly highS: number; readonly tooFast: boolean };
    };

export type RefusalCode = Refusal['code'];

/** An input the model was checked for, by name (SI values; see model-range.ts). */
export type CheckedQuantity = 'permeabilityM2' | 'heatToPotW' | 'altitudeM' | 'sealedVolumeM3' | 'ambientK';

/** Something a card should say beside its recipe, as a code and SI facts. */
export type PlanWarning =
  | {
      readonly code: 'outside-checked-range';
      readonly facts: {
        readonly quantity: CheckedQuantity;
        readonly value: number;
        readonly low: number;
        readonly high: number;
      };
    }
  | { readonly code: 'cool-cup'; readonly facts: { readonly inBandShare: number } }
  | { readonly code: 'small-fill'; readonly facts: Record<string, never> };

export type PlanWarningCode = PlanWarning['code'];

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
  readonly warnings: readonly PlanWarning[];
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
