/**
 * Jacobian of the scaled model values by central finite differences on the simulation:
 *   J[j][i] = (mᵢ(θ + h·e_j) − mᵢ(θ − h·e_j)) / (2h),
 * θ the natural logarithms of the parameters, h = JACOBIAN_STEP (a 1 % change). The
 * truncation error is O(h²) (1e-4 of the curvature). The simulation's outputs jitter by
 * about 5e-4 s in an event time as its step sequence changes with the parameters (measured
 * on the demo pot: rtol 1e-6); over 2h that is 0.025 s per unit of ln θ, about 1 % of the
 * weakest sensitivity a fit keeps (a first-coffee time moves ~5 s per unit of ln k). Where
 * the model cannot run on one side, the one-sided difference is used; where it runs on
 * neither, the column is zero.
 */
export const JACOBIAN_STEP = 1e-2;

export function jacobianColumns(
  model: (theta: readonly number[]) => Float64Array,
  theta: readonly number[],
  centre: Float64Array,
): Float64Array[] {
  return theta.map((_, j) => {
    const at = (delta: number): Float64Array | null => {
      const shifted = [...theta];
      shifted[j] = shifted[j]! + delta;
      try {
        const values = model(shifted);
        return values.every(Number.isFinite) ? values : null;
      } catch {
        return null;
      }
    };
    const plus = at(JACOBIAN_STEP);
    const minus = at(-JACOBIAN_STEP);
    const column = new Float64Array(centre.length);
    for (let i = 0; i < centre.length; i++) {
      if (plus && minus) column[i] = (plus[i]! - minus[i]!) / (2 * JACOBIAN_STEP);
      else if (plus) column[i] = (plus[i]! - centre[i]!) / JACOBIAN_STEP;
      else if (minus) column[i] = (centre[i]! - minus[i]!) / JACOBIAN_STEP;
    }
    return column;
  });
}
