/** What a calibration reports: the estimates, the residuals and what the data left open. */
import type { Observation } from './observations.ts';
import type { Parameter } from './parameters.ts';

/**
 * Why a parameter was kept at its prior:
 *   no-information        the observations do not depend on it (its column of J is ~0)
 *   too-few-observations  fewer observations than parameters; the ones the data inform
 *                         most were fitted (column-pivoted ranking of J at the prior)
 *   too-uncertain         fitted, its relative 1-σ exceeded the limit (50 %): from the readings
 *                         alone, or with the held values' prior doubt propagated (then it
 *                         is not separable from them: notSeparableFrom); or its effect
 *                         cannot be told apart from the others' (J rank-deficient)
 */
export type NotIdentifiableReason = 'no-information' | 'too-few-observations' | 'too-uncertain';

export interface FittedEstimate {
  readonly parameter: Parameter;
  readonly status: 'fitted';
  /** SI. */
  readonly value: number;
  /** 1-σ, SI: value × σ(ln value) (first order). */
  readonly sigma: number;
  /**
   * σ(ln value), ≈ the relative 1-σ: the readings' part (never below what their own σ
   * allows) and the held parameters' prior uncertainty, propagated.
   */
  readonly relativeSigma: number;
  /** The readings' part alone. */
  readonly statisticalRelativeSigma: number;
  /** Held parameters whose prior uncertainty makes up more than a quarter of σ²: not separable from them. */
  readonly entangledWith: readonly string[];
}

export interface KeptEstimate {
  readonly parameter: Parameter;
  readonly status: 'kept';
  /** The prior, SI. */
  readonly value: number;
  readonly reason: NotIdentifiableReason;
  /**
   * For too-uncertain: the relative 1-σ it had when fitted (Infinity: not separable), the
   * held values' doubt included when that is what passed the limit.
   */
  readonly relativeSigmaIfFitted?: number;
  /** The held values whose doubt made up more than a quarter of that σ² (not separable from them). */
  readonly notSeparableFrom?: readonly string[];
  /** Then: the readings' part of that σ alone (what more of the same readings would shrink). */
  readonly readingsRelativeSigma?: number;
}

export type Estimate = FittedEstimate | KeptEstimate;

export interface Residual {
  readonly observation: Observation;
  /** The model's value at the estimates, SI. */
  readonly model: number;
  /** seen − model, SI. */
  readonly difference: number;
  /** difference / σ. */
  readonly normalised: number;
}

export interface FitReport {
  readonly logId: string;
  readonly potId: string;
  readonly coffeeId: string;
  readonly stoveId: string;
  /** In the order: permeability, heat per level (gentlest first), heat loss, tightening (when on). */
  readonly estimates: readonly Estimate[];
  readonly residuals: readonly Residual[];
  readonly observationCount: number;
  readonly fittedCount: number;
  /** Observations − fitted parameters. */
  readonly dof: number;
  /** Σ (difference / σ)². */
  readonly chiSquare: number;
  /** χ²/dof, by which the covariance was scaled; null when dof = 0 (σ's taken as stated). */
  readonly residualVariance: number | null;
  /** Relative 1-σ above which a parameter counts as not identifiable. */
  readonly relativeSigmaLimit: number;
  /** χ² far above its dof: the brews whose readings disagree most (log order, 0-based). */
  readonly misfit: {
    readonly chiSquare: number;
    readonly dof: number;
    readonly brews: readonly number[];
  } | null;
  /** Logs of 3 or more brews: each brew predicted by a fit of the others, in units of its readings' σ. */
  readonly leaveOneOut: {
    readonly perBrew: readonly {
      readonly brew: number;
      readonly rmsNormalised: number;
      readonly count: number;
    }[];
    readonly rmsNormalised: number;
  } | null;
  readonly iterations: number;
  readonly converged: boolean;
  /** Brew simulations the whole calibration ran. */
  readonly simulations: number;
}
