import { describe, expect, it } from 'vitest';
import * as T from '../../generator/numerics/dormand-prince-tableau.ts';

// Checks the coefficients against the Runge–Kutta order conditions (Butcher; Hairer, Nørsett &
// Wanner, Solving ODEs I, §II.2, Theorem 2.13): for every rooted tree t of order ≤ p,
// Σᵢ bᵢ·Φᵢ(t) = 1/γ(t); for a continuous extension of order p* (ibid. §II.6),
// Σᵢ bᵢ(θ)·Φᵢ(t) = θ^|t|/γ(t). These are closed-form values, not the code's own output.

type Tree = readonly Tree[]; // a node is the list of its children; [] is a leaf
const leaf: Tree = [];
/** All 17 rooted trees of order 1…5, written as nested child lists. */
const TREES: readonly Tree[] = [
  leaf,
  [leaf],
  [leaf, leaf],
  [[leaf]],
  [leaf, leaf, leaf],
  [leaf, [leaf]],
  [[leaf, leaf]],
  [[[leaf]]],
  [leaf, leaf, leaf, leaf],
  [leaf, leaf, [leaf]],
  [leaf, [leaf, leaf]],
  [leaf, [[leaf]]],
  [[leaf], [leaf]],
  [[leaf, leaf, leaf]],
  [[leaf, [leaf]]],
  [[[leaf, leaf]]],
  [[[[leaf]]]],
];

const c = [0, T.C2, T.C3, T.C4, T.C5, 1, 1];
const a: readonly (readonly number[])[] = [
  [],
  [T.A21],
  [T.A31, T.A32],
  [T.A41, T.A42, T.A43],
  [T.A51, T.A52, T.A53, T.A54],
  [T.A61, T.A62, T.A63, T.A64, T.A65],
  [T.B1, 0, T.B3, T.B4, T.B5, T.B6],
];
const b = [T.B1, 0, T.B3, T.B4, T.B5, T.B6, 0];
const bHat = [T.BHAT1, 0, T.BHAT3, T.BHAT4, T.BHAT5, T.BHAT6, T.BHAT7];
const e = [T.E1, 0, T.E3, T.E4, T.E5, T.E6, T.E7];
const d = [T.D1, 0, T.D3, T.D4, T.D5, T.D6, T.D7];

const order = (t: Tree): number => 1 + t.reduce((s, child) => s + order(child), 0);
const gamma = (t: Tree): number => order(t) * t.reduce((p, child) => p * gamma(child), 1);
/** Φᵢ(t) at stage i: the product over the root's children of Σⱼ aᵢⱼ Φⱼ(child). */
const phi = (t: Tree, i: number): number =>
  t.reduce((p, child) => {
    const row = a[i] ?? [];
    return p * row.reduce((s, aij, j) => s + aij * phi(child, j), 0);
  }, 1);
const weight = (w: readonly number[], t: Tree): number =>
  w.reduce((s, wi, i) => s + wi * phi(t, i), 0);

/** Weights bᵢ(θ) of the dense output y(θ) = y0 + h·Σ bᵢ(θ)kᵢ, read off the tableau header's r1…r5. */
const bTheta = (theta: number): number[] =>
  b.map((bi, i) => {
    const first = i === 0 ? 1 : 0;
    const seventh = i === 6 ? 1 : 0;
    const s = 1 - theta;
    return theta * (bi + s * (first - bi + theta * (2 * bi - first - seventh + s * (d[i] ?? 0))));
  });

const treeName = (t: Tree): string => (t.length === 0 ? 'τ' : `[${t.map(treeName).join(',')}]`);
const EXACT = 1e-14; // the coefficients are rationals in double precision; relative 1e-14 is rounding

function expectRational(actual: number, expected: number, label: string): void {
  const tol = EXACT * Math.max(1, Math.abs(expected));
  expect(
    Math.abs(actual - expected),
    `${label}: actual ${actual}, expected ${expected}, tolerance ${tol}`,
  ).toBeLessThanOrEqual(tol);
}

describe('DOPRI5 tableau (Dormand & Prince 1980, RK5(4)7M)', () => {
  it('rows of A sum to the nodes c (row 7 = b, c7 = 1)', () => {
    a.forEach((row, i) => {
      expectRational(
        row.reduce((s, x) => s + x, 0),
        c[i]!,
        `Σⱼ a${i + 1}ⱼ`,
      );
    });
  });
  it('b satisfies all 17 order conditions of order ≤ 5', () => {
    for (const t of TREES) expectRational(weight(b, t), 1 / gamma(t), `Σ bΦ(${treeName(t)})`);
  });
  it('b̂ satisfies the 8 order conditions of order ≤ 4 and misses one of order 5', () => {
    for (const t of TREES.filter((t) => order(t) <= 4)) {
      expectRational(weight(bHat, t), 1 / gamma(t), `Σ b̂Φ(${treeName(t)})`);
    }
    const misses = TREES.filter((t) => order(t) === 5).map((t) =>
      Math.abs(weight(bHat, t) - 1 / gamma(t)),
    );
    expect(Math.max(...misses), 'largest order-5 defect of b̂').toBeGreaterThan(1e-6);
  });
  it('E = b − b̂ as printed in DOPRI5', () => {
    e.forEach((ei, i) => expectRational(ei, b[i]! - bHat[i]!, `E${i + 1}`));
  });
});

describe('DOPRI5 dense output (HNW §II.6, CONTD5 coefficients)', () => {
  it.each([0.1, 0.25, 0.5, 0.8, 1])(
    'bᵢ(θ = %s) satisfy the 8 order conditions of order ≤ 4',
    (theta) => {
      const w = bTheta(theta);
      for (const t of TREES.filter((t) => order(t) <= 4)) {
        expectRational(
          weight(w, t),
          theta ** order(t) / gamma(t),
          `Σ bᵢ(${theta})Φ(${treeName(t)})`,
        );
      }
    },
  );
  it('bᵢ(1) = bᵢ: the interpolant ends at the step result', () => {
    bTheta(1).forEach((wi, i) => expectRational(wi, b[i]!, `b${i + 1}(1)`));
  });
});
