/**
 * The little dense linear algebra a calibration needs (a handful of parameters): the normal
 * matrix JᵀJ, its inverse by Cholesky, and a column-pivoted Gram–Schmidt that ranks the
 * columns of J by how much independent information each carries (Golub & Van Loan, Matrix
 * Computations, 4th ed., §5.4.2, QR with column pivoting). J is stored as columns: J[j][i]
 * is ∂(residual i)/∂(parameter j).
 */

export type Columns = readonly (readonly number[] | Float64Array)[];

/** Euclidean norm of a vector. */
export function norm(v: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < v.length; i++) sum += v[i]! * v[i]!;
  return Math.sqrt(sum);
}

/** JᵀJ, p × p, for J given as p columns. */
export function normalMatrix(columns: Columns): number[][] {
  return columns.map((a) => columns.map((b) => dot(a, b)));
}

function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += a[i]! * b[i]!;
  return sum;
}

/**
 * Inverse of a symmetric positive-definite matrix by Cholesky, A = L·Lᵀ; null when A is not
 * positive definite (a pivot ≤ 1e-12 of the largest diagonal entry: numerically singular).
 * Worked value: [[4, 2], [2, 3]]⁻¹ = [[0.375, −0.25], [−0.25, 0.5]].
 */
export function inverseSpd(a: readonly (readonly number[])[]): number[][] | null {
  const n = a.length;
  const largest = Math.max(...a.map((row, i) => Math.abs(row[i]!)), 0);
  const l = a.map(() => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    let diagonal = a[j]![j]!;
    for (let k = 0; k < j; k++) diagonal -= l[j]![k]! ** 2;
    if (!(diagonal > 1e-12 * largest)) return null;
    l[j]![j] = Math.sqrt(diagonal);
    for (let i = j + 1; i < n; i++) {
      let sum = a[i]![j]!;
      for (let k = 0; k < j; k++) sum -= l[i]![k]! * l[j]![k]!;
      l[i]![j] = sum / l[j]![j]!;
    }
  }
  // A⁻¹ = L⁻ᵀ·L⁻¹: solve L·Lᵀ·x = e_k for each unit vector.
  const inverse = a.map(() => new Array<number>(n).fill(0));
  for (let k = 0; k < n; k++) {
    const y = new Array<number>(n).fill(0);
    for (let i = 0; i < n; i++) {
      let sum = i === k ? 1 : 0;
      for (let m = 0; m < i; m++) sum -= l[i]![m]! * y[m]!;
      y[i] = sum / l[i]![i]!;
    }
    for (let i = n - 1; i >= 0; i--) {
      let sum = y[i]!;
      for (let m = i + 1; m < n; m++) sum -= l[m]![i]! * inverse[m]![k]!;
      inverse[i]![k] = sum / l[i]![i]!;
    }
  }
  return inverse;
}

/**
 * Column-pivoted Gram–Schmidt: at each step takes the column with the largest norm left
 * after removing its components along the columns already taken. Returns the indices in
 * the order taken and, for each, the norm it had left when taken. Stops after `limit`
 * columns or when no column has more than `floor` left.
 * Worked value: columns [1, 0], [1, 1e-9], [0, 2] → order [2, 0] (norms left 2 and 1); column
 * 1 has nothing left once column 0 is taken, so it is not.
 */
export function pivotedColumns(
  columns: Columns,
  limit: number,
  floor: number,
): { index: number; leftNorm: number }[] {
  const work = columns.map((c) => Float64Array.from(c));
  const taken: { index: number; leftNorm: number }[] = [];
  const remaining = new Set(work.map((_, i) => i));
  while (taken.length < limit && remaining.size > 0) {
    let best = -1;
    let bestNorm = floor;
    for (const j of remaining) {
      const n = norm(work[j]!);
      if (n > bestNorm) {
        best = j;
        bestNorm = n;
      }
    }
    if (best < 0) break;
    remaining.delete(best);
    taken.push({ index: best, leftNorm: bestNorm });
    const q = work[best]!.map((x) => x / bestNorm);
    for (const j of remaining) {
      const w = work[j]!;
      const projection = dot(q, w);
      for (let i = 0; i < w.length; i++) w[i] = w[i]! - projection * q[i]!;
    }
  }
  return taken;
}
