/**
 * Narrowing a bracketed sign change of a continuous function, for event location.
 *
 * Method: the Illinois variant of regula falsi (M. Dowell and P. Jarratt, "A modified regula
 * falsi method for computing the root of an equation", BIT 11 (1971) 168–174): a secant step
 * through the bracket ends, and whenever the same end is kept twice in a row its function value
 * is halved, which restores superlinear convergence where plain regula falsi stalls on one side.
 * Two safeguards make termination certain:
 * - each trial point lies at least tolerance/2 inside the bracket, so a secant that hugs one
 *   end still closes the bracket from the other side;
 * - whenever the bracket has not halved over the last two trials, the next trial is the
 *   midpoint (so the cost is at most about three times that of bisection).
 *
 * Contract: g(left) = gLeft is nonzero (the "old" sign); g(right) = gRight is zero or of the
 * opposite sign. The result is a bracket [left', right'] ⊆ [left, right] with g(left') of the
 * old sign and g(right') zero or of the new sign, and right' − left' ≤ tolerance (or a point
 * where g is exactly zero, left' = right'). The tolerance is absolute, in the unit of t; it is
 * raised to 4 ulp of the bracket when smaller, so that it can be met in floating point.
 * A NaN value of g counts as the old sign (a rule, not a diagnosis; the caller owns g).
 */

/** A bracket of a sign change: g(left) has the old sign, g(right) is zero or has the new one. */
export interface SignChangeBracket {
  readonly left: number;
  readonly right: number;
  /** Number of evaluations of g spent (the two ends passed in are not counted). */
  readonly evaluations: number;
}

const DEFAULT_MAX_EVALUATIONS = 400;

/**
 * Narrows [left, right] around a sign change of g to within `tolerance` (absolute).
 * Worked value: g = cos on [1, 2] with tolerance 1e-12 gives right − π/2 ∈ [0, 1e-12].
 */
export function locateSignChange(
  g: (t: number) => number,
  left: number,
  gLeft: number,
  right: number,
  gRight: number,
  tolerance: number,
  maxEvaluations: number = DEFAULT_MAX_EVALUATIONS,
): SignChangeBracket {
  let a = left;
  let ga = gLeft;
  let b = right;
  let gb = gRight;
  if (ga === 0) return { left: a, right: a, evaluations: 0 };
  if (gb === 0) return { left: a, right: b, evaluations: 0 };
  const oldPositive = ga > 0;
  let evaluations = 0;
  let kept: 'none' | 'left' | 'right' = 'none';
  let widthOneAgo = Infinity;
  let widthTwoAgo = Infinity;

  while (evaluations < maxEvaluations) {
    const width = b - a;
    const tol = Math.max(tolerance, 4 * Number.EPSILON * Math.max(Math.abs(a), Math.abs(b)));
    if (width <= tol) break;

    let trial: number;
    if (width > 0.5 * widthTwoAgo) {
      trial = a + 0.5 * width;
    } else {
      const margin = 0.5 * tol;
      trial = b - (gb * width) / (gb - ga);
      if (Number.isNaN(trial)) trial = a + 0.5 * width;
      else if (trial < a + margin) trial = a + margin;
      else if (trial > b - margin) trial = b - margin;
    }
    widthTwoAgo = widthOneAgo;
    widthOneAgo = width;
    if (!(trial > a && trial < b)) break;

    const gt = g(trial);
    evaluations++;
    if (gt === 0) return { left: trial, right: trial, evaluations };
    const newSide = oldPositive ? gt < 0 : gt > 0;
    if (newSide) {
      b = trial;
      gb = gt;
      if (kept === 'left') ga *= 0.5;
      kept = 'left';
    } else {
      a = trial;
      ga = gt;
      if (kept === 'right') gb *= 0.5;
      kept = 'right';
    }
  }
  return { left: a, right: b, evaluations };
}
