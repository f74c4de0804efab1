import { describe, expect, it } from 'vitest';
import { summariseExtraction } from '../../generator/brew/extraction.ts';

// Closed-form cases: a cup whose extraction temperature rises linearly with volume has a
// uniform distribution, so mean = median = midpoint and quantiles are linear.
describe('summariseExtraction (closed-form uniform distributions)', () => {
  const ramp = [
    { cupM3: 0, extractionK: 330 },
    { cupM3: 50e-6, extractionK: 345 },
    { cupM3: 100e-6, extractionK: 360 },
  ];

  it('summariseExtraction(linear ramp 330→360 K) has mean and median 345 K', () => {
    const s = summariseExtraction(ramp, [350, 370])!;
    expect(s.meanK).toBeCloseTo(345, 9);
    expect(s.p50K).toBeCloseTo(345, 5);
    expect(s.p10K).toBeCloseTo(333, 5);
    expect(s.p90K).toBeCloseTo(357, 5);
  });

  it('summariseExtraction(linear ramp) puts one third inside a band covering the top 10 K', () => {
    const s = summariseExtraction(ramp, [350, 370])!;
    expect(s.inBandShare).toBeCloseTo(1 / 3, 9);
    expect(s.belowBandShare).toBeCloseTo(2 / 3, 9);
  });

  it('summariseExtraction handles a falling tail (after the heat is off) by volume, not order', () => {
    // Rise 340→360 over 60 mL, then fall back to 350 over 20 mL: 25 % of the cup ≥ 355 K.
    const s = summariseExtraction(
      [
        { cupM3: 0, extractionK: 340 },
        { cupM3: 60e-6, extractionK: 360 },
        { cupM3: 80e-6, extractionK: 350 },
      ],
      [355, 400],
    )!;
    // Rising part above 355: 15 mL; falling part above 355: 10 mL → 25/80.
    expect(s.inBandShare).toBeCloseTo(25 / 80, 9);
  });

  it('summariseExtraction of an empty cup is null', () => {
    expect(summariseExtraction([], [360, 370])).toBeNull();
    expect(summariseExtraction([{ cupM3: 0, extractionK: 350 }], [360, 370])).toBeNull();
  });
});
