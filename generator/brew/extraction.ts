/**
 * The volume-weighted distribution of extraction temperature over the cup.
 *
 * The cup curve is a list of (cumulative cup volume, extraction temperature) points in
 * ascending volume; between points the temperature is taken as linear in volume. The
 * distribution F(x) = (volume extracted at or below x) / (cup volume) is then piecewise
 * linear in x on each segment, which gives the mean, percentiles and band share exactly
 * for that curve.
 */
import type { ExtractionSummary } from './types.ts';

export interface CupPoint {
  readonly cupM3: number;
  readonly extractionK: number;
}

export function summariseExtraction(
  curve: readonly CupPoint[],
  bandK: readonly [number, number],
): ExtractionSummary | null {
  const total = curve.length > 0 ? curve[curve.length - 1]!.cupM3 - curve[0]!.cupM3 : 0;
  if (curve.length < 2 || !(total > 0)) return null;
  let weighted = 0;
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1]!,
      b = curve[i]!;
    weighted += ((a.extractionK + b.extractionK) / 2) * (b.cupM3 - a.cupM3);
  }
  const cdf = (x: number): number => volumeAtOrBelow(curve, x) / total;
  const [low, high] = bandK;
  const below = cdf(low);
  const temperatures = curve.map((p) => p.extractionK).sort((a, b) => a - b);
  return {
    meanK: weighted / total,
    p10K: quantile(temperatures, cdf, 0.1),
    p50K: quantile(temperatures, cdf, 0.5),
    p90K: quantile(temperatures, cdf, 0.9),
    inBandShare: Math.max(0, cdf(high) - below),
    belowBandShare: below,
  };
}

/** Volume of the cup extracted at a temperature ≤ x. */
function volumeAtOrBelow(curve: readonly CupPoint[], x: number): number {
  let v = 0;
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1]!,
      b = curve[i]!;
    const dv = b.cupM3 - a.cupM3;
    const lo = Math.min(a.extractionK, b.extractionK);
    const hi = Math.max(a.extractionK, b.extractionK);
    if (x >= hi) v += dv;
    else if (x > lo) v += (dv * (x - lo)) / (hi - lo);
  }
  return v;
}

/**
 * Smallest x with F(x) ≥ q, from the curve's temperatures in ascending order `xs`. F is
 * linear between consecutive ones, so a binary search finds the piece and the piece gives
 * x exactly.
 */
function quantile(xs: readonly number[], cdf: (x: number) => number, q: number): number {
  let lo = 0;
  let hi = xs.length - 1;
  if (cdf(xs[0]!) >= q) return xs[0]!;
  // Invariant: F(xs[lo]) < q ≤ F(xs[hi]) (F(max) = 1 ≥ q).
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (cdf(xs[mid]!) >= q) hi = mid;
    else lo = mid;
  }
  const a = xs[lo]!,
    b = xs[hi]!;
  const fa = cdf(a),
    fb = cdf(b);
  return fb > fa ? a + ((q - fa) / (fb - fa)) * (b - a) : b;
}
