/**
 * Calibration of a coffee, a stove and a pot from a brew log (`stovecard fit`):
 *
 *   log ─ observations (SI, each with its σ) ─┐
 *   entries ─ candidate parameters (priors) ──┴─▶ J at the priors: which parameters the
 *     data can inform ─▶ Levenberg–Marquardt on those (ln θ) ─▶ J at the optimum ─▶
 *     covariance s²·(JᵀJ)⁻¹ ─▶ any relative σ > 50 %? keep the worst at its prior, refit ─▶
 *     report: estimates ± σ, residuals, what the data cannot pin down
 *
 * Candidates: the coffee's permeability, the heat reaching the pot at each stove level the
 * log uses, the pot's heat-loss coefficient U·A. A parameter is not identifiable, and stays
 * at its prior, when its column of J is ~0 (NO_INFORMATION_NORM), when there are fewer
 * observations than parameters (the ones the data inform most are fitted, ranked by
 * column-pivoted Gram–Schmidt on J at the priors), or when its relative 1-σ exceeds
 * RELATIVE_SIGMA_LIMIT. The covariance is (JᵀJ)⁻¹ in ln θ, scaled by the residual variance
 * s² = χ²/dof when dof > 0 (the σ's as stated when dof = 0); σ(θ) = θ·σ(ln θ).
 */
import type { CoffeeEntry, LogEntry, PotEntry, StoveEntry } from '../content/types.ts';
import { inverseSpd, norm, normalMatrix, pivotedColumns } from './dense.ts';
import { jacobianColumns } from './jacobian.ts';
import { leastSquares } from './least-squares.ts';
import { forwardModel } from './model.ts';
import { logObservations } from './observations.ts';
import { candidateParameters, modelValues } from './parameters.ts';
import type { Estimate, FitReport, KeptEstimate, Residual } from './types.ts';

/** A parameter whose 1 % change moves the scaled predictions by less than 1e-4 in all carries no information. */
export const NO_INFORMATION_NORM = 1e-2;
/** Relative 1-σ above which a fitted parameter is reported as not identifiable. */
export const RELATIVE_SIGMA_LIMIT = 0.5;

export interface FitInput {
  readonly log: LogEntry;
  readonly pot: PotEntry;
  readonly coffee: CoffeeEntry;
  readonly stove: StoveEntry;
}

