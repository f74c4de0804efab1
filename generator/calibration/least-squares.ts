/**
 * Weighted non-linear least squares for a calibration: minimise Σ rᵢ², rᵢ = (seenᵢ −
 * modelᵢ(θ))/σᵢ, over the natural logarithms θ of the parameters, with ml-levenberg-marquardt.
 *
 * The data and the model come in already divided by σ, and the library is called with unit
 * weights (its `weights` option scales the cost and the step's normal matrix differently,
 * so pre-scaling keeps the two consistent). It is called one iteration at a time: the
 * library steps on from a point that raised the cost, so here each iteration starts from
 * the best point, the library's trial point is accepted or rejected here, and λ is carried
 * (÷ 9 after a step that lowered the cost, × 11 after one that did not, as the library does
 * inside a run). It stops
 *   - when an accepted step lowers the cost by less than COST_TOLERANCE (relative) or moves
 *     every θ by less than STEP_TOLERANCE (MINPACK's ftol and xtol tests);
 *   - when an accepted step lowers χ² by less than SIGMA_FRACTION²·χ²/dof: near the minimum,
 *     where λ is small and a step goes most of the way, such a step moved the estimates by
 *     about SIGMA_FRACTION of their own (scaled) 1-σ, which no report would show;
 *   - when a rejected step was already shorter than STEP_TOLERANCE (nothing downhill);
 *   - after MAX_ITERATIONS.
 * No step moves a θ by more than MAX_STEP (the library's bounds are narrowed to that box for
 * each step), and a trial point where the model cannot run counts as a rejected step.
 *
 * The model is evaluated once per distinct θ (the library asks for the current point twice
 * per iteration): the last few evaluations are kept.
 */
import { levenbergMarquardt } from 'ml-levenberg-marquardt';

export const MAX_ITERATIONS = 60;
export const COST_TOLERANCE = 1e-6;
/** A step worth less than this share of the estimates' 1-σ ends the search (see above). */
export const SIGMA_FRACTION = 0.01;
export const STEP_TOLERANCE = 1e-6;
/** Forward-difference step of the library's Jacobian, in θ (a 1 % change of the parameter). */
export const GRADIENT_STEP = 1e-2;
/** Largest change of any θ in one step (a factor e^0.5 ≈ 1.65): a box trust region in ln θ. */
export const MAX_STEP = 0.5;

export interface LeastSquaresProblem {
  /** Seen values over σ. */
  readonly data: Float64Array;
  /** Model values over σ at θ; may throw when the model cannot run there. */
  readonly model: (theta: readonly number[]) => Float64Array;
  readonly start: readonly number[];
  readonly lower: readonly number[];
  readonly upper: readonly number[];
  /**
   * Typical sensitivity of each θ (e.g. its column norm of J at the start). The library's
   * damping adds λ·I to JᵀJ; working in φ = θ·scale makes that λ·diag(JᵀJ), Marquardt's
   * scale-invariant damping. Default 1.
   */
  readonly scale?: readonly number[];
}

export interface LeastSquaresResult {
  readonly theta: number[];
  /** Σ rᵢ² at theta. */
  readonly cost: number;
  readonly iterations: number;
  readonly converged: boolean;
}

/** Σ ((data − model)²), or Infinity when the model cannot run at θ. */
export function costAt(problem: LeastSquaresProblem, theta: readonly number[]): number {
  const model = safeModel(problem.model, theta);
  if (model === null) return Infinity;
  let sum = 0;
  for (let i = 0; i < model.length; i++) sum += (problem.data[i]! - model[i]!) ** 2;
  return sum;
}

function safeModel(
  model: LeastSquaresProblem['model'],
  theta: readonly number[],
): Float64Array | null {
  try {
    const values = model(theta);
    return values.every(Number.isFinite) ? values : null;
  } catch {
    return null;
  }
}

function memoised(model: LeastSquaresProblem['model']): LeastSquaresProblem['model'] {
  const kept: { key: string; values: Float64Array }[] = [];
  return (theta) => {
    const key = theta.join(',');
    const found = kept.find((entry) => entry.key === key);
    if (found) return found.values;
    const values = model(theta);
    kept.push({ key, values });
    if (kept.length > 8) kept.shift();
    return values;
  };
}

export function leastSquares(problem: LeastSquaresProblem): LeastSquaresResult {
  const model = memoised(problem.model);
  const memo = { ...problem, model };
  const scale = problem.scale ?? problem.start.map(() => 1);
  const toTheta = (phi: readonly number[]): number[] => phi.map((value, j) => value / scale[j]!);
  const toPhi = (theta: readonly number[]): number[] => theta.map((value, j) => value * scale[j]!);
  // The library wants at least two points; a padding point with model = data adds nothing.
  const padded = problem.data.length < 2;
  const x = Array.from({ length: Math.max(2, problem.data.length) }, (_, i) => i);
  const y = padded ? [...problem.data, 0] : Array.from(problem.data);
  const curve = (phi: number[]): ((i: number) => number) => {
    const values = safeModel(model, toTheta(phi));
    return (i) => (values === null ? NaN : i < problem.data.length ? values[i]! : 0);
  };

  const dof = Math.max(1, problem.data.length - problem.start.length);
  let theta = [...problem.start];
  let cost = costAt(memo, theta);
  if (!Number.isFinite(cost)) return { theta, cost, iterations: 0, converged: false };
  let damping = 1e-2;
  let iterations = 0;
  let converged = false;
  while (iterations < MAX_ITERATIONS && !converged) {
    iterations += 1;
    let next: number[] = theta;
    let nextCost = Infinity;
    const phi = toPhi(theta);
    try {
      const out = levenbergMarquardt({ x, y }, curve, {
        initialValues: phi,
        damping,
        maxIterations: 1,
        gradientDifference: problem.start.map((_, j) => GRADIENT_STEP * scale[j]!),
        // The box θ ± MAX_STEP (within the bounds) is the trust region of this step.
        minValues: toPhi(theta.map((v, j) => Math.max(problem.lower[j]!, v - MAX_STEP))),
        maxValues: toPhi(theta.map((v, j) => Math.min(problem.upper[j]!, v + MAX_STEP))),
        // −∞: the library returns its trial point whatever its cost; accepted here or not.
        errorTolerance: -Infinity,
      });
      // The library hands back the start when the model failed at its trial point.
      if (out.parameterValues.some((value, j) => value !== phi[j])) {
        next = toTheta(out.parameterValues);
        nextCost = costAt(memo, next);
      }
    } catch {
      // The step could not be computed (the model failed near θ): treat it as rejected.
    }
    if (nextCost < cost) {
      const drop = cost - nextCost;
      const largestStep = Math.max(...next.map((value, i) => Math.abs(value - theta[i]!)));
      theta = next;
      cost = nextCost;
      damping = Math.max(damping / 9, 1e-7);
      converged =
        drop < COST_TOLERANCE * cost ||
        drop < SIGMA_FRACTION ** 2 * (cost / dof) ||
        largestStep < STEP_TOLERANCE ||
        cost === 0;
    } else {
      const tried = Math.max(...next.map((value, i) => Math.abs(value - theta[i]!)));
      damping *= 11;
      converged = (tried > 0 && tried < STEP_TOLERANCE) || damping > 1e10;
    }
  }
  return { theta, cost, iterations, converged };
}
