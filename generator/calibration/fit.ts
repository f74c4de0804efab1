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
 * s² = χ²/dof only when it exceeds 1 (a σ never falls below what the readings' own σ
 * allow); then the prior uncertainty of everything held (the parameters kept at their
 * priors, Parameter.priorSigmaLn, and the grounds' retention, RETENTION_SIGMA_LN)
 * propagates through dθ_f = −(J_fᵀJ_f)⁻¹ J_fᵀ J_h dθ_h, and the held values that make up
 * over a quarter of a σ² are named beside it (entangledWith); σ(θ) = θ·σ(ln θ).
 * χ² beyond dof + 3√(2 dof) is reported as a misfit naming the brews that disagree; a log
 * of 3+ brews gets a leave-one-brew-out prediction error.
 */
import type { CoffeeEntry, LogEntry, PotEntry, StoveEntry } from '../content/types.ts';
import { inverseSpd, norm, normalMatrix, pivotedColumns } from './dense.ts';
import { jacobianColumns } from './jacobian.ts';
import { leastSquares } from './least-squares.ts';
import { forwardModel } from './model.ts';
import { logObservations } from './observations.ts';
import { candidateParameters, modelValues, type Parameter } from './parameters.ts';
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

/** χ² above dof + MISFIT_SIGMAS·√(2·dof) is a misfit (the χ² distribution's normal approximation). */
export const MISFIT_SIGMAS = 3;
/** A brew whose mean (difference/σ)² exceeds this disagrees with the others. */
export const DISAGREEING_BREW_MEAN_SQUARE = 4;
/** σ of ln(retention): water held per gram of grounds, ±15 % between coffees (our choice). */
export const RETENTION_SIGMA_LN = 0.15;
/** A held prior contributing more than this share of a fitted σ² is named beside it. */
const ENTANGLED_SHARE = 0.25;

/**
 * Kinds whose whole σ (the held values' doubt included) must keep RELATIVE_SIGMA_LIMIT to
 * count as fitted; the others are limited on the readings' part. Only the bed's final
 * share: with the retention held at ±15 %, weighed logs of 1–6 brews pin the readings' part
 * of its σ to 23–8 % but its whole σ only to 160–50 % (DEVELOPERS.md, "A bed that tightens
 * as it brews").
 */
const TOTAL_LIMITED: ReadonlySet<Parameter['kind']> = new Set(['tightening']);

/** What the held values' prior doubt adds to each free parameter's σ²(ln θ), and who adds it. */
interface HeldPart {
  readonly heldVariance: readonly number[];
  readonly entangled: readonly (readonly string[])[];
}

export function fitLog(
  input: FitInput,
  options: { readonly leaveOneOut?: boolean } = {},
): FitReport {
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
    notSeparableFrom?: readonly string[],
    readingsRelativeSigma?: number,
  ): void => {
    kept.set(index, {
      parameter: parameters[index]!,
      status: 'kept',
      value: parameters[index]!.prior,
      reason,
      ...(relativeSigmaIfFitted !== undefined ? { relativeSigmaIfFitted } : {}),
      ...(notSeparableFrom && notSeparableFrom.length > 0 ? { notSeparableFrom } : {}),
      ...(readingsRelativeSigma !== undefined ? { readingsRelativeSigma } : {}),
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
  let held: HeldPart = { heldVariance: [], entangled: [] };
  /** The values with the free parameters at `at` (ln), the rest at their priors, SI. */
  const valuesAt = (freeNow: readonly number[], at: readonly number[]): number[] =>
    at.map((value, i) => (freeNow.includes(i) ? Math.exp(value) : parameters[i]!.prior));
  /**
   * The held parameters are uncertain too: their prior σ propagates into the fitted ones
   * through the sensitivity of the optimum, dθ_f = −(J_fᵀJ_f)⁻¹ J_fᵀ J_h · dθ_h.
   */
  const heldPart = (freeNow: readonly number[], values: readonly number[]): HeldPart => {
    const heldVariance = freeNow.map(() => 0);
    const entangled: string[][] = freeNow.map(() => []);
    const heldIndices = all.filter((i) => !freeNow.includes(i));
    const thetaAll = values.map(Math.log);
    const full = modelFor(all, thetaAll);
    const centre = full(thetaAll);
    const columns = jacobianColumns(full, thetaAll, centre);
    // The fixed inputs no log fits, held like the rest: the grounds' retention (a column by
    // a forward difference of ln retention).
    const step = 0.01;
    const retained = forwardModel(
      log,
      pot,
      {
        ...coffee,
        bed: { ...coffee.bed, retentionKgPerKg: coffee.bed.retentionKgPerKg * Math.exp(step) },
      },
      observations,
    ).scaledPredictions(modelValues(parameters, values));
    const retentionColumn = Float64Array.from(retained, (v, n) => (v - centre[n]!) / step);
    const heldColumns = [
      ...heldIndices.map((h) => ({
        id: parameters[h]!.id,
        column: columns[h]!,
        sigmaLn: parameters[h]!.priorSigmaLn,
      })),
      { id: 'retention', column: retentionColumn, sigmaLn: RETENTION_SIGMA_LN },
    ];
    const inverse = inverseSpd(normalMatrix(freeNow.map((i) => columns[i]!)));
    if (inverse === null) return { heldVariance, entangled };
    const dot = (a: Float64Array, b: Float64Array) => a.reduce((sum, v, n) => sum + v * b[n]!, 0);
    freeNow.forEach((_, k) => {
      const parts = heldColumns.map((h) => {
        const gain = freeNow.reduce(
          (sum, fi, m) => sum + inverse[k]![m]! * dot(columns[fi]!, h.column),
          0,
        );
        return (gain * h.sigmaLn) ** 2;
      });
      heldVariance[k] = parts.reduce((a, b) => a + b, 0);
      const total = relativeSigmas[k]! ** 2 + heldVariance[k]!;
      heldColumns.forEach((h, n) => {
        if (parts[n]! > ENTANGLED_SHARE * total) entangled[k]!.push(h.id);
      });
    });
    return { heldVariance, entangled };
  };
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
    // Scaled by χ²/dof only upwards: a σ never falls below what the readings' own
    // uncertainty allows (a lucky small χ² with few dof is no evidence of better readings).
    const scale = dof > 0 ? Math.max(1, result.cost / dof) : 1;
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
    held = heldPart(free, valuesAt(free, theta));
    // The bed's final share: the same limit on its whole σ, the held values' doubt
    // included (TOTAL_LIMITED). A share the log pins only as well as the held values allow
    // is not separable from them, and kept: written back, its σ would widen the card's
    // corners (f·e^(∓2σ)) past the assumed share's, not narrow them.
    const share = free.findIndex((i) => TOTAL_LIMITED.has(parameters[i]!.kind));
    if (share >= 0) {
      const total = Math.sqrt(relativeSigmas[share]! ** 2 + held.heldVariance[share]!);
      if (total > RELATIVE_SIGMA_LIMIT) {
        keep(free[share]!, 'too-uncertain', total, held.entangled[share]!, relativeSigmas[share]!);
        free = free.filter((i) => i !== free[share]);
        continue;
      }
    }
    break;
  }
  if (free.length === 0) theta = [...priorTheta];

  const finalValues = valuesAt(free, theta);
  const { heldVariance, entangled } = held;
  const estimates: Estimate[] = parameters.map((parameter, i) => {
    const k = free.indexOf(i);
    if (k < 0) return kept.get(i)!;
    const statistical = relativeSigmas[k]!;
    const relativeSigma = Math.sqrt(statistical ** 2 + heldVariance[k]!);
    return {
      parameter,
      status: 'fitted',
      value: finalValues[i]!,
      sigma: finalValues[i]! * relativeSigma,
      relativeSigma,
      statisticalRelativeSigma: statistical,
      entangledWith: entangled[k]!,
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
  const misfit = misfitOf(residuals, chiSquare, dof, log.brews.length);
  const leaveOneOut =
    options.leaveOneOut !== false && log.brews.length >= 3
      ? leaveOneBrewOut(
          input,
          parameters,
          (values) => forward.scaledPredictions(modelValues(parameters, values)),
          observations,
        )
      : null;
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
    misfit,
    leaveOneOut,
    relativeSigmaLimit: RELATIVE_SIGMA_LIMIT,
    iterations,
    converged,
    simulations: forward.simulations(),
  };
}

/**
 * A misfit: χ² far above its degrees of freedom (MISFIT_SIGMAS standard deviations of the
 * χ² distribution), naming the brews whose readings disagree most (mean (difference/σ)²
 * above DISAGREEING_BREW_MEAN_SQUARE, or else the worst one). Null when the fit is fine.
 */
function misfitOf(
  residuals: readonly Residual[],
  chiSquare: number,
  dof: number,
  brewCount: number,
): FitReport['misfit'] {
  if (dof <= 0 || chiSquare <= dof + MISFIT_SIGMAS * Math.sqrt(2 * dof)) return null;
  const perBrew = Array.from({ length: brewCount }, (_, brew) => {
    const own = residuals.filter((r) => r.observation.brew === brew);
    const meanSquare = own.length
      ? own.reduce((sum, r) => sum + r.normalised ** 2, 0) / own.length
      : 0;
    return { brew, meanSquare };
  });
  const worst = [...perBrew].sort((a, b) => b.meanSquare - a.meanSquare);
  const disagreeing = worst
    .filter((b) => b.meanSquare > DISAGREEING_BREW_MEAN_SQUARE)
    .map((b) => b.brew);
  return { chiSquare, dof, brews: disagreeing.length > 0 ? disagreeing : [worst[0]!.brew] };
}

/**
 * Leave one brew out: each brew predicted from a fit of the others (every parameter the
 * smaller log does not reach stays at its prior), in units of the readings' own σ. A value
 * near 1 says the fitted inputs predict a brew they have not seen as well as it can be read.
 */
function leaveOneBrewOut(
  input: FitInput,
  parameters: readonly Parameter[],
  predict: (values: readonly number[]) => Float64Array,
  observations: readonly { readonly brew: number; readonly seen: number; readonly sigma: number }[],
): NonNullable<FitReport['leaveOneOut']> {
  const perBrew = input.log.brews.map((_, brew) => {
    const others = { ...input.log, brews: input.log.brews.filter((__, i) => i !== brew) };
    const sub = fitLog({ ...input, log: others }, { leaveOneOut: false });
    const values = parameters.map(
      (p) => sub.estimates.find((e) => e.parameter.id === p.id)?.value ?? p.prior,
    );
    const scaled = predict(values);
    const normalised = observations
      .map((o, i) => ({ o, i }))
      .filter(({ o }) => o.brew === brew)
      .map(({ o, i }) => (o.seen - scaled[i]! * o.sigma) / o.sigma);
    const rms = normalised.length
      ? Math.sqrt(normalised.reduce((s, v) => s + v * v, 0) / normalised.length)
      : 0;
    return { brew, rmsNormalised: rms, count: normalised.length };
  });
  const all = perBrew.reduce((s, b) => s + b.rmsNormalised ** 2 * b.count, 0);
  const count = perBrew.reduce((s, b) => s + b.count, 0);
  return { perBrew, rmsNormalised: count ? Math.sqrt(all / count) : 0 };
}
