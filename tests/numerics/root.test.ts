import { describe, expect, it } from 'vitest';
import { locateSignChange } from '../../generator/numerics/root.ts';

function expectWithin(actual: number, expected: number, tolerance: number, label: string): void {
  expect(
    Math.abs(actual - expected),
    `${label}: actual ${actual}, expected ${expected}, tolerance ${tolerance}`,
  ).toBeLessThanOrEqual(tolerance);
}

describe('locateSignChange (Illinois regula falsi, Dowell & Jarratt 1971)', () => {
  // closed form: cos t = 0 at π/2
  it('locateSignChange(cos, [1, 2], tol 1e-12) brackets π/2 with the new sign on the right', () => {
    const r = locateSignChange(Math.cos, 1, Math.cos(1), 2, Math.cos(2), 1e-12);
    expectWithin(r.right, Math.PI / 2, 1e-12, 'right end vs π/2');
    expect(r.right - r.left, 'bracket width vs 1e-12').toBeLessThanOrEqual(1e-12);
    expect(Math.cos(r.left), `cos(left = ${r.left}) keeps the old sign`).toBeGreaterThan(0);
    expect(Math.cos(r.right), `cos(right = ${r.right}) has the new sign`).toBeLessThanOrEqual(0);
    expect(r.evaluations, 'evaluations').toBeLessThanOrEqual(12);
  });

  // closed form: t¹⁰ = 0.5 at t = 0.5^(1/10)
  it('locateSignChange(t¹⁰ − 0.5, [0, 1.5]) does not stall where plain regula falsi would', () => {
    // Convex on the bracket: plain regula falsi keeps the right end forever and converges
    // linearly; the Illinois halving and the inner margin close the bracket from both sides.
    const g = (t: number): number => t ** 10 - 0.5;
    const r = locateSignChange(g, 0, g(0), 1.5, g(1.5), 1e-12);
    const root = 0.5 ** 0.1;
    expect(r.right - r.left, 'bracket width vs 1e-12').toBeLessThanOrEqual(1e-12);
    expect(r.left <= root && root <= r.right, `[${r.left}, ${r.right}] ∋ ${root}`).toBe(true);
    expect(r.evaluations, 'evaluations (bisection alone needs 41)').toBeLessThanOrEqual(40);
  });

  // closed form: t − 0.25 = 0 at 0.25
  it('locateSignChange(t − 0.25, [0, 1]) stops at an exact zero', () => {
    const g = (t: number): number => t - 0.25;
    const r = locateSignChange(g, 0, g(0), 1, g(1), 1e-12);
    expect(r, 'secant lands on 0.25 exactly').toEqual({ left: 0.25, right: 0.25, evaluations: 1 });
  });

  // closed form: 1/3 − t = 0 at 1/3
  it('locateSignChange(1/3 − t, tol 1e-300) terminates at a few ulp', () => {
    const g = (t: number): number => 1 / 3 - t;
    const r = locateSignChange(g, 0, g(0), 1, g(1), 1e-300);
    expect(r.right - r.left, 'width vs 4 ulp of 1').toBeLessThanOrEqual(4 * Number.EPSILON);
    expect(g(r.right), `g(right = ${r.right}) has the new sign`).toBeLessThanOrEqual(0);
    expect(g(r.left), `g(left = ${r.left}) keeps the old sign`).toBeGreaterThan(0);
  });

  // own rule: a NaN inside the bracket counts as the old sign (our contract)
  it('locateSignChange(g NaN inside the bracket) terminates, NaN counting as the old sign', () => {
    const g = (t: number): number => (t > 0 && t < 1 ? NaN : t - 0.5);
    const r = locateSignChange(g, 0, -0.5, 1, 0.5, 1e-9);
    expect(r.right, 'right end stays where the new sign was seen').toBe(1);
    expect(r.right - r.left, 'bracket width vs 1e-9').toBeLessThanOrEqual(1e-9);
    expect(r.evaluations, 'evaluations').toBeLessThanOrEqual(200);
  });
});