export function fitLog(input: FitInput): FitReport {
  const { log, pot, coffee, stove } = input;
  const observations = logObservations(log);
  const parameters = candidateParameters(log, pot, coffee, stove);
  const forward = forwardModel(log, pot, coffee, observations);
  const data = Float64Array.from(observations, (o) => o.seen / o.sigma);
  const priorTheta = parameters.map((p) => Math.log(p.prior));

  /** Scaled predictions with the parameters at `free` set to `thetaFree`, the rest at `base`. */
  const modelFor =
    (free: readonly number[], base: readonly number[]) =>
    (thetaFree: readonly number[]): Float64Array => {
      const theta = [...base];
      free.forEach((index, k) => (theta[index] = thetaFree[k]!));
      return forward.scaledPredictions(modelValues(parameters, theta.map(Math.exp)));
    };

  const kept = new Map<number, KeptEstimate>();
  const keep = (
    index: number,
    reason: KeptEstimate['reason'],
    relativeSigmaIfFitted?: number,
  ): void => {
    kept.set(index, {
      parameter: parameters[index]!,
      status: 'kept',
      value: parameters[index]!.prior,
      reason,
      ...(relativeSigmaIfFitted !== undefined ? { relativeSigmaIfFitted } : {}),
    });
  };

  // Which parameters the observations can inform, judged at the priors.
  const all = parameters.map((_, i) => i);
  const atPrior = modelFor(all, priorTheta);
  const priorColumns = jacobianColumns(atPrior, priorTheta, atPrior(priorTheta));
  const informative = all.filter((i) => norm(priorColumns[i]!) >= NO_INFORMATION_NORM);
  all.filter((i) => !informative.includes(i)).forEach((i) => keep(i, 'no-information'));
  const ranked = pivotedColumns(
    informative.map((i) => priorColumns[i]!),
    observations.length,
    NO_INFORMATION_NORM,
  ).map(({ index }) => informative[index]!);
  for (const i of informative) {
    if (ranked.includes(i)) continue;
    if (observations.length < informative.length) keep(i, 'too-few-observations');
    else keep(i, 'too-uncertain', Infinity);
  }

  let free = ranked.slice().sort((a, b) => a - b);
  let theta = [...priorTheta];
  let iterations = 0;
  let converged = true;
  let relativeSigmas: number[] = [];
  while (free.length > 0) {
    const base = theta.map((value, i) => (free.includes(i) ? value : priorTheta[i]!));
    const model = modelFor(free, base);
    const result = leastSquares({
      data,
      model,
      start: free.map((i) => base[i]!),
      lower: free.map((i) => Math.log(parameters[i]!.min)),
      upper: free.map((i) => Math.log(parameters[i]!.max)),
      scale: free.map((i) => norm(priorColumns[i]!)),
    });
    iterations += result.iterations;
    converged = result.converged;
    theta = base.map((value, i) => (free.includes(i) ? result.theta[free.indexOf(i)]! : value));

    const columns = jacobianColumns(model, result.theta, model(result.theta));
    const dof = observations.length - free.length;
    const scale = dof > 0 ? result.cost / dof : 1;
    const inverse = inverseSpd(normalMatrix(columns));
    if (inverse === null) {
      // Rank-deficient at the optimum: the last-ranked parameter cannot be told apart.
      const last = ranked.filter((i) => free.includes(i)).at(-1)!;
      keep(last, 'too-uncertain', Infinity);
      free = free.filter((i) => i !== last);
      continue;
    }
    relativeSigmas = inverse.map((row, k) => Math.sqrt(scale * row[k]!));
    const worst = relativeSigmas.reduce((best, s, k) => (s > relativeSigmas[best]! ? k : best), 0);
    if (relativeSigmas[worst]! > RELATIVE_SIGMA_LIMIT) {
      const index = free[worst]!;
      keep(index, 'too-uncertain', relativeSigmas[worst]!);
      free = free.filter((i) => i !== index);
      continue;
    }
    break;
  }
  if (free.length === 0) theta = [...priorTheta];

  const finalValues = theta.map((value, i) =>
    free.includes(i) ? Math.exp(value) : parameters[i]!.prior,
  );
  const estimates: Estimate[] = parameters.map((parameter, i) => {
    const k = free.indexOf(i);
    if (k < 0) return kept.get(i)!;
    const relativeSigma = relativeSigmas[k]!;
    return {
      parameter,
      status: 'fitted',
      value: finalValues[i]!,
      sigma: finalValues[i]! * relativeSigma,
      relativeSigma,
    };
  });

  const scaled = forward.scaledPredictions(modelValues(parameters, finalValues));
  const residuals: Residual[] = observations.map((observation, i) => {
    const model = scaled[i]! * observation.sigma;
    const difference = observation.seen - model;
    return { observation, model, difference, normalised: difference / observation.sigma };
  });
  const chiSquare = residuals.reduce((sum, r) => sum + r.normalised ** 2, 0);
  const dof = observations.length - free.length;
  return {
    logId: log.id,
    potId: pot.id,
    coffeeId: coffee.id,
    stoveId: stove.id,
    estimates,
    residuals,
    observationCount: observations.length,
    fittedCount: free.length,
    dof,
    chiSquare,
    residualVariance: dof > 0 && free.length > 0 ? chiSquare / dof : null,
    relativeSigmaLimit: RELATIVE_SIGMA_LIMIT,
    iterations,
    converged,
    simulations: forward.simulations(),
  };
}
