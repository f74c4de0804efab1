/**
 * What a card recommends for one pot × coffee × stove in one room: the planner's output,
 * SI throughout. Renderers format it; they never compute physics.
 */
import type { BrewResult } from '../brew/types.ts';
import type { GrindClass } from '../content/types.ts';

/** A timing with its spread from the inputs' uncertainty (InputSpread). */
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
      readonly facts: {
        readonly askedM3: number;
        readonly limitM3: number;
        readonly marginM: number;
      };
    }
  | {
      readonly code: 'pressure-near-valve';
      readonly facts: {
        readonly peakPa: number;
        readonly valvePa: number;
        readonly grind: GrindClass;
      };
    }
  | { readonly code: 'no-delivery'; readonly facts: Record<string, never> }
  | {
      readonly code: 'no-plan-fits';
      readonly facts: { readonly lowS: number; readonly highS: number; readonly tooFast: boolean };
    };

export type RefusalCode = Refusal['code'];

/** An input the model was checked for, by name (SI values; see model-range.ts). */
export type CheckedQuantity =
  'permeabilityM2' | 'heatToPotW' | 'altitudeM' | 'sealedVolumeM3' | 'ambientK';

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
  /** First coffee → last drop (tail included) of the printed run, s. */
  readonly deliveryS: number;
  /** The coffee's delivery window for this pot, s (a preference, scored). */
  readonly deliveryWindowS: readonly [number, number];
  /** Peak gauge pressure of the printed run itself, Pa. */
  readonly peakGaugePa: number;
  /** Its range over the uncertainty corners, Pa (the refusal limit is checked on the high one). */
  readonly peakGaugeRangePa: { readonly lowPa: number; readonly highPa: number };
  /** The inputs' uncertainty the ranges come from. */
  readonly spread: InputSpread;
  /** Set when the share in band is below 0.3: what binds, as a code with facts. */
  readonly bindingCause: BindingCause | null;
  /** The chosen brew re-simulated (the charts draw its cup curve). */
  readonly brew: PlannedBrew;
  /** The same pot, coffee and level started with room-temperature water, off the heat by the same rules. */
  readonly coldBrew: PlannedBrew;
  /** Simulations the search ran, for the benchmark. */
  readonly simulations: number;
}

export type CardPlan = AcceptedPlan | RefusedPlan;

/**
 * How far the two inputs that move a card most may be off: the corners of the ranges are
 * permeability ×/÷ permeabilityFactor and heat × (1 ± heatShare), and, for a bed that
 * tightens, its final share between finalShare.low and finalShare.high.
 */
export interface InputSpread {
  readonly permeabilityFactor: number;
  readonly heatShare: number;
  /** From a log fit or a measured entry (else assumed from the grind / a default efficiency). */
  readonly permeabilityMeasured: boolean;
  readonly heatMeasured: boolean;
  /**
   * A bed that tightens (the coffee's bed.tightening on; absent otherwise): its final
   * share's corners, f·e^(∓2σ) within 0.1–1, paired with the permeability's (the lower
   * share with the tighter bed), σ of ln f measured (the note `fit --write` left) or
   * assumed (ASSUMED_FINAL_SHARE_SIGMA_LN).
   */
  readonly finalShare?: {
    readonly low: number;
    readonly high: number;
    readonly sigmaLn: number;
    readonly measured: boolean;
  };
}

export type BindingCauseCode =
  | 'bed-too-open'
  | 'bed-too-tight'
  | 'gentlest-heat-too-strong'
  | 'pot-too-small-for-window'
  | 'pressure-margin-binds'
  | 'band-out-of-reach';

/**
 * What keeps the cup out of its band when the best share is below 0.3: a code and SI
 * facts (K, s, W, m², shares 0–1); generator/words/plan.ts says it.
 */
export interface BindingCause {
  readonly code: BindingCauseCode;
  readonly facts: {
    readonly share: number;
    readonly meanK: number;
    readonly bandLowK: number;
    readonly bandHighK: number;
    readonly deliveryS: number;
    readonly windowLowS: number;
    readonly windowHighS: number;
    readonly gentlestW?: number;
    readonly shareAtHalfHeat?: number;
    readonly permeabilityM2?: number;
    readonly shareAtHalfPermeability?: number;
    readonly cups?: number;
    readonly shareIfAllowed?: number;
    readonly highCornerGaugePa?: number;
    readonly limitGaugePa?: number;
  };
}

/**
 * A run as a plan keeps it: without the 1 s time series, which nothing drawn from a plan
 * reads and which was nine tenths of a plan's cached text (~200 kB a card).
 */
export type PlannedBrew = Omit<BrewResult, 'series'>;
