import { describe, expect, it } from 'vitest';
import { leastSquares } from '../../generator/calibration/least-squares.ts';
import { expectRelative } from '../helpers/close.ts';

describe('leastSquares (ml-levenberg-marquardt, one iteration at a time, in ln θ)', () => {
  it('finds the closed-form linear regression a·x + b through noisy points', () => {
    const x = [0, 1, 2, 3, 4, 5];
    const y = [1.1, 2.9, 5.2, 6.8, 9.1, 11.0];
    // Closed form: a = Σ(x − x̄)(y − ȳ)/Σ(x − x̄)², b = ȳ − a·x̄.
    const xm = x.reduce((s, v) => s + v, 0) / x.length;
    const ym = y.reduce((s, v) => s + v, 0) / y.length;
    const a =
      x.reduce((s, v, i) => s + (v - xm) * (y[i]! - ym), 0) /
      x.reduce((s, v) => s + (v - xm) ** 2, 0);
    const b = ym - a * xm;
    const result = leastSquares({
      data: Float64Array.from(y),
      model: ([lnA, lnB]) => Float64Array.from(x, (v) => Math.exp(lnA!) * v + Math.exp(lnB!)),
      start: [0, 0],
      lower: [-10, -10],
      upper: [10, 10],
    });
    expect(result.converged).toBe(true);
    expectRelative(Math.exp(result.theta[0]!), a, 1e-5, 'slope');
    expectRelative(Math.exp(result.theta[1]!), b, 1e-4, 'intercept');
  });

  // closed form: exact points of 5·exp(−t/τ) give back τ = 7
  it('recovers an exponential decay 5·exp(−t/τ), τ = 7, from exact points', () => {
    const t = [0, 2, 4, 6, 8, 10, 12];
    const result = leastSquares({
      data: Float64Array.from(t, (v) => 5 * Math.exp(-v / 7)),
      model: ([lnA, lnTau]) =>
        Float64Array.from(t, (v) => Math.exp(lnA!) * Math.exp(-v / Math.exp(lnTau!))),
      start: [Math.log(2), Math.log(3)],
      lower: [-10, -10],
      upper: [10, 10],
    });
    expectRelative(Math.exp(result.theta[1]!), 7, 1e-5, 'τ');
    expectRelative(Math.exp(result.theta[0]!), 5, 1e-5, 'amplitude');
  });

  // closed form: one parameter, one observation
  it('fits one parameter to one observation', () => {
    const result = leastSquares({
      data: Float64Array.of(3),
      model: ([lnV]) => Float64Array.of(Math.exp(lnV!)),
      start: [0],
      lower: [-5],
      upper: [5],
    });
    expectRelative(Math.exp(result.theta[0]!), 3, 1e-6, 'single value');
  });

  // own rule: a model that throws is a rejected step, not an outside value
  it('treats a model that throws as a rejected step, not a crash', () => {
    const result = leastSquares({
      data: Float64Array.of(1, 2),
      model: ([lnV]) => {
        if (lnV! > 1) throw new Error('out of range');
        return Float64Array.of(Math.exp(lnV!), 2 * Math.exp(lnV!));
      },
      start: [-3],
      lower: [-5],
      upper: [5],
    });
    expectRelative(Math.exp(result.theta[0]!), 1, 1e-5, 'value below the failing region');
  });
});
